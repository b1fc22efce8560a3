import { Op } from 'sequelize';
import type { AssignResult, Capacity, InstallSettings, ScheduleJob, ScheduleWeek } from '../../../shared/api/schedule';
import { quoteCautions } from '../../../shared/quote/cautions';
import type { AppDeps } from '../../deps';
import { sendCompanyMail } from '../mail/mail.service';
import { addDaysIso, formatDate, mondayOf, todayIso } from '../../../shared/dates';
import { Customer, Job, JobEvent, Space, User } from '../../db/models';
import { InstallSetting } from '../../db/models';
import { ConflictError, fieldError, NotFoundError } from '../../lib/errors';
import type { SessionUser } from '../../types';
import { jobAreasM2, planExclusionKinds } from '../job-sheet/takeoff-view';

/** Whether a day's load is over the company's capacity (jobs per installer-day, or m² per installer-day). */
export function isOverCapacity(load: { jobs: number; areaM2: number }, cap: Capacity): boolean {
  return load.jobs > cap.maxJobsPerDay || load.areaM2 > cap.maxAreaM2PerDay + 1e-9;
}

/** The company's install settings; the defaults (not saved) until the office first changes them. */
export async function loadInstallSettings(organisationId: string): Promise<InstallSettings> {
  const row = (await InstallSetting.findByPk(organisationId)) ?? InstallSetting.build({ organisationId });
  return {
    maxJobsPerDay: row.maxJobsPerDay,
    maxAreaM2PerDay: row.maxAreaM2PerDay,
    handoverRValues: row.handoverRValues,
    handoverReceipt: row.handoverReceipt,
  };
}

/** Saves the office's change to the install settings (the row is created by the first change). */
export async function updateInstallSettings(organisationId: string, patch: Partial<InstallSettings>): Promise<InstallSettings> {
  await InstallSetting.findOrCreate({ where: { organisationId }, defaults: { organisationId } });
  await InstallSetting.update(patch, { where: { organisationId } });
  return loadInstallSettings(organisationId);
}

const jobInclude = [
  { model: Customer, as: 'customer' },
  { model: Space, as: 'spaces' },
];

