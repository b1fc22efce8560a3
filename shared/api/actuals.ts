import { z } from 'zod';
import type { Role } from '../auth/roles';
import type { JobComparison } from '../reports/estimate-vs-actual';
import type { EstimatorError, InstallerRate, ReportTotals, ShapeRate } from '../reports/report-summary';
import type { Suggestions } from '../reports/suggestions';
import { extraKindSchema } from './settings';

const noRepeats =
  <T>(key: (x: T) => string, what: string) =>
  (list: T[], ctx: z.RefinementCtx) => {
    const seen = new Set<string>();
    list.forEach((x, i) => {
      if (seen.has(key(x))) ctx.addIssue({ code: 'custom', path: [i], message: `${what} is listed twice` });
      seen.add(key(x));
    });
  };

/**
 * What was really used on site, sent with `POST /api/jobs/:id/finish`. Rolls: `used` went into the
 * loft (opened), `returned` came back unopened. Hours are per installer on site. Every part is
 * optional; the company's settings say which must be there.
 */
export const actualsBodySchema = z.object({
  rolls: z
    .array(
      z.object({
        productId: z.string().trim().min(1, { error: 'choose the product' }).max(100),
        used: z.number({ error: 'enter the rolls used' }).int({ error: 'whole rolls' }).min(0).max(500),
        returned: z.number({ error: 'enter the rolls brought back' }).int({ error: 'whole rolls' }).min(0).max(500).default(0),
      }),
    )
    .max(50)
    .superRefine(noRepeats((r) => r.productId, 'a product'))
    .default([]),
  hours: z
    .array(
      z.object({
        userId: z.uuid({ error: 'choose the installer' }),
        hours: z.number({ error: 'enter the hours on site' }).min(0).max(100, { error: 'at most 100 hours' }),
      }),
    )
    .max(20)
    .superRefine(noRepeats((h) => h.userId, 'an installer'))
    .default([]),
  extras: z
    .array(z.object({ code: extraKindSchema, used: z.number({ error: 'enter the quantity used' }).min(0).max(10_000) }))
    .max(50)
    .superRefine(noRepeats((x) => x.code, 'an extra'))
    .default([]),
});
export type ActualsBody = z.input<typeof actualsBodySchema>;
export type Actuals = z.infer<typeof actualsBodySchema>;

/**
 * `PUT /api/jobs/:id/actuals`: corrects what was used on a finished job. `expectedVersion` is the
 * version read before editing (0 when nothing was recorded on finishing); if someone else saved a
 * correction since, the answer is 409 `actuals_changed` and nothing is written.
 */
export const editActualsBodySchema = z.object({
  actuals: actualsBodySchema,
  expectedVersion: z.number({ error: 'expectedVersion: the version you edited' }).int().min(0),
});
export type EditActualsBody = z.input<typeof editActualsBodySchema>;

/**
 * Who may correct the actuals of a finished job: the office while it is installed or closed (it
 * answers for the books); the job's installer while it is installed and not yet invoiced (counting
 * the van the next morning), after which it is the office's to correct.
 */
export function mayEditActuals(role: Role, job: { stage: string; invoiced: boolean }): boolean {
  if (role === 'office') return job.stage === 'installed' || job.stage === 'closed';
  if (role === 'installer') return job.stage === 'installed' && !job.invoiced;
  return false;
}

/** The actuals as stored: what was recorded, its version (0: none), who recorded and who last corrected them. */
export type StoredActuals = Actuals & {
  version: number;
  recorded: { by: string; at: string } | null;
  edited: { by: string; at: string } | null;
};

/** A job's estimate against actual as the office job page shows it; `comparison` null until the job is finished. */
export type JobEstimateVsActual = {
  finished: boolean;
  currency: string;
  recorded: { by: string; at: string } | null;
  comparison: JobComparison | null;
  /** What is stored, for editing (null until the job is finished). */
  actuals: StoredActuals | null;
  /** Whether the signed-in user may correct them now (mayEditActuals). */
  editable: boolean;
};

/** `GET /api/reports/estimate-vs-actual?from=&to=`: finished dates, inclusive. */
export const reportQuerySchema = z
  .object({
    from: z.iso.date({ error: 'from: use a date like 2026-01-31' }),
    to: z.iso.date({ error: 'to: use a date like 2026-12-31' }),
    last: z.coerce.number().int().min(1).max(200).default(20),
  })
  .refine((q) => q.from <= q.to, { path: ['to'], message: 'to must not be before from' });
export type ReportQuery = z.input<typeof reportQuerySchema>;

/** One job row of the report: the names the API promises plus the comparison the page draws. */
export type ReportRow = JobComparison;

export type EstimateVsActualReport = {
  from: string;
  to: string;
  currency: string;
  rows: ReportRow[];
  summary: ReportTotals & {
    suggestedWasteAllowancePct: number | null;
    suggestions: Suggestions;
    byInstaller: InstallerRate[];
    byShape: ShapeRate[];
    byEstimator: EstimatorError[];
    furthestOff: string[];
  };
};

/** `POST /api/reports/suggestions/apply`: applies the suggestion shown, if it is still the current one. */
export const applySuggestionBodySchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('waste-allowance'), last: z.number().int().min(1).max(200).default(20), expectedPct: z.number().min(0).max(100) }),
  z.object({
    kind: z.literal('laying-rates'),
    last: z.number().int().min(1).max(200).default(20),
    expected: z.object({ baseM2PerHour: z.number().positive().max(200), crossM2PerHour: z.number().positive().max(200) }),
  }),
]);
export type ApplySuggestionBody = z.input<typeof applySuggestionBodySchema>;

/** One recorded change of a company setting (who, when, from what to what). */
export type SettingsChange = { id: string; setting: string; oldValue: unknown; newValue: unknown; note: string; by: string; at: string };
