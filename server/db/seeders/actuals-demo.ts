import { readStoredTakeoff } from '../../../shared/takeoff/takeoff-schema';
import { latestRevisionsOfJobs } from '../../modules/plan-revisions/revisions.repository';
import { Job, JobActual, JobCompletion, Organisation, QuoteLine, Quote, User } from '../models';
import type { DemoTimes } from './demo-history';

/**
 * Invented site records for the demo's finished jobs, in order of reference: rolls more or fewer
 * than the roll plan, rolls brought back, and hours against the quote's labour. Made up so the
 * estimate-against-actual report and its suggestions have something to show on a fresh start.
 */
const VARIATIONS = [
  { rolls: 1, returned: 1, hours: 1.2, hatch: 1 },
  { rolls: 1, returned: 2, hours: 0.95, hatch: 1 },
  { rolls: 2, returned: 0, hours: 1.35, hatch: 1 },
  { rolls: 1, returned: 1, hours: 1.1, hatch: 1 },
  { rolls: 1, returned: 2, hours: 1.05, hatch: 1 },
];

/**
 * Marks the company's installed and closed jobs finished with invented actuals, at the moment of
 * their history (`times`) that they were installed; jobs already finished are left alone.
 */
export async function seedDemoActuals(companyName: string, times: Map<string, DemoTimes>): Promise<void> {
  const org = await Organisation.findOne({ where: { name: companyName } });
  if (!org) return;
  const installers = await User.findAll({ where: { organisationId: org.id, role: 'installer' }, order: [['email', 'ASC']] });
  const jobs = await Job.findAll({ where: { organisationId: org.id, stage: ['installed', 'closed'] }, order: [['reference', 'ASC']] });
  for (const [i, job] of jobs.entries()) {
    if (await JobCompletion.findByPk(job.id)) continue;
    const v = VARIATIONS[i % VARIATIONS.length];
    const rolls = new Map<string, number>();
    for (const { revision } of await latestRevisionsOfJobs([job.id]))
      for (const l of readStoredTakeoff(revision?.takeoff)?.layers ?? []) rolls.set(l.productId, (rolls.get(l.productId) ?? 0) + l.rollsByPacking);
    const quote = await Quote.findOne({ where: { jobId: job.id, status: 'accepted' }, include: [{ model: QuoteLine, as: 'lines' }] });
    const quoted = (quote?.lines ?? []).filter((l) => l.kind === 'labour').reduce((a, l) => a + Number(l.quantity), 0) || 6;
    const hours = Math.round(quoted * v.hours * 4) / 4;
    const lead = installers.find((u) => u.id === job.assignedInstallerId) ?? installers[0];
    const mate = installers.find((u) => u.id !== lead?.id);
    const at = times.get(job.id)?.installed ?? new Date();
    await JobCompletion.create({ jobId: job.id, organisationId: org.id, userId: lead?.id ?? null, completedAt: at, handoverKey: null });
    await JobActual.create({
      jobId: job.id,
      organisationId: org.id,
      rolls: [...rolls].map(([productId, n], k) => ({ productId, used: Math.max(1, n + (k === 0 ? v.rolls : 0)), returned: k === 0 ? v.returned : 0 })),
      hours: [lead, mate].flatMap((u, k) =>
        u ? [{ userId: u.id, hours: k === 0 ? Math.ceil(hours / 2 / 0.25) * 0.25 : Math.floor(hours / 2 / 0.25) * 0.25 }] : [],
      ),
      extras: [{ code: 'hatch_kit', used: v.hatch }],
      recordedById: lead?.id ?? null,
      recordedAt: at,
    });
  }
}
