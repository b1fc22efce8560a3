import { Op } from 'sequelize';
import type { AppDeps } from '../../deps';
import type {
  ApplySuggestionBody,
  EditActualsBody,
  EstimateVsActualReport,
  JobEstimateVsActual,
  ReportQuery,
  SettingsChange as ChangeDto,
} from '../../../shared/api/actuals';
import { applySuggestionBodySchema, editActualsBodySchema, mayEditActuals } from '../../../shared/api/actuals';
import { compareJob, type JobComparison } from '../../../shared/reports/estimate-vs-actual';
import { errorsByEstimator, furthestOff, ratesByInstaller, ratesByShape, reportTotals } from '../../../shared/reports/report-summary';
import { suggestSettings } from '../../../shared/reports/suggestions';
import { CompanySetting, JobActual, JobCompletion, SettingsChange, User } from '../../db/models';
import { ConflictError } from '../../lib/errors';
import type { SessionUser } from '../../types';
import { loadCatalogue } from '../catalogue/catalogue.service';
import { findJobFor } from '../jobs/job-access';
import { ensureCompanySettings, loadCompanySettings } from '../settings/settings.service';
import { editActuals, isInvoiced } from './edit-actuals';
import { finishedJobFacts } from './job-facts';
import { storedActualsOf } from './record-actuals';

const rates = (s: CompanySetting) => ({ baseM2PerHour: s.labour.baseM2PerHour, crossM2PerHour: s.labour.crossM2PerHour });

