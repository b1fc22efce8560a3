import type { Transaction } from 'sequelize';
import type { QuotePatch, QuoteSummary } from '../../../shared/api/quotes';
import { buildQuoteLines, type SpaceForQuote } from '../../../shared/quote/build-lines';
import { quoteCautions } from '../../../shared/quote/cautions';
import { computeQuoteTotals } from '../../../shared/quote/totals';
import type { ExclusionKind } from '../../../shared/plan/plan-schema';
import type { AppDeps } from '../../deps';
import { depositTerms } from '../../../shared/quote/deposit';
import { loadPaymentSettings } from '../settings/payment-settings';
import { Customer, Job, JobEvent } from '../../db/models';
import { latestRevisionsOfJobs } from '../plan-revisions/revisions.repository';
import { Quote } from '../../db/models/quote';
import { QuoteLine } from '../../db/models/quote-line';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../../lib/errors';
import type { SessionUser } from '../../types';
import { can } from '../../../shared/auth/policies';
import { loadCatalogue } from '../catalogue/catalogue.service';
import { ensureCompanySettings, loadCompanySettings, toSettingsDto } from '../settings/settings.service';
import { lineRows, priceQuote, snapshotOf, toQuoteDto, type QuoteSnapshot } from './quote-dto';
import { takeoffForSpace } from './takeoff-adapter';
import { jobRollsByProduct } from '../../../shared/takeoff/job-roll-plan';
import type { Takeoff } from '../../../shared/takeoff/takeoff-types';
import { addDaysIso, todayIso } from '../../../shared/dates';

export async function findJobInOrg(actor: { organisationId: string }, jobId: string, t?: Transaction): Promise<Job> {
  const job = await Job.findOne({ where: { id: jobId, organisationId: actor.organisationId }, include: [{ model: Customer, as: 'customer' }], transaction: t });
  if (!job) throw new NotFoundError('job');
  return job;
}

/** The company's quote; `lock` takes the row FOR UPDATE inside `t` (for guarded state changes). */
export async function findQuoteInOrg(actor: { organisationId: string }, id: string, t?: Transaction, opts: { lock?: boolean } = {}): Promise<Quote> {
  const q = await Quote.findOne({ where: { id, organisationId: actor.organisationId }, transaction: t, ...(t && opts.lock ? { lock: t.LOCK.UPDATE } : {}) });
  if (!q) throw new NotFoundError('quote');
  return q;
}

export async function linesOf(q: Quote, t?: Transaction): Promise<QuoteLine[]> {
  return QuoteLine.findAll({ where: { quoteId: q.id }, order: [['position', 'ASC']], transaction: t });
}

/** A sent quote past its valid-until day becomes `expired` the first time anyone looks at it. */
/**
 * A sent quote past its valid-until date reads as expired: derived on read, nothing is written
 * (a GET never writes). The stored status follows on the next write (`expireIfDue`).
 */
export function withDerivedStatus(q: Quote, today = todayIso()): Quote {
  if (q.status === 'sent' && q.validUntil < today) q.setDataValue('status', 'expired');
  return q;
}

/** Stores `expired` on a sent quote past its valid-until date, guarded on the status it expects; for write paths. */
export async function expireIfDue(q: Quote, today = todayIso()): Promise<Quote> {
  if (q.status === 'sent' && q.validUntil < today) {
    await Quote.update({ status: 'expired' }, { where: { id: q.id, status: 'sent' } });
    await q.reload();
  }
  return q;
}

export async function recordEvent(organisationId: string, jobId: string, userId: string | null, kind: string, data: Record<string, unknown>, t?: Transaction) {
  await JobEvent.create({ organisationId, jobId, userId, kind, data } as never, { transaction: t });
}

/** Every space of a job with its latest plan revision (spaces without a plan are skipped with a warning). */
export async function latestPlans(job: Job) {
  return latestRevisionsOfJobs([job.id]);
}

async function nextQuoteNumber(organisationId: string, t: Transaction): Promise<string> {
  const [rows] = (await Quote.sequelize!.query(
    `INSERT INTO quote_number_counters (organisation_id, last_number) VALUES (:org, 1)
     ON CONFLICT (organisation_id) DO UPDATE SET last_number = quote_number_counters.last_number + 1
     RETURNING last_number`,
    { replacements: { org: organisationId }, transaction: t },
  )) as [Array<{ last_number: number }>, unknown];
  return `QT-${String(rows[0].last_number).padStart(4, '0')}`;
}

async function versionsOf(q: Quote) {
  const rows = await Quote.findAll({
    where: { organisationId: q.organisationId, number: q.number },
    order: [['version', 'ASC']],
    attributes: ['id', 'version', 'status'],
  });
  return rows.map((r) => ({ id: r.id, version: r.version, status: r.status }));
}

export async function quoteDto(q: Quote) {
  const dto = toQuoteDto(q, await linesOf(q), await versionsOf(q));
  return { ...dto, deposit: depositTerms(dto.totals.grossMinor, await loadPaymentSettings(q.organisationId)) };
}

