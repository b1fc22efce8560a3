import { thermalFactsText } from '../../../shared/takeoff/thermal-text';
import type { AppDeps } from '../../deps';
import { sendCompanyMail } from '../mail/mail.service';
import { Customer, Job, JobEvent, Space, User } from '../../db/models';
import { JobCompletion, JobPhoto, JobTick } from '../../db/models';
import { formatDate } from '../../../shared/dates';
import { ConflictError, NotFoundError } from '../../lib/errors';
import type { SessionUser } from '../../types';
import { findSheetJob, findWorkableJob } from '../jobs/job-access';
import { sheetChecks } from '../job-sheet/takeoff-view';
import { latestRevisions } from '../plan-revisions/revisions.repository';
import { readStoredTakeoff } from '../../../shared/takeoff/takeoff-schema';
import { loadInstallSettings } from '../schedule/schedule.service';
import { loadCompanySettings } from '../settings/settings.service';
import { renderHandoverPdf, type HandoverData } from './handover-pdf';
import type { Actuals } from '../../../shared/api/actuals';
import { actualsApply, checkActualsRefs, missingActuals, storeActuals } from '../actuals/record-actuals';

const PHOTOS_PER_STAGE = 2;

type FinishInput = { reasons?: Record<string, string>; actuals?: Actuals };
/** `replayed`: this was a resend of a finish already done with the same Idempotency-Key. */
export type FinishResult = { stage: 'installed'; emailed: boolean; warnings: string[]; replayed: boolean };

