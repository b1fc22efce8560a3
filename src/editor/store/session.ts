import type { ExclusionKind } from '../../../shared/plan/plan-schema';
import type { Camera } from '../geometry/coords';

export const STEPS = ['outline', 'joists', 'exclusions', 'eaves', 'layers', 'review'] as const;
export type StepId = (typeof STEPS)[number];

export type Selection = { kind: 'corner'; index: number } | { kind: 'edge'; index: number } | { kind: 'exclusion'; index: number } | { kind: 'joists' } | null;

/** A shape being drawn: points placed so far (mm) and the snapped cursor, if any. */
export type Draft = {
  kind: 'outline' | 'exclusion-polygon' | 'exclusion-rect' | 'calibrate';
  points: [number, number][];
  cursor: [number, number] | null;
};

export type Units = 'metric' | 'imperial';

/** Everything the editor knows that is not the plan: never saved, never undone. */
export type Session = {
  step: StepId;
  selection: Selection;
  hover: Selection;
  camera: Camera;
  viewport: { width: number; height: number };
  draft: Draft | null;
  exclusionKind: ExclusionKind;
  exclusionShape: 'rect' | 'polygon';
  units: Units;
  /** The last command's refusal, shown until the next successful change. */
  error: string | null;
  /** When a calibration has two points, the UI asks for the real distance. */
  calibration: { a: [number, number]; b: [number, number] } | null;
  helpOpen: boolean;
};

export function initialSession(): Session {
  return {
    step: 'outline',
    selection: null,
    hover: null,
    camera: { zoom: 0.08, panX: 60, panY: 60 },
    viewport: { width: 800, height: 600 },
    draft: null,
    exclusionKind: 'hatch',
    exclusionShape: 'rect',
    units: 'metric',
    error: null,
    calibration: null,
    helpOpen: false,
  };
}
