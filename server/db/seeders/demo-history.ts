import { STAGE_MOVES } from '../../../shared/api/job-stages';
import { JOB_STAGES, type JobStage } from '../../../shared/api/jobs';
import { todayIso } from '../../../shared/dates';
import { formatMoney } from '../../../shared/quote/money';
import { Customer, Invoice, Job, JobEvent, Quote, User } from '../models';
import { priceQuote } from '../../modules/quotes/quote-dto';
import { linesOf } from '../../modules/quotes/quotes.service';

/** The demo's declined job turned down its sent quote, as the customer's link does: declined from `quoted`. */
const DECLINED_FROM: JobStage = 'quoted';

/**
 * The stages a demo job passed through on its way to `stage`, from enquiry, one allowed move at a
 * time: each step is the first forward move STAGE_MOVES lists (its lists follow JOB_STAGES' order).
 */
export function demoStagePath(stage: JobStage): JobStage[] {
  const target = stage === 'declined' ? DECLINED_FROM : stage;
  const path: JobStage[] = ['enquiry'];
  while (path[path.length - 1] !== target) {
    const from = path[path.length - 1];
    const next = STAGE_MOVES[from].find((s) => JOB_STAGES.indexOf(s) > JOB_STAGES.indexOf(from));
    // Past the target or stuck: the stage table changed under the demo data; fail the seed loudly.
    if (!next || JOB_STAGES.indexOf(next) > JOB_STAGES.indexOf(target)) throw new Error(`demo data: no forward move from ${from} towards ${stage}`);
    path.push(next);
  }
  if (stage === 'declined') {
    if (!STAGE_MOVES[target].includes('declined')) throw new Error(`demo data: a job cannot be declined from ${target}`);
    path.push('declined');
  }
  return path;
}

/** The moments a demo job's history records; the documents and site records carry the same times. */
export type DemoMoment = 'created' | 'surveyed' | 'drafted' | 'sent' | 'answered' | 'booked' | 'installed' | 'invoiced' | 'paid' | 'closed';
export type DemoTimes = Partial<Record<DemoMoment, Date>>;

/** What happens on the way into each stage, in order. */
const MOMENTS_INTO: Record<JobStage, DemoMoment[]> = {
  enquiry: ['created'],
  surveyed: ['surveyed'],
  quoted: ['drafted', 'sent'],
  accepted: ['answered'],
  declined: ['answered'],
  scheduled: ['booked'],
  installed: ['installed'],
  closed: ['invoiced', 'paid', 'closed'],
};

/** An invented but typical pace: whole days after the moment before, and the time of day (UTC). */
const PACE: Record<DemoMoment, { days: number; at: string }> = {
  created: { days: 0, at: '09:20' },
  surveyed: { days: 4, at: '14:10' }, // the survey visit
  drafted: { days: 1, at: '10:05' },
  sent: { days: 0, at: '10:40' },
  answered: { days: 3, at: '19:15' }, // customers answer in the evening
  booked: { days: 1, at: '09:30' },
  installed: { days: 18, at: '15:30' }, // booked a few weeks ahead; finished at the end of the day
  invoiced: { days: 1, at: '09:10' },
  paid: { days: 8, at: '20:05' },
  closed: { days: 1, at: '09:00' }, // the office closes the job once the balance is in
};
const DAY_MS = 86_400_000;

/**
 * When each moment of a demo job's history happened. A job installed already hangs on its install
 * date; any other job's last moment is one to three days before `now`. `variety` (the job's place
 * in the demo list) shifts a few gaps and minutes so that no two histories read alike.
 */
export function demoTimes(path: JobStage[], installDate: string | null, variety: number, now: Date): DemoTimes {
  const moments = path.flatMap((s) => MOMENTS_INTO[s]);
  const extra: Partial<Record<DemoMoment, number>> = { surveyed: variety % 3, answered: (variety * 2) % 5 };
  let day = 0;
  const days = moments.map((m) => (day += PACE[m].days + (extra[m] ?? 0)));
  const installed = moments.indexOf('installed');
  const first =
    installed >= 0 && installDate
      ? Date.parse(installDate) / DAY_MS - days[installed]
      : Date.parse(todayIso(now)) / DAY_MS - 1 - (variety % 3) - days[days.length - 1];
  const minutes = (variety * 7) % 30;
  return Object.fromEntries(
    moments.map((m, k) => {
      const [h, min] = PACE[m].at.split(':').map(Number);
      return [m, new Date((first + days[k]) * DAY_MS + (h * 60 + min + minutes) * 60_000)];
    }),
  );
}

