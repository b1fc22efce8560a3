import { Op, type Sequelize, type Transaction } from 'sequelize';
import { planSchema, type Plan } from '../../../shared/plan/plan-schema';
import { parseProductCatalogue } from '../../../shared/takeoff/products';
import type { TakeoffSettings } from '../../../shared/takeoff/settings';
import { TAKEOFF_FORMAT, type Takeoff } from '../../../shared/takeoff/takeoff-types';
import { PlanRevision } from '../../db/models';
import { Extra } from '../../db/models/extra';
import { Product } from '../../db/models/product';
import { loadCompanySettings } from '../settings/settings.service';
import { computePlanTakeoff, type TakeoffInputs } from './compute-plan-takeoff';
import { insertRevision } from './revisions.repository';

export { computePlanTakeoff, type TakeoffInputs };

export type SettingsForTakeoff = {
  wasteAllowance: number;
  minOffcutMm?: number;
  degreeDays: number;
  fuelPriceMinorPerKwh: number;
  heatingEfficiency: number;
  eavesMode?: 'gap' | 'ventilators';
  hatchKitInsulationMm?: number;
};

/**
 * The company's settings as the takeoff reads them (the company keeps waste as a fraction; the
 * takeoff reads a percentage). The hatch lid is credited with the kit's insulation only when the
 * catalogue has an active hatch kit, the one the quote adds per hatch: no kit quoted, no credit.
 */
export function takeoffSettingsOf(settings: SettingsForTakeoff, catalogue: { hatchKitActive: boolean } = { hatchKitActive: false }): Partial<TakeoffSettings> {
  return {
    wasteAllowancePct: settings.wasteAllowance * 100,
    ...(settings.minOffcutMm !== undefined ? { minOffcutMm: settings.minOffcutMm } : {}),
    degreeDays: settings.degreeDays,
    fuelPriceMinorPerKwh: settings.fuelPriceMinorPerKwh,
    heatingEfficiency: settings.heatingEfficiency,
    ...(settings.eavesMode ? { eavesMode: settings.eavesMode } : {}),
    hatchInsulationMm: catalogue.hatchKitActive ? (settings.hatchKitInsulationMm ?? 0) : 0,
  };
}

/**
 * The one set of takeoff inputs of a company: its catalogue (inactive products left out) and its
 * settings. A company without products gets a takeoff without layers that says so; there is no
 * fallback catalogue (an active hatch kit is the one extra it reads, see takeoffSettingsOf). The editor receives the same inputs, so its live takeoff equals the stored one.
 */
export async function companyTakeoffInputs(organisationId: string, transaction?: Transaction): Promise<TakeoffInputs> {
  const [settingsRow, rows, hatchKits] = await Promise.all([
    loadCompanySettings(organisationId),
    Product.findAll({ where: { organisationId }, order: [['name', 'ASC']], transaction }),
    Extra.count({ where: { organisationId, kind: 'hatch_kit', active: true }, transaction }),
  ]);
  // parseProductCatalogue reads the catalogue's own field names (lanes, coverageM2, lambdaWmK…).
  const products = parseProductCatalogue(rows.map((r) => ({ ...r.get({ plain: true }), id: r.id })));
  return { products, settings: takeoffSettingsOf(settingsRow, { hatchKitActive: hatchKits > 0 }) };
}

/**
 * Stores a plan as the next revision of a space with its takeoff, however it is written (editor
 * save, restore, a new space with a plan, the demo data). See insertRevision for the conflict rule.
 */
export async function storePlanRevision(
  sequelize: Sequelize,
  row: { organisationId: string; spaceId: string; authorId: string | null; plan: Plan; note?: string; baseRevision?: number },
  opts: { transaction?: Transaction; inputs?: TakeoffInputs; takeoff?: Takeoff } = {},
): Promise<{ revision: PlanRevision; takeoff: Takeoff }> {
  // Request paths pass the takeoff the worker pool computed from these same inputs (computePlanTakeoff).
  const takeoff = opts.takeoff ?? computePlanTakeoff(row.plan, opts.inputs ?? (await companyTakeoffInputs(row.organisationId, opts.transaction)));
  const run = async (transaction: Transaction) => ({ revision: await insertRevision(transaction, { ...row, takeoff }), takeoff });
  return opts.transaction ? run(opts.transaction) : sequelize.transaction(run);
}

const STALE = { [Op.or]: [{ takeoff: null }, { takeoff: { format: { [Op.ne]: TAKEOFF_FORMAT } } }, { takeoff: { format: null } }] };

/**
 * Start-up backfill: every stored revision without a takeoff of the current format (written before
 * takeoffs were stored everywhere, or of an older format) gets one, computed from its own plan and
 * its company's inputs. A conditional UPDATE (still stale) keeps two starting servers from racing.
 * A plan that cannot be worked out keeps its takeoff as it is and is reported. Returns the counts.
 */
export async function backfillStoredTakeoffs(log: (line: string) => void = () => {}): Promise<{ updated: number; failed: number }> {
  const inputsByOrg = new Map<string, Promise<TakeoffInputs>>();
  let updated = 0;
  let failed = 0;
  let afterId: string | null = null;
  for (;;) {
    const batch: PlanRevision[] = await PlanRevision.findAll({
      where: { ...STALE, ...(afterId ? { id: { [Op.gt]: afterId } } : {}) } as never,
      attributes: ['id', 'organisationId', 'spaceId', 'revision', 'plan'],
      order: [['id', 'ASC']],
      limit: 50,
    });
    if (batch.length === 0) break;
    for (const row of batch) {
      try {
        if (!inputsByOrg.has(row.organisationId)) inputsByOrg.set(row.organisationId, companyTakeoffInputs(row.organisationId));
        const takeoff = computePlanTakeoff(planSchema.parse(row.plan), await inputsByOrg.get(row.organisationId)!);
        const [n] = await PlanRevision.update({ takeoff: takeoff as never }, { where: { id: row.id, ...STALE } as never });
        updated += n;
      } catch (e) {
        failed++;
        log(`revision ${row.revision} of space ${row.spaceId}: the takeoff could not be worked out (${(e as Error).message})`);
      }
    }
    afterId = batch[batch.length - 1].id;
  }
  return { updated, failed };
}
