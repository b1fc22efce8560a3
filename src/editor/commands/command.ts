import type { Plan } from '../../../shared/plan/plan-schema';

/** A pure change to a plan: the editor's only way to change the document. */
export type PlanCommand = {
  /** Short verb phrase shown in the history ("move corner 3"). */
  readonly label: string;
  readonly apply: (plan: Plan) => Plan;
};

/** Thrown by a command given arguments it cannot apply; the editor shows the message. */
export class CommandError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'CommandError';
  }
}

/** Binds a pure `(plan, args) => plan` function to its arguments as a dispatchable command. */
export function cmd<A>(label: string, fn: (plan: Plan, args: A) => Plan, args: A): PlanCommand {
  return { label, apply: (plan) => fn(plan, args) };
}

export type Pt = [number, number];

export function checkIndex(n: number, length: number, what: string): void {
  if (!Number.isInteger(n) || n < 0 || n >= length) throw new CommandError(`there is no ${what} ${n + 1}`);
}

export function checkPoint(p: readonly number[], what = 'point'): Pt {
  if (p.length !== 2 || !Number.isFinite(p[0]) || !Number.isFinite(p[1])) {
    throw new CommandError(`the ${what} needs two finite coordinates in mm`);
  }
  return [p[0], p[1]];
}
