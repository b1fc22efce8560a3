import type { ExclusionKind } from '../../../shared/plan/plan-schema';

// The canvas draws with the app's one palette (shared/palette.ts, also the Tailwind theme's).
export { PALETTE } from '../../../shared/palette';

export const MONO = '"JetBrains Mono", ui-monospace, monospace';
export const SANS = 'Inter, system-ui, sans-serif';

/** How each kind of exclusion is hatched: line angles (degrees), spacing (px), outline dash. */
export type KindStyle = { angles: number[]; spacingPx: number; dash: number[]; letter: string; name: string };

export const KIND_STYLES: Record<ExclusionKind, KindStyle> = {
  hatch: { angles: [45], spacingPx: 8, dash: [], letter: 'H', name: 'Hatch' },
  tank: { angles: [45, -45], spacingPx: 9, dash: [], letter: 'T', name: 'Tank' },
  chimney: { angles: [45], spacingPx: 4, dash: [], letter: 'C', name: 'Chimney' },
  flue: { angles: [-45], spacingPx: 6, dash: [2, 3], letter: 'F', name: 'Flue' },
  boarded: { angles: [0], spacingPx: 7, dash: [], letter: 'B', name: 'Boarded' },
  downlight: { angles: [], spacingPx: 0, dash: [], letter: 'D', name: 'Downlight' },
  other: { angles: [-45], spacingPx: 12, dash: [6, 4], letter: '?', name: 'Other' },
};