export function createHandoverService(deps: Pick<AppDeps, 'sequelize' | 'storage' | 'mailer'>) {
  const { sequelize, storage } = deps;

  async function handoverData(job: Job): Promise<HandoverData> {
    const [company, customer, completion, settings] = await Promise.all([
      loadCompanySettings(job.organisationId),
      Customer.findByPk(job.customerId),
      JobCompletion.findByPk(job.id, { include: ['user'] }),
      loadInstallSettings(job.organisationId),
    ]);
    const installer = completion?.user ?? (job.assignedInstallerId ? await User.findByPk(job.assignedInstallerId) : null);
    const spaces = await Space.findAll({
      where: { jobId: job.id },
      order: [
        ['position', 'ASC'],
        ['createdAt', 'ASC'],
      ],
    });
    const revisions = await latestRevisions(spaces.map((s) => s.id));
    const photoRows = await JobPhoto.findAll({ where: { jobId: job.id }, order: [['takenAt', 'ASC']] });
    const out: HandoverData['spaces'] = [];
    for (const s of spaces) {
      const t = readStoredTakeoff(revisions.get(s.id)?.takeoff);
      const chosen = (['before', 'after'] as const).flatMap((stage) =>
        photoRows.filter((p) => p.spaceId === s.id && p.stage === stage).slice(0, PHOTOS_PER_STAGE),
      );
      const photos = [];
      for (const p of chosen) photos.push({ stage: p.stage as 'before' | 'after', caption: p.caption, jpeg: await storage.read(p.storageKey) });
      out.push({
        name: s.name,
        netAreaM2: t ? t.netAreaM2 : null,
        uValueBefore: t ? t.uValueBefore : null,
        uValueAfter: t ? t.uValueAfter : null,
        thermalText: t ? thermalFactsText(t) : null,
        layers: t
          ? t.layers.map((l) => ({
              productName: l.productName,
              role: l.role,
              thicknessMm: l.thicknessMm,
              areaM2: l.areaM2,
              rolls: l.rollsByPacking,
              lambdaWmK: l.lambda ?? null,
            }))
          : [],
        photos,
      });
    }
    const when = completion?.completedAt ?? new Date();
    return {
      companyName: company.companyName,
      reference: job.reference,
      customerName: customer?.name ?? '',
      address: [job.addressLine1, job.addressLine2, job.town, job.postcode].filter(Boolean).join(', '),
      installerName: installer?.name ?? '',
      installedOn: formatDate(when.toISOString()),
      spaces: out,
      showRValues: settings.handoverRValues,
      signedReceipt: settings.handoverReceipt,
    };
  }

  return {
    /**
     * Marks the job installed when every site check is ticked or has a written reason (given now
     * or before) and every space has at least one after photo; otherwise 409 `not_ready` naming
     * each thing missing. Then stores the handover pack and e-mails it to the customer.
     */
    async finish(user: SessionUser, jobId: string, body: FinishInput, finishKey?: string): Promise<FinishResult> {
      const reasons = body.reasons ?? {};
      const done = await sequelize.transaction(async (t) => {
        // Lock first, then judge the stage: two finishes at once are decided one after the other.
        await Job.findOne({ where: { id: jobId, organisationId: user.organisationId }, transaction: t, lock: t.LOCK.UPDATE });
        if (finishKey) {
          // The same finish sent again (its answer was lost on a bad signal): answer it as done, record nothing twice.
          const earlier = await JobCompletion.findOne({ where: { jobId, finishKey, userId: user.id }, transaction: t });
          if (earlier) return null;
        }
        const j = await findWorkableJob(user, jobId, t);
        const spaces = await Space.findAll({ where: { jobId: j.id }, transaction: t });
        if (spaces.length === 0) throw new ConflictError('this job has no spaces to finish', 'not_ready');
        const revisions = await latestRevisions(
          spaces.map((s) => s.id),
          { transaction: t },
        );
        const ticks = await JobTick.findAll({ where: { jobId: j.id, kind: 'check' }, transaction: t });
        const afterPhotos = await JobPhoto.findAll({ where: { jobId: j.id, stage: 'after' }, transaction: t });
        const missing: { path: string; message: string }[] = [];
        const productIds = new Set<string>();
        const now = new Date();
        for (const s of spaces) {
          const row = revisions.get(s.id);
          const stored = readStoredTakeoff(row?.takeoff);
          const checks = stored ? sheetChecks(stored) : [];
          for (const c of checks) {
            const tick = ticks.find((x) => x.spaceId === s.id && x.ref === c.code);
            const given = (reasons[`${s.id}:${c.code}`] ?? '').trim();
            if (tick?.done) continue;
            if (given) {
              if (tick) await tick.update({ reason: given, userId: user.id, tickedAt: now }, { transaction: t });
              else
                await JobTick.create(
                  {
                    organisationId: user.organisationId,
                    jobId: j.id,
                    spaceId: s.id,
                    kind: 'check',
                    ref: c.code,
                    done: false,
                    reason: given,
                    userId: user.id,
                    tickedAt: now,
                  },
                  { transaction: t },
                );
              continue;
            }
            if (!tick?.reason) missing.push({ path: `checks.${s.id}:${c.code}`, message: `${s.name}: "${c.title}" is not ticked and has no reason` });
          }
          if (!afterPhotos.some((p) => p.spaceId === s.id)) missing.push({ path: `photos.${s.id}`, message: `${s.name}: add at least one after photo` });
          for (const l of stored?.layers ?? []) productIds.add(l.productId);
        }
        const company = await loadCompanySettings(j.organisationId, t);
        const takeoffs = [...revisions.values()].flatMap((r) => readStoredTakeoff(r.takeoff) ?? []);
        missing.push(...missingActuals(body.actuals, company.actualsRequired ?? [], actualsApply(takeoffs, company.extraRules)));
        if (missing.length) {
          throw new ConflictError(`not ready to mark installed: ${missing.map((m) => m.message).join('; ')}`, 'not_ready', missing);
        }
        if (body.actuals) await checkActualsRefs(user, body.actuals, productIds, t);
        await j.update({ stage: 'installed' }, { transaction: t });
        await JobCompletion.create(
          { jobId: j.id, organisationId: user.organisationId, userId: user.id, completedAt: now, reasons, handoverKey: null, finishKey: finishKey ?? null },
          { transaction: t },
        );
        const actuals = await storeActuals(user, j.id, body.actuals, now, t);
        await JobEvent.create(
          { organisationId: user.organisationId, jobId: j.id, userId: user.id, kind: 'installed', data: { reasons, actuals } },
          { transaction: t },
        );
        return j;
      });
      if (!done) return { stage: 'installed', emailed: false, warnings: [], replayed: true };
      const job = done;

      const warnings: string[] = [];
      let emailed = false;
      try {
        const data = await handoverData(job);
        const pdf = await renderHandoverPdf(data);
        const key = `${job.organisationId}/handover/${job.id}.pdf`;
        await storage.put(key, pdf, { contentType: 'application/pdf' });
        await JobCompletion.update({ handoverKey: key }, { where: { jobId: job.id } });
        const customer = await Customer.findByPk(job.customerId);
        if (customer?.email) {
          await sendCompanyMail(
            deps,
            { organisationId: job.organisationId, jobId: job.id, userId: user.id, purpose: 'handover', audience: 'customer' },
            {
              to: customer.email,
              subject: `Your loft insulation handover pack (${job.reference})`,
              text: `Dear ${customer.name},\n\nYour loft insulation was installed on ${data.installedOn} by ${data.installerName}. The handover pack attached lists what was installed, the U-values before and after, photos, and how to look after the insulation.\n\n${data.companyName}`,
              attachments: [{ filename: `handover-${job.reference}.pdf`, content: pdf, contentType: 'application/pdf' }],
            },
          );
          emailed = true;
        } else {
          warnings.push('the customer has no e-mail address: the office can download the handover pack and send it');
        }
      } catch (e) {
        warnings.push(`the job is marked installed, but the handover pack could not be sent: ${(e as Error).message}`);
      }
      return { stage: 'installed', emailed, warnings, replayed: false };
    },

    /** The handover pack PDF of an installed job (rendered now from the current records). */
    async pdf(user: SessionUser, jobId: string): Promise<{ filename: string; pdf: Buffer }> {
      const job = await findSheetJob(user, jobId);
      if (!['installed', 'closed'].includes(job.stage)) throw new ConflictError('the handover pack is ready once the job is marked installed', 'not_installed');
      const pdf = await renderHandoverPdf(await handoverData(job));
      if (!pdf.length) throw new NotFoundError('handover pack');
      return { filename: `handover-${job.reference}.pdf`, pdf };
    },
  };
}
export type HandoverService = ReturnType<typeof createHandoverService>;