/**
 * Builds what a new draft needs from a job: the lines from the takeoff stored with every space's
 * latest plan revision, the snapshot and the dates.
 */
export async function buildDraft(job: Job) {
  const org = job.organisationId;
  // A new draft is a write: a company's first one saves its default settings and tax rates.
  const settingsRow = await ensureCompanySettings(org);
  const settings = toSettingsDto(settingsRow);
  const catalogue = await loadCatalogue(org);
  const plans = await latestPlans(job);
  const warnings: string[] = [];
  const spacesForQuote: SpaceForQuote[] = [];
  const takeoffs: Takeoff[] = [];
  const snapSpaces: QuoteSnapshot['spaces'] = [];
  const kinds = new Set<ExclusionKind>();
  let saving = null as { kwhPerYear: number; minorPerYear: number } | null;
  for (const { space, revision } of plans) {
    if (!revision) {
      warnings.push(`${space.name} has no plan yet: nothing is quoted for it`);
      continue;
    }
    const t = takeoffForSpace(space.name, revision.plan, revision.takeoff);
    if (!t.ok) {
      warnings.push(`${space.name}: ${t.message}`);
      continue;
    }
    spacesForQuote.push(t.space);
    takeoffs.push(t.takeoff);
    for (const [k, n] of Object.entries(t.space.exclusionCounts)) if (n) kinds.add(k as ExclusionKind);
    if (t.saving) saving = { kwhPerYear: (saving?.kwhPerYear ?? 0) + t.saving.kwh, minorPerYear: (saving?.minorPerYear ?? 0) + t.saving.minor };
    snapSpaces.push({
      id: space.id,
      name: space.name,
      revision: revision.revision,
      plan: revision.plan,
      netAreaM2: t.netAreaM2,
      uBefore: t.uBefore,
      uAfter: t.uAfter,
      thermalText: t.thermalText,
      layers: t.layerNames,
      takeoffLayers: t.space.layers.map((l) => ({
        role: l.role,
        productName: l.productName ?? l.productId,
        areaM2: l.areaM2,
        rollsByPacking: l.rollsByPacking,
        rollsByArea: l.rollsByArea,
      })),
    });
    warnings.push(...t.warnings.map((w) => `${space.name}: ${w}`));
  }
  if (plans.length === 0) warnings.push('this job has no spaces yet: add lines by hand or sketch a loft first');
  const built = buildQuoteLines(spacesForQuote, catalogue, settings, jobRollsByProduct(takeoffs));
  const cautions = quoteCautions(kinds);
  const issueDate = todayIso();
  const snapshot: QuoteSnapshot = {
    spaces: snapSpaces,
    saving: saving ? { kwhPerYear: Math.round(saving.kwhPerYear * 10) / 10, minorPerYear: Math.round(saving.minorPerYear) } : null,
    personHours: built.personHours,
    siteHours: built.siteHours,
    crewSize: settings.labour.crewSize,
    warnings: [...warnings, ...built.warnings],
    cautions: cautions.cautions,
    customerBeforeInstall: cautions.customerBeforeInstall,
    taxRates: catalogue.taxRates.map((r) => ({ taxClass: r.taxClass, rateBp: r.rateBp, validFrom: r.validFrom, label: r.label })),
  };
  return { lines: built.lines, snapshot, settings, issueDate, validUntil: addDaysIso(issueDate, settings.validityDays) };
}

