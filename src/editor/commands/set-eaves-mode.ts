import { EAVES_MODES, type EavesMode, type Plan } from '../../../shared/plan/plan-schema';
import { CommandError } from './command';

/** Sets how the eaves air path is kept open for this plan; `undefined` goes back to the company default. */
export function setEavesMode(plan: Plan, args: { mode: EavesMode | undefined }): Plan {
  if (args.mode !== undefined && !EAVES_MODES.includes(args.mode)) throw new CommandError(`eaves: "${String(args.mode)}" is neither gap nor ventilators`);
  const { eavesMode: _old, ...rest } = plan;
  return args.mode ? { ...rest, eavesMode: args.mode } : rest;
}
