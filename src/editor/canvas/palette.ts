import type { ExclusionKind } from '../../../shared/plan/plan-schema';

// The canvas draws with the app's one palette (shared/palette.ts, also the Tailwind theme's).
import { PALETTE } from '../../../shared/palette';
export { PALETTE };

export const MONO = '"JetBrains Mono", ui-monospace, monospace';
export const SANS = 'Inter, system-ui, sans-serif';

/**
 * How each kind of exclusion looks: its own ink and fill colour as well as its own hatch (line
 * angles in degrees, spacing in px) and outline dash, so no two kinds read alike at a glance even
 * in a small shape. Water blue for a tank, brick for heat (chimney, flue, downlight), timber for
 * boards, graphite for the hatch and other.
 */
export type KindStyle = { angles: number[]; spacingPx: number; dash: number[]; letter: string; name: string; ink: string; fill: string };

export const KIND_STYLES: Record<ExclusionKind, KindStyle> = {
  hatch: { angles: [45], spacingPx: 8, dash: [], letter: 'H', name: 'Hatch', ink: PALETTE.graphite, fill: PALETTE.paperDark },
  tank: { angles: [45, -45], spacingPx: 9, dash: [], letter: 'T', name: 'Tank', ink: PALETTE.skyDark, fill: PALETTE.skyLight },
  chimney: { angles: [45], spacingPx: 4, dash: [], letter: 'C', name: 'Chimney', ink: PALETTE.brickDark, fill: PALETTE.brickLight },
  flue: { angles: [-45], spacingPx: 6, dash: [2, 3], letter: 'F', name: 'Flue', ink: PALETTE.brick, fill: PALETTE.brickLight },
  boarded: { angles: [0], spacingPx: 7, dash: [], letter: 'B', name: 'Boarded', ink: PALETTE.timber, fill: PALETTE.timberLight },
  downlight: { angles: [], spacingPx: 0, dash: [], letter: 'D', name: 'Downlight', ink: PALETTE.brick, fill: PALETTE.brickLight },
  other: { angles: [-45], spacingPx: 12, dash: [6, 4], letter: '?', name: 'Other', ink: PALETTE.graphiteLight, fill: PALETTE.paperDark },
};
