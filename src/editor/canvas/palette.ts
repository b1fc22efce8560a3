import type { ExclusionKind } from '../../../shared/plan/plan-schema';

// The "site notebook" palette, the same values as tailwind.config.ts.
export const PALETTE = {
  paper: '#faf7f0',
  paperLine: '#e7e0cf',
  paperLineStrong: '#d8cfb8',
  graphite: '#33363b',
  graphiteLight: '#5b6068',
  graphiteFaint: '#9aa0a8',
  timber: '#8a5a2b',
  straw: '#e2b94b',
  strawLight: '#f3dc93',
  strawDark: '#a57e16',
  teal: '#1f8a84',
  tealLight: '#9fd6d1',
  tealDark: '#135e5a',
  brick: '#b0462f',
  brickLight: '#e8b4a6',
  sky: '#a9d4ef',
  skyLight: '#dceefa',
  skyDark: '#3d86b8',
  select: '#1f6fd1',
} as const;

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
