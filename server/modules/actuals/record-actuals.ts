import { Op, type Transaction } from 'sequelize';
import type { Actuals, StoredActuals } from '../../../shared/api/actuals';
import type { ActualsPart, ExtraRules } from '../../../shared/api/settings';
import { extrasFor } from '../../../shared/quote/extras';
import { spaceForQuote } from '../../../shared/quote/from-takeoff';
import type { Takeoff } from '../../../shared/takeoff/takeoff-types';
import { JobActual, Product, User } from '../../db/models';
import { fieldError, type ErrorDetail } from '../../lib/errors';
import type { SessionUser } from '../../types';

const REQUIRED_TEXT: Record<ActualsPart, string> = {
  rolls: 'record the rolls used and brought back (the company asks for them)',
  hours: 'record the hours on site (the company asks for them)',
  extras: 'record the extras used (the company asks for them)',
};

/**
 * The parts the company asks for that the finish leaves empty, as not-ready details (`actuals.rolls` …).
 * A part the job has nothing for (`applies` false: no extras in the van load) is not asked for, or
 * a job with no tank or hatch could never be finished where the company asks for extras.
 */
export function missingActuals(actuals: Actuals | undefined, required: readonly ActualsPart[], applies: Record<ActualsPart, boolean>): ErrorDetail[] {
  return required
    .filter((part) => applies[part] && (!actuals || actuals[part].length === 0))
    .map((part) => ({ path: `actuals.${part}`, message: REQUIRED_TEXT[part] }));
}

/** Which parts a job has anything to record for, as its van load lists them: rolls from its layers, extras from the company's rules. */
export function actualsApply(takeoffs: readonly Takeoff[], rules: ExtraRules): Record<ActualsPart, boolean> {
  return {
    rolls: takeoffs.some((t) => t.layers.length > 0),
    hours: true,
    extras:
      extrasFor(
        takeoffs.map((t) => spaceForQuote('', t)),
        rules,
      ).length > 0,
  };
}

/** A stored row as the API gives it (null when nothing was recorded); the row needs `recordedBy` and `editedBy` loaded. */
export function storedActualsOf(row: JobActual | null): StoredActuals | null {
  if (!row) return null;
  const who = (u: User | null | undefined) => u?.name ?? 'former user';
  return {
    rolls: row.rolls,
    hours: row.hours,
    extras: row.extras,
    version: row.version,
    recorded: { by: who(row.recordedBy), at: row.recordedAt.toISOString() },
    edited: row.editedAt ? { by: who(row.editedBy), at: row.editedAt.toISOString() } : null,
  };
}

/**
 * Refuses (422 naming the field) a roll for a product that is neither in the job's takeoffs nor
 * in the company catalogue, and hours for someone who is not in the company.
 */
export async function checkActualsRefs(user: SessionUser, actuals: Actuals, takeoffProductIds: ReadonlySet<string>, t: Transaction): Promise<void> {
  const unknownProducts = actuals.rolls.map((r) => r.productId).filter((id) => !takeoffProductIds.has(id));
  const uuid = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
  const known = unknownProducts.filter((id) => uuid.test(id)).length
    ? await Product.findAll({ where: { organisationId: user.organisationId, id: { [Op.in]: unknownProducts.filter((id) => uuid.test(id)) } }, transaction: t })
    : [];
  actuals.rolls.forEach((r, i) => {
    if (!takeoffProductIds.has(r.productId) && !known.some((p) => p.id === r.productId))
      throw fieldError(`actuals.rolls.${i}.productId`, 'that product is not on this job or in the catalogue');
  });
  const people = actuals.hours.length
    ? await User.findAll({ where: { organisationId: user.organisationId, id: { [Op.in]: actuals.hours.map((h) => h.userId) } }, transaction: t })
    : [];
  actuals.hours.forEach((h, i) => {
    if (!people.some((p) => p.id === h.userId)) throw fieldError(`actuals.hours.${i}.userId`, 'that person is not in the company');
  });
}

/** Stores the job's actuals in the finishing transaction; nothing when nothing was recorded. The job id is the key: one row per job. */
export async function storeActuals(user: SessionUser, jobId: string, actuals: Actuals | undefined, at: Date, t: Transaction): Promise<boolean> {
  if (!actuals || (actuals.rolls.length === 0 && actuals.hours.length === 0 && actuals.extras.length === 0)) return false;
  await JobActual.create(
    { jobId, organisationId: user.organisationId, rolls: actuals.rolls, hours: actuals.hours, extras: actuals.extras, recordedById: user.id, recordedAt: at },
    { transaction: t },
  );
  return true;
}