export function createScheduleService(deps: Pick<AppDeps, 'sequelize' | 'mailer' | 'config'>) {
  const { config } = deps;

  async function toScheduleJobs(jobs: Job[]): Promise<ScheduleJob[]> {
    const areas = await jobAreasM2(jobs.map((j) => j.id));
    return jobs.map((j) => ({
      id: j.id,
      reference: j.reference,
      stage: j.stage,
      customerName: j.customer?.name ?? '',
      town: j.town,
      postcode: j.postcode,
      installDate: j.installDate,
      installerId: j.assignedInstallerId,
      areaM2: areas.get(j.id) ?? null,
    }));
  }

  return {
    installSettings(actor: SessionUser) {
      return loadInstallSettings(actor.organisationId);
    },
    updateInstallSettings(actor: SessionUser, patch: Partial<InstallSettings>) {
      return updateInstallSettings(actor.organisationId, patch);
    },
    /** The week from `weekStart`'s Monday: installers, their booked jobs, accepted jobs to book, and day loads. */
    async week(user: SessionUser, weekStart?: string): Promise<ScheduleWeek> {
      const monday = mondayOf(weekStart ?? todayIso());
      const days = Array.from({ length: 7 }, (_, i) => addDaysIso(monday, i));
      const capacity = await loadInstallSettings(user.organisationId);
      const installers = await User.findAll({ where: { organisationId: user.organisationId, role: 'installer', active: true }, order: [['name', 'ASC']] });
      const booked = await Job.findAll({
        where: {
          organisationId: user.organisationId,
          installDate: { [Op.between]: [days[0], days[6]] },
          assignedInstallerId: { [Op.ne]: null },
          stage: { [Op.in]: ['scheduled', 'installed', 'closed'] },
        },
        include: jobInclude,
        order: [
          ['installDate', 'ASC'],
          ['reference', 'ASC'],
        ],
      });
      const waiting = await Job.findAll({
        where: { organisationId: user.organisationId, stage: 'accepted' },
        include: jobInclude,
        order: [['updatedAt', 'ASC']],
      });
      const jobs = await toScheduleJobs(booked);
      const loads = new Map<string, { installerId: string; date: string; jobs: number; areaM2: number; overCapacity: boolean }>();
      for (const j of jobs) {
        const k = `${j.installerId}|${j.installDate}`;
        const l = loads.get(k) ?? { installerId: j.installerId!, date: j.installDate!, jobs: 0, areaM2: 0, overCapacity: false };
        l.jobs += 1;
        l.areaM2 += j.areaM2 ?? 0;
        l.overCapacity = isOverCapacity(l, capacity);
        loads.set(k, l);
      }
      return {
        weekStart: monday,
        days,
        installers: installers.map((i) => ({ id: i.id, name: i.name })),
        jobs,
        unscheduled: await toScheduleJobs(waiting),
        loads: [...loads.values()].map((l) => ({ ...l, areaM2: Math.round(l.areaM2 * 10) / 10 })),
        capacity: { maxJobsPerDay: capacity.maxJobsPerDay, maxAreaM2PerDay: capacity.maxAreaM2PerDay },
      };
    },

    /**
     * Books an accepted (or re-books a scheduled) job for an installer on a date and moves it to
     * `scheduled`. Over the day's capacity it refuses with `over_capacity` unless the office says
     * book anyway; then the warning is returned. E-mails the customer and the installer.
     */
    async assign(
      user: SessionUser,
      body: { jobId: string; installerId: string; date: string; allowOverCapacity: boolean },
      today = todayIso(),
    ): Promise<AssignResult> {
      if (body.date < today) throw fieldError('date', 'choose today or a later date');
      const job = await Job.findOne({ where: { id: body.jobId, organisationId: user.organisationId }, include: jobInclude });
      if (!job) throw new NotFoundError('job');
      if (!['accepted', 'scheduled'].includes(job.stage)) {
        throw new ConflictError(`only an accepted job can be scheduled; this one is ${job.stage}`, 'wrong_stage');
      }
      const installer = await User.findOne({ where: { id: body.installerId, organisationId: user.organisationId } });
      if (!installer) throw new NotFoundError('installer');
      if (installer.role !== 'installer' || !installer.active) throw fieldError('installerId', `${installer.name} is not an active installer`);

      const capacity = await loadInstallSettings(user.organisationId);
      const sameDay = await Job.findAll({
        where: {
          organisationId: user.organisationId,
          assignedInstallerId: installer.id,
          installDate: body.date,
          stage: { [Op.in]: ['scheduled', 'installed', 'closed'] },
          id: { [Op.ne]: job.id },
        },
      });
      const areas = await jobAreasM2([job.id, ...sameDay.map((j) => j.id)]);
      const load = { jobs: sameDay.length + 1, areaM2: [job.id, ...sameDay.map((j) => j.id)].reduce((s, id) => s + (areas.get(id) ?? 0), 0) };
      const warnings: string[] = [];
      if (isOverCapacity(load, capacity)) {
        const msg = `${installer.name} would have ${load.jobs} job${load.jobs === 1 ? '' : 's'} (${load.areaM2.toFixed(1)} m²) on ${formatDate(body.date)}; the day's capacity is ${capacity.maxJobsPerDay} job${capacity.maxJobsPerDay === 1 ? '' : 's'} or ${capacity.maxAreaM2PerDay} m².`;
        if (!body.allowOverCapacity) throw new ConflictError(msg, 'over_capacity');
        warnings.push(msg);
      }

      await deps.sequelize.transaction(async (t) => {
        const from = { stage: job.stage, installerId: job.assignedInstallerId, date: job.installDate };
        await job.update({ assignedInstallerId: installer.id, installDate: body.date, stage: 'scheduled' }, { transaction: t });
        // The same event kinds and data shapes as editing the job (jobs.service update): the timeline reads them.
        const ev = (kind: string, data: Record<string, unknown>) =>
          JobEvent.create({ organisationId: user.organisationId, jobId: job.id, userId: user.id, kind, data }, { transaction: t });
        if (from.stage !== 'scheduled') await ev('stage_changed', { from: from.stage, to: 'scheduled' });
        if (from.installerId !== installer.id) await ev('assigned', { from: from.installerId, to: installer.id });
        await ev('scheduled', { from, installerId: installer.id, date: body.date, overCapacity: warnings.length > 0 });
      });

      const emailed: string[] = [];
      const address = [job.addressLine1, job.addressLine2, job.town, job.postcode].filter(Boolean).join(', ');
      const when = formatDate(body.date, { weekday: true });
      const customer = job.customer;
      const mailCtx = { organisationId: user.organisationId, jobId: job.id, userId: user.id };
      try {
        if (customer?.email) {
          const kinds = await planExclusionKinds(job.id);
          const { cautions, customerBeforeInstall } = quoteCautions(kinds);
          await sendCompanyMail(
            deps,
            { ...mailCtx, purpose: 'booking', audience: 'customer' },
            {
              to: customer.email,
              subject: `Your loft insulation is booked for ${when} (${job.reference})`,
              text: [
                `Dear ${customer.name},`,
                '',
                `Your loft insulation at ${address} is booked for ${when}. ${installer.name} will install it.`,
                '',
                'How to prepare:',
                '- Clear the area under the loft hatch and the way to it (landing, stairs) so the installer can work safely.',
                ...customerBeforeInstall.map((l) => `- ${l}`),
                '',
                'What will happen: the installer checks the loft, lifts cables to lie over the insulation, lays the rolls between and then across the joists, keeps the ventilation gap at the eaves, insulates and seals the hatch, and takes before and after photos. You receive a handover pack when the job is done.',
                '',
                'Cautions:',
                ...cautions.map((l) => `- ${l}`),
                '',
                'If the date does not suit you, reply to this e-mail.',
              ].join('\n'),
            },
          );
          emailed.push(customer.email);
        } else {
          warnings.push('the customer has no e-mail address: tell them the date another way');
        }
        const sheetUrl = `${config.appUrl}/jobs/${job.id}/sheet`;
        await sendCompanyMail(
          deps,
          { ...mailCtx, purpose: 'booking_installer', audience: 'staff' },
          {
            to: installer.email,
            subject: `Job ${job.reference} on ${when}: ${job.town}`,
            text: [
              `Hello ${installer.name},`,
              '',
              `You are booked for job ${job.reference} on ${when} at ${address}.`,
              `Job sheet (open it once with signal; it then works offline): ${sheetUrl}`,
              `Printable job sheet: ${config.appUrl}/api/jobs/${job.id}/sheet.pdf`,
              job.accessNotes ? `\nAccess notes: ${job.accessNotes}` : '',
            ].join('\n'),
          },
        );
        emailed.push(installer.email);
      } catch (e) {
        warnings.push(`the booking is saved, but an e-mail could not be sent: ${(e as Error).message}`);
      }
      return { jobId: job.id, stage: 'scheduled', installDate: body.date, installerId: installer.id, warnings, emailed };
    },
  };
}
export type ScheduleService = ReturnType<typeof createScheduleService>;