export function createQuotesService(deps: AppDeps) {
  const sequelize = deps.sequelize;
  return {
    async listForJob(actor: SessionUser, jobId: string): Promise<QuoteSummary[]> {
      const job = await findJobInOrg(actor, jobId);
      const quotes = await Quote.findAll({ where: { jobId: job.id, organisationId: actor.organisationId }, order: [['createdAt', 'DESC']] });
      const out: QuoteSummary[] = [];
      for (const q of quotes) {
        withDerivedStatus(q);
        const { totals } = priceQuote(q, await linesOf(q));
        out.push({
          id: q.id,
          number: q.number,
          version: q.version,
          status: q.status,
          currency: q.currency,
          issueDate: q.issueDate,
          validUntil: q.validUntil,
          sentAt: q.sentAt ? q.sentAt.toISOString() : null,
          grossMinor: totals.grossMinor,
        });
      }
      return out;
    },

    async createFromJob(actor: SessionUser, jobId: string, body: { notes?: string }) {
      const job = await findJobInOrg(actor, jobId);
      const draft = await buildDraft(job);
      // Refuse now rather than store a quote that cannot be priced (no tax rate on the day).
      try {
        computeQuoteTotals(draft.lines, draft.snapshot.taxRates, draft.issueDate);
      } catch (e) {
        throw new ValidationError([{ path: 'taxRates', message: (e as Error).message }]);
      }
      const quote = await sequelize.transaction(async (t) => {
        const number = await nextQuoteNumber(actor.organisationId, t);
        const q = await Quote.create(
          {
            organisationId: actor.organisationId,
            jobId: job.id,
            number,
            version: 1,
            status: 'draft',
            currency: draft.settings.currency,
            locale: draft.settings.locale,
            issueDate: draft.issueDate,
            validUntil: draft.validUntil,
            notes: body.notes ?? '',
            snapshot: draft.snapshot as never,
            createdById: actor.id,
          } as never,
          { transaction: t },
        );
        await QuoteLine.bulkCreate(lineRows(actor.organisationId, q.id, draft.lines) as never, { transaction: t });
        await recordEvent(
          actor.organisationId,
          job.id,
          actor.id,
          'quote_created',
          { quoteId: q.id, number, version: 1, text: `Quote ${number} drafted from the takeoff` },
          t,
        );
        return q;
      });
      return quoteDto(quote);
    },

    async get(actor: SessionUser, id: string) {
      const q = withDerivedStatus(await findQuoteInOrg(actor, id));
      return quoteDto(q);
    },

    /**
     * Edits a draft in place. Editing a sent, expired or declined quote makes a new draft version
     * (same number, version + 1) and marks the old one superseded; accepted quotes are final.
     * Estimators may edit drafts only.
     */
    async patch(actor: SessionUser, id: string, body: QuotePatch) {
      await expireIfDue(await findQuoteInOrg(actor, id));
      const target = await sequelize.transaction(async (t) => {
        // The row stays locked until commit: a customer accepting through the link, a send or a
        // second edit waits here and then sees the state this edit leaves (guarded transition).
        const q = await findQuoteInOrg(actor, id, t, { lock: true });
        if (q.status === 'accepted') throw new ConflictError('this quote was accepted and cannot be changed', 'quote_final');
        if (q.status === 'superseded') throw new ConflictError('a newer version of this quote exists: edit that one', 'quote_superseded');
        if (q.status !== 'draft' && !can(actor, 'quotes:manage')) throw new ForbiddenError('only the office can change a quote once it has been sent');
        const snap = snapshotOf(q);
        if (body.validUntil && body.validUntil < q.issueDate)
          throw new ValidationError([{ path: 'validUntil', message: 'valid-until cannot be before the issue date' }]);
        if (q.status === 'draft') {
          await q.update(
            { ...(body.validUntil ? { validUntil: body.validUntil } : {}), ...(body.notes !== undefined ? { notes: body.notes } : {}) },
            { transaction: t },
          );
          if (body.lines) {
            await QuoteLine.destroy({ where: { quoteId: q.id }, transaction: t });
            await QuoteLine.bulkCreate(lineRows(actor.organisationId, q.id, body.lines) as never, { transaction: t });
          }
          await recordEvent(
            actor.organisationId,
            q.jobId,
            actor.id,
            'quote_edited',
            { quoteId: q.id, number: q.number, version: q.version, text: `Quote ${q.number} edited` },
            t,
          );
          return q;
        }
        const oldLines = await linesOf(q, t);
        const issueDate = todayIso();
        const next = await Quote.create(
          {
            organisationId: q.organisationId,
            jobId: q.jobId,
            number: q.number,
            version: q.version + 1,
            status: 'draft',
            currency: q.currency,
            locale: q.locale,
            issueDate,
            validUntil:
              body.validUntil ?? (q.validUntil >= issueDate ? q.validUntil : addDaysIso(issueDate, (await loadCompanySettings(q.organisationId)).validityDays)),
            notes: body.notes ?? q.notes,
            snapshot: snap as never,
            createdById: actor.id,
          } as never,
          { transaction: t },
        );
        const lines = body.lines ?? oldLines.map((l) => ({ ...l.get({ plain: true }) }));
        await QuoteLine.bulkCreate(lineRows(actor.organisationId, next.id, lines as never) as never, { transaction: t });
        await q.update({ status: 'superseded', linkNonce: null }, { transaction: t });
        await recordEvent(
          actor.organisationId,
          q.jobId,
          actor.id,
          'quote_new_version',
          {
            quoteId: next.id,
            number: q.number,
            version: next.version,
            replaces: q.id,
            text: `Quote ${q.number} version ${next.version} drafted; version ${q.version} kept as sent`,
          },
          t,
        );
        return next;
      });
      return quoteDto(target);
    },

    /** Removes a draft that was never sent. */
    async remove(actor: SessionUser, id: string) {
      const q = await findQuoteInOrg(actor, id);
      if (q.status !== 'draft') throw new ConflictError('only a draft can be deleted; sent quotes are kept', 'quote_not_draft');
      if (q.version > 1) throw new ConflictError('this draft replaces a sent version; edit it instead of deleting it', 'quote_versioned');
      await q.destroy();
    },

    /** Throws unless the quote can be priced and has lines; returns the quote's job. */
    async jobOf(q: Quote) {
      const job = await findJobInOrg({ organisationId: q.organisationId }, q.jobId);
      return job;
    },
  };
}
export type QuotesService = ReturnType<typeof createQuotesService>;
