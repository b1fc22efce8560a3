import type { z } from 'zod';
import { PLAN_FORMAT, planSchema, type Plan } from './plan-schema';
import type { PlanMessage } from './plan-messages';
import { checkPlanGeometry } from './plan-geometry-checks';
import { checkPlanCounts } from './plan-limits';

export type { PlanMessage } from './plan-messages';

/** The outcome of `validatePlan`: a parsed plan with warnings, or the errors that stop it. */
export type ValidatePlanResult = { ok: true; plan: Plan; warnings: PlanMessage[] } | { ok: false; errors: PlanMessage[]; warnings: PlanMessage[] };

/**
 * Validates anything claiming to be a `quiltline-plan/1` plan: first the format (an unknown
 * format stops here with one message), then the sizes against `PLAN_LIMITS` (array lengths only,
 * before anything is parsed), then the zod schema (defaults filled in), then the
 * geometry (`checkPlanGeometry`). Every message has a stable `code` and, where it can, the
 * outline point, edge or exclusion it is about, so the editor can show it in place.
 */
export function validatePlan(input: unknown): ValidatePlanResult {
  const shape = validatePlanShape(input);
  if (!shape.ok) return shape;
  const { errors, warnings } = checkPlanGeometry(shape.plan);
  return errors.length ? { ok: false, errors, warnings } : { ok: true, plan: shape.plan, warnings };
}

/**
 * The first, cheap part of `validatePlan`: format, sizes and schema, without the geometry. Costs
 * about as much as reading the JSON (the sizes are bounded before parsing), so a server can refuse
 * most bad plans with it before doing any other work. Warnings are always empty.
 */
export function validatePlanShape(input: unknown): ValidatePlanResult {
  if (input === null || typeof input !== 'object' || Array.isArray(input)) {
    return { ok: false, errors: [{ code: 'plan.not-an-object', message: `a plan is a JSON object with "format": "${PLAN_FORMAT}"` }], warnings: [] };
  }
  const format = (input as { format?: unknown }).format;
  if (format !== PLAN_FORMAT) {
    const message =
      format === undefined
        ? `the file has no "format"; a plan starts with "format": "${PLAN_FORMAT}"`
        : `unknown plan format ${JSON.stringify(format)}: this version reads "${PLAN_FORMAT}"`;
    return { ok: false, errors: [{ code: 'format.unknown', message, path: 'format' }], warnings: [] };
  }
  // Sizes first, reading only array lengths: an oversized plan costs nothing to refuse.
  const tooBig = checkPlanCounts(input);
  if (tooBig.length) return { ok: false, errors: tooBig, warnings: [] };
  const parsed = planSchema.safeParse(input);
  if (!parsed.success) return { ok: false, errors: parsed.error.issues.map(issueToMessage), warnings: [] };
  return { ok: true, plan: parsed.data, warnings: [] };
}

function issueToMessage(issue: z.core.$ZodIssue): PlanMessage {
  const path = issue.path.map(String).join('.');
  const msg: PlanMessage = { code: `schema.${issue.code}`, message: path ? `${path}: ${issue.message}` : issue.message, path: path || undefined };
  const [root, index, sub, subIndex] = issue.path;
  if (root === 'outline' && typeof index === 'number') msg.pointIndex = index;
  if (root === 'exclusions' && typeof index === 'number') {
    msg.exclusionIndex = index;
    if (sub === 'polygon' && typeof subIndex === 'number') msg.pointIndex = subIndex;
  }
  if (root === 'eavesEdges' && typeof index === 'number') {
    const value = (issue as { input?: unknown }).input;
    if (typeof value === 'number') msg.edgeIndex = value;
  }
  if (!path) delete msg.path;
  return msg;
}
