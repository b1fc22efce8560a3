import { Op } from 'sequelize';
import type { JobSheet, MyJob } from '../../../shared/api/job-sheet';
import { Customer, Job, Space } from '../../db/models';
import { JobActual, JobCompletion } from '../../db/models';
import { mayEditActuals } from '../../../shared/api/actuals';
import { isInvoiced } from '../actuals/edit-actuals';
import type { SessionUser } from '../../types';
import type { PhotosService } from '../photos/photos.service';
import { findSheetJob } from '../jobs/job-access';
import type { SiteRecordsService } from './site-records.service';
import { loadCatalogue } from '../catalogue/catalogue.service';
import { latestRevisions } from '../plan-revisions/revisions.repository';
import { loadCompanySettings } from '../settings/settings.service';
import { sheetSpace, vanLoad } from './takeoff-view';

/** Shown on every job sheet above the checks: the usual site cautions; local regulations and licensed practice come first. */
export const SHEET_CAUTIONS = [
  'Loft work is work at height: a secure ladder, good light, and tread only on joists or boards.',
  'Mineral-wool dust: gloves, goggles, a disposable mask and long sleeves.',
  'Cables lie over the insulation, never under it; recessed lights get covers or their clearance; anything doubtful electrically goes to an electrician.',
  'Keep the clearance around flues and chimneys and the ventilation gap at the eaves; never insulate beneath a cold-water tank.',
  'Local building regulations, electrical rules and licensed practice come first: where they say otherwise, follow them.',
];

/** What was used, for the installer to see and correct on the finished job's sheet (no prices in it). */
async function sheetActuals(user: SessionUser, job: Job): Promise<JobSheet['actuals']> {
  if (job.stage !== 'installed' && job.stage !== 'closed') return null;
  const row = await JobActual.findByPk(job.id);
  return {
    rolls: row?.rolls ?? [],
    hours: row?.hours ?? [],
    extras: row?.extras ?? [],
    version: row?.version ?? 0,
    editable: mayEditActuals(user.role, { stage: job.stage, invoiced: await isInvoiced(job.id) }),
  };
}

/** Reads the sheet through the site-records and photos services built once by createApp. */
export function createJobSheetService(records: SiteRecordsService, photos: PhotosService) {
  return {
    /** Everything the installer needs on site, built field by field: no price, cost or margin can be in it. */
    async sheet(user: SessionUser, jobId: string): Promise<JobSheet> {
      const job = await findSheetJob(user, jobId);
      const spaces = await Space.findAll({
        where: { jobId: job.id },
        order: [
          ['position', 'ASC'],
          ['createdAt', 'ASC'],
        ],
      });
      const revisions = await latestRevisions(spaces.map((s) => s.id));
      const [settings, catalogue] = await Promise.all([loadCompanySettings(job.organisationId), loadCatalogue(job.organisationId)]);
      const completion = await JobCompletion.findByPk(job.id, { include: ['user'] });
      return {
        job: {
          id: job.id,
          reference: job.reference,
          stage: job.stage,
          installDate: job.installDate,
          propertyAddress: { line1: job.addressLine1, line2: job.addressLine2, town: job.town, postcode: job.postcode },
          accessNotes: job.accessNotes,
          notes: job.notes,
          customer: { name: job.customer?.name ?? '', phone: job.customer?.phone ?? '' },
          installer: job.assignedInstaller ? { id: job.assignedInstaller.id, name: job.assignedInstaller.name } : null,
        },
        spaces: spaces.map((s) => sheetSpace(s, revisions.get(s.id))),
        vanLoad: vanLoad([...revisions.values()], settings.extraRules, catalogue.extras),
        cautions: SHEET_CAUTIONS,
        ticks: await records.listTicks(job.id),
        notes: await records.listNotes(job.id),
        photos: await photos.list(job.id),
        completion: completion
          ? {
              by: { id: completion.userId ?? '', name: completion.user?.name ?? 'former user' },
              at: completion.completedAt.toISOString(),
              handoverUrl: `/api/jobs/${job.id}/handover.pdf`,
            }
          : null,
        actualsRequired: settings.actualsRequired ?? [],
        actuals: await sheetActuals(user, job),
      };
    },

    /** The installer's own jobs (scheduled, installed or closed), today's first is the client's ordering. */
    async myJobs(user: SessionUser): Promise<MyJob[]> {
      const jobs = await Job.findAll({
        where: { organisationId: user.organisationId, assignedInstallerId: user.id, stage: { [Op.in]: ['scheduled', 'installed', 'closed'] } },
        include: [
          { model: Customer, as: 'customer' },
          { model: Space, as: 'spaces' },
        ],
        order: [
          ['installDate', 'ASC'],
          ['reference', 'ASC'],
        ],
      });
      return jobs.map((j) => ({
        id: j.id,
        reference: j.reference,
        stage: j.stage,
        installDate: j.installDate,
        customerName: j.customer?.name ?? '',
        propertyAddress: { line1: j.addressLine1, line2: j.addressLine2, town: j.town, postcode: j.postcode },
        spaceCount: j.spaces?.length ?? 0,
      }));
    },
  };
}
export type JobSheetService = ReturnType<typeof createJobSheetService>;