function need<T>(value: T | null | undefined, what: string): T {
  if (value == null) throw new Error(`demo data: ${what} is missing`);
  return value;
}

/**
 * Writes each demo job's history as the app writes a real one, move by move along demoStagePath,
 * each at its moment, with the kinds and data the services use: the hand moves, the quote sent and
 * the move it makes, the customer's answer, the booking, the finish, the invoice paid, the close.
 * The quote drafted and the invoice issued were recorded by their services while seeding, at the
 * seeding time: they are moved to their moments (nothing else has read these rows yet).
 */
export async function seedDemoHistory(times: Map<string, DemoTimes>): Promise<void> {
  for (const [jobId, at] of times) {
    const job = need(await Job.findByPk(jobId, { include: [{ model: Customer, as: 'customer' }] }), 'the job');
    const office = await User.findOne({ where: { organisationId: job.organisationId, role: 'office' }, order: [['email', 'ASC']] });
    const quote = await Quote.findOne({ where: { jobId }, order: [['version', 'DESC']] });
    const invoice = await Invoice.findOne({ where: { jobId, kind: 'invoice' } });
    const officeId = office?.id ?? null;
    const q = () => need(quote, `the quote of ${job.reference}`);
    const write = (kind: string, data: Record<string, unknown>, moment: DemoMoment, userId: string | null) =>
      JobEvent.create({ organisationId: job.organisationId, jobId, userId, kind, data, createdAt: need(at[moment], `the ${moment} time`) });
    const retime = (kind: string, moment: DemoMoment) => JobEvent.update({ createdAt: need(at[moment], `the ${moment} time`) }, { where: { jobId, kind } });
    const path = demoStagePath(job.stage);
    for (const [k, to] of path.entries()) {
      const move = { from: path[k - 1], to };
      switch (to) {
        case 'enquiry':
          await write('created', { reference: job.reference, stage: 'enquiry', demo: true }, 'created', job.createdById);
          break;
        case 'surveyed':
          await write('stage_changed', move, 'surveyed', job.createdById);
          break;
        case 'quoted': {
          const { id: quoteId, number, version } = q();
          await retime('quote_created', 'drafted');
          const grossMinor = priceQuote(q(), await linesOf(q())).totals.grossMinor;
          const text = `Quote ${number} sent to the customer`;
          await write('quote_sent', { quoteId, number, version, to: job.customer?.email, grossMinor, text }, 'sent', officeId);
          await write('stage_changed', { ...move, reason: `quote ${number} sent` }, 'sent', officeId);
          break;
        }
        case 'accepted': {
          const { id: quoteId, number, version, acceptedName: name } = q();
          const text = `Quote ${number} accepted by ${name} through the private link`;
          await write('quote_accepted', { quoteId, number, version, name, ip: null, text }, 'answered', null);
          await write('stage_changed', { ...move, reason: `quote ${number} accepted by the customer` }, 'answered', null);
          break;
        }
        case 'declined': {
          const { id: quoteId, number, version, declineReason: reason } = q();
          // As the customer's link writes it: the move first, then the answer.
          await write('stage_changed', { ...move, reason: `quote ${number} declined by the customer` }, 'answered', null);
          const text = `Quote ${number} declined by the customer${reason ? `: ${reason}` : ''}`;
          await write('quote_declined', { quoteId, number, version, reason, text }, 'answered', null);
          break;
        }
        case 'scheduled': {
          const booked = { installerId: job.assignedInstallerId, date: job.installDate };
          await write('stage_changed', move, 'booked', officeId);
          await write('assigned', { from: null, to: job.assignedInstallerId }, 'booked', officeId);
          const before = { stage: move.from, installerId: null, date: null };
          await write('scheduled', { from: before, ...booked, overCapacity: false }, 'booked', officeId);
          break;
        }
        case 'installed':
          await write('installed', { reasons: {}, actuals: true }, 'installed', job.assignedInstallerId);
          break;
        case 'closed': {
          const inv = need(invoice, `the invoice of ${job.reference}`);
          await retime('invoice_issued', 'invoiced');
          const amountMinor = inv.grossMinor - inv.depositMinor;
          const paid = {
            invoiceId: inv.id,
            invoiceNumber: inv.number,
            amountMinor,
            currency: inv.currency,
            paidAt: need(at.paid, 'the paid time').toISOString(),
          };
          await write('invoice_paid', { ...paid, paymentText: `Invoice ${inv.number} paid: ${formatMoney(amountMinor, inv.currency)}` }, 'paid', null);
          await write('stage_changed', move, 'closed', officeId);
          break;
        }
      }
    }
  }
}
