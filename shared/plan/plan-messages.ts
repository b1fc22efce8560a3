/**
 * A validation message the editor can place on the plan: `pointIndex` / `edgeIndex` name the
 * outline's point or edge (edge i runs from point i to point i+1), `exclusionIndex` an exclusion
 * (then `pointIndex` / `edgeIndex` are that exclusion's, when set), `at` a position in mm.
 * `path` is the dotted JSON path of the field (`outline.3`, `joists.centresMm`).
 */
export interface PlanMessage {
  code: string;
  message: string;
  path?: string;
  pointIndex?: number;
  edgeIndex?: number;
  /** For crossings: the other edge involved. */
  otherEdgeIndex?: number;
  exclusionIndex?: number;
  /** Where on the plan, mm. */
  at?: [number, number];
}

/** Errors stop the takeoff; warnings are shown beside it. */
export interface PlanCheckResult {
  errors: PlanMessage[];
  warnings: PlanMessage[];
}

/** Thrown by `computeTakeoff` when a plan fails the geometric checks; carries the messages. */
export class InvalidPlanError extends Error {
  readonly errors: PlanMessage[];
  constructor(errors: PlanMessage[]) {
    super(errors.length ? errors[0].message : 'invalid plan');
    this.name = 'InvalidPlanError';
    this.errors = errors;
  }
}
