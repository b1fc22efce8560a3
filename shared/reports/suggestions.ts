import type { JobComparison } from './estimate-vs-actual';

/** How much to trust a suggestion: by the number of jobs and how spread their values are. */
export type Confidence = 'low' | 'medium' | 'high';

/** The spread of the per-job values a suggestion rests on. */
export interface Spread {
  jobs: number;
  min: number;
  max: number;
  /** Population standard deviation, in the value's own unit. */
  sd: number;
}

export interface WasteSuggestion {
  currentPct: number;
  suggestedPct: number;
  spread: Spread;
  confidence: Confidence;
  note: string;
}

export interface LayingSuggestion {
  current: { baseM2PerHour: number; crossM2PerHour: number };
  suggested: { baseM2PerHour: number; crossM2PerHour: number };
  /** Median of actual laying hours over the hours the current rates give (> 1: slower than the rates). */
  factor: number;
  /** Spread of the per-job factors, as percent (1.1 → 110). */
  spread: Spread;
  confidence: Confidence;
  note: string;
}

export interface Suggestions {
  lastN: number;
  waste: WasteSuggestion | null;
  laying: LayingSuggestion | null;
  /** Why a suggestion is missing, when one is. */
  notes: string[];
}

/** Fewer finished jobs than this with actuals give no suggestion at all. */
export const MIN_JOBS_FOR_SUGGESTION = 3;

const round = (n: number, digits = 2) => Math.round(n * 10 ** digits) / 10 ** digits;

/** The median of a non-empty list (the mean of the middle two for an even count). */
export function median(xs: readonly number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** min, max and population standard deviation of a non-empty list. */
export function spreadOf(xs: readonly number[]): Spread {
  const mean = xs.reduce((a, b) => a + b, 0) / xs.length;
  const sd = Math.sqrt(xs.reduce((a, x) => a + (x - mean) ** 2, 0) / xs.length);
  return { jobs: xs.length, min: round(Math.min(...xs)), max: round(Math.max(...xs)), sd: round(sd) };
}

/**
 * Low under 5 jobs or when the values spread widely (sd above `wide`); high from 10 jobs with an sd
 * at most `tight`; medium otherwise. Thresholds are our judgement, not a standard.
 */
export function confidenceOf(s: Spread, tight: number, wide: number): Confidence {
  if (s.jobs < 5 || s.sd > wide) return 'low';
  if (s.jobs >= 10 && s.sd <= tight) return 'high';
  return 'medium';
}

/**
 * Waste allowance and laying rates recomputed from the `lastN` most recently finished jobs.
 * Waste: the median of each job's incurred waste (roll area used over area laid, less one), never
 * below 0 nor above 100, rounded up to 0.5 % — the median so one job with a spoilt roll does not move it.
 * Laying: the median factor of actual laying hours (hours on site less the extras' fitting time)
 * over what the current rates give; both rates are divided by it and rounded to 0.5 m²/h.
 */
export function suggestSettings(
  rows: readonly JobComparison[],
  current: { wasteAllowancePct: number; baseM2PerHour: number; crossM2PerHour: number },
  lastN = 20,
): Suggestions {
  const recent = [...rows].sort((a, b) => b.finishedAt.localeCompare(a.finishedAt) || a.reference.localeCompare(b.reference)).slice(0, lastN);
  const notes: string[] = [];
  const wastes = recent.flatMap((r) => (r.wasteIncurredPct === null ? [] : [r.wasteIncurredPct]));
  let waste: WasteSuggestion | null = null;
  if (wastes.length >= MIN_JOBS_FOR_SUGGESTION) {
    const spread = spreadOf(wastes);
    const suggestedPct = Math.min(100, Math.max(0, Math.ceil(round(median(wastes) * 2, 6)) / 2));
    waste = {
      currentPct: round(current.wasteAllowancePct),
      suggestedPct,
      spread,
      confidence: confidenceOf(spread, 2.5, 6),
      note: `From ${spread.jobs} finished jobs: waste ran ${spread.min}% to ${spread.max}% (standard deviation ${spread.sd} points).`,
    };
  } else notes.push(`Waste allowance: needs rolls recorded on at least ${MIN_JOBS_FOR_SUGGESTION} finished jobs (${wastes.length} so far).`);

  const factors = recent.flatMap((r) => (r.layingRateFactor === null ? [] : [r.layingRateFactor]));
  let laying: LayingSuggestion | null = null;
  if (factors.length >= MIN_JOBS_FOR_SUGGESTION) {
    const factor = round(median(factors), 4);
    const spread = spreadOf(factors.map((f) => f * 100));
    const rate = (r: number) => Math.max(0.5, Math.round((r / factor) * 2) / 2);
    laying = {
      current: { baseM2PerHour: current.baseM2PerHour, crossM2PerHour: current.crossM2PerHour },
      suggested: { baseM2PerHour: rate(current.baseM2PerHour), crossM2PerHour: rate(current.crossM2PerHour) },
      factor,
      spread,
      confidence: confidenceOf(spread, 10, 25),
      note: `From ${spread.jobs} finished jobs: laying took ${spread.min}% to ${spread.max}% of the time the rates give (standard deviation ${spread.sd} points).`,
    };
  } else notes.push(`Laying rates: needs hours recorded on at least ${MIN_JOBS_FOR_SUGGESTION} finished jobs (${factors.length} so far).`);
  return { lastN, waste, laying, notes };
}