/** Estimate against actual for one job, the period report, and settings suggestions from finished jobs. */
export function createActualsService(deps: Pick<AppDeps, 'sequelize'>) {
  async function comparisons(organisationId: string, jobIds: string[]): Promise<{ rows: JobComparison[]; settings: CompanySetting }> {
    const [settings, catalogue] = await Promise.all([loadCompanySettings(organisationId), loadCatalogue(organisationId)]);
    const facts = await finishedJobFacts(organisationId, jobIds, settings, catalogue);
    return { rows: facts.map((f) => compareJob(f, rates(settings))), settings };
  }

  /** Jobs with actuals recorded, most recently finished first; the `limit` newest, or those finished in [from, to]. */
  async function finishedWithActuals(organisationId: string, range: { from?: string; to?: string; limit?: number }): Promise<string[]> {
    const withActuals = (await JobActual.findAll({ where: { organisationId }, attributes: ['jobId'] })).map((a) => a.jobId);
    if (withActuals.length === 0) return [];
    const where: Record<string | symbol, unknown> = { organisationId, jobId: { [Op.in]: withActuals } };
    if (range.from && range.to)
      where.completedAt = { [Op.gte]: new Date(`${range.from}T00:00:00Z`), [Op.lt]: new Date(Date.parse(`${range.to}T00:00:00Z`) + 86_400_000) };
    const done = await JobCompletion.findAll({ where, order: [['completedAt', 'DESC']], limit: range.limit, attributes: ['jobId'] });
    return done.map((c) => c.jobId);
  }

  async function suggestions(organisationId: string, last: number) {
    const { rows, settings } = await comparisons(organisationId, await finishedWithActuals(organisationId, { limit: last }));
    return suggestSettings(rows, { wasteAllowancePct: settings.wasteAllowance * 100, ...rates(settings) }, last);
  }

  return {
    async job(user: SessionUser, jobId: string): Promise<JobEstimateVsActual> {
      const job = await findJobFor(user, jobId);
      const actual = await JobActual.findByPk(job.id, {
        include: [
          { model: User, as: 'recordedBy' },
          { model: User, as: 'editedBy' },
        ],
      });
      const finished = (await JobCompletion.count({ where: { jobId: job.id } })) > 0;
      if (!finished)
        return {
          finished,
          currency: (await loadCompanySettings(user.organisationId)).currency,
          recorded: null,
          comparison: null,
          actuals: null,
          editable: false,
        };
      const { rows, settings } = await comparisons(user.organisationId, [job.id]);
      const stored = storedActualsOf(actual);
      return {
        finished,
        currency: settings.currency,
        recorded: stored?.recorded ?? null,
        comparison: rows[0] ?? null,
        actuals: stored ?? { rolls: [], hours: [], extras: [], version: 0, recorded: null, edited: null },
        editable: mayEditActuals(user.role, { stage: job.stage, invoiced: await isInvoiced(job.id) }),
      };
    },

    edit: (user: SessionUser, jobId: string, body: EditActualsBody) => editActuals(deps.sequelize, user, jobId, editActualsBodySchema.parse(body)),

    async report(user: SessionUser, q: Required<ReportQuery>): Promise<EstimateVsActualReport> {
      const ids = await finishedWithActuals(user.organisationId, { from: q.from, to: q.to });
      const { rows, settings } = await comparisons(user.organisationId, ids);
      const s = suggestSettings(rows, { wasteAllowancePct: settings.wasteAllowance * 100, ...rates(settings) }, Number(q.last));
      return {
        from: q.from,
        to: q.to,
        currency: settings.currency,
        rows,
        summary: {
          ...reportTotals(rows),
          suggestedWasteAllowancePct: s.waste?.suggestedPct ?? null,
          suggestions: s,
          byInstaller: ratesByInstaller(rows),
          byShape: ratesByShape(rows),
          byEstimator: errorsByEstimator(rows),
          furthestOff: furthestOff(rows).map((r) => r.jobId),
        },
      };
    },

    suggestions: (user: SessionUser, last: number) => suggestions(user.organisationId, last),

    /**
     * Applies a suggestion to the company settings, only if it is still what was shown (else 409
     * `suggestion_changed`), under a row lock on the settings; records who, when, from and to.
     */
    async apply(user: SessionUser, input: ApplySuggestionBody) {
      const body = applySuggestionBodySchema.parse(input);
      await ensureCompanySettings(user.organisationId);
      const now = await suggestions(user.organisationId, body.last);
      return deps.sequelize.transaction(async (t) => {
        const row = (await CompanySetting.findByPk(user.organisationId, { transaction: t, lock: t.LOCK.UPDATE }))!;
        if (body.kind === 'waste-allowance') {
          if (!now.waste || now.waste.suggestedPct !== body.expectedPct)
            throw new ConflictError('the suggestion has changed since it was shown: look at it again', 'suggestion_changed');
          const old = row.wasteAllowance;
          await row.update({ wasteAllowance: now.waste.suggestedPct / 100 }, { transaction: t });
          await SettingsChange.create(
            {
              organisationId: user.organisationId,
              userId: user.id,
              setting: 'wasteAllowance',
              oldValue: old,
              newValue: row.wasteAllowance,
              note: now.waste.note,
            },
            { transaction: t },
          );
        } else {
          const s = now.laying?.suggested;
          if (!s || s.baseM2PerHour !== body.expected.baseM2PerHour || s.crossM2PerHour !== body.expected.crossM2PerHour)
            throw new ConflictError('the suggestion has changed since it was shown: look at it again', 'suggestion_changed');
          const old = { baseM2PerHour: row.labour.baseM2PerHour, crossM2PerHour: row.labour.crossM2PerHour };
          await row.update({ labour: { ...row.labour, ...s } }, { transaction: t });
          await SettingsChange.create(
            { organisationId: user.organisationId, userId: user.id, setting: 'labour.layingRates', oldValue: old, newValue: s, note: now.laying!.note },
            { transaction: t },
          );
        }
        return { applied: body.kind };
      });
    },

    /** The settings changed from suggestions, newest first. */
    async history(user: SessionUser): Promise<ChangeDto[]> {
      const rows = await SettingsChange.findAll({
        where: { organisationId: user.organisationId },
        include: [{ model: User, as: 'user' }],
        order: [['createdAt', 'DESC']],
        limit: 50,
      });
      return rows.map((r) => ({
        id: r.id,
        setting: r.setting,
        oldValue: r.oldValue,
        newValue: r.newValue,
        note: r.note,
        by: r.user?.name ?? 'former user',
        at: r.createdAt.toISOString(),
      }));
    },
  };
}
export type ActualsService = ReturnType<typeof createActualsService>;
