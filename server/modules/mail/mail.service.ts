import { Op } from 'sequelize';
import type { AppDeps } from '../../deps';
import type { MailRecord } from '../../../shared/api/mail';
import { MailMessage as MailMessageRow, User } from '../../db/models';
import type { MailMessage } from '../../lib/mailer';
import { loadCompanySettings } from '../settings/settings.service';

/** Who a message is for: customers reply to the company; office and staff mail needs no Reply-To. */
export type MailAudience = 'customer' | 'office' | 'staff';

export interface MailContext {
  organisationId: string;
  /** The job the message is about: it is recorded on that job's history. */
  jobId: string | null;
  /** Who caused it (null for the customer's own actions and the system). */
  userId: string | null;
  /** What it is, e.g. 'quote', 'invoice', 'booking', 'handover', 'quote_accepted'. */
  purpose: string;
  audience: MailAudience;
  quoteId?: string;
}

type Message = Pick<MailMessage, 'to' | 'subject' | 'text' | 'html' | 'attachments'>;

/**
 * The one way a company's e-mail goes out: tagged with the sending company, Reply-To the company's
 * address on customer mail (the From is a no-reply address, and the booking e-mail says "reply to
 * this e-mail"), and recorded on the job's history (`email_sent`, status waiting → sent or failed) when it is
 * about a job.
 */
export async function sendCompanyMail(deps: Pick<AppDeps, 'mailer'>, ctx: MailContext, message: Message): Promise<void> {
  const company = ctx.audience === 'customer' ? await loadCompanySettings(ctx.organisationId) : null;
  // Recorded and queued (with its history event), not sent here: a mail server that is down makes
  // the message wait for the worker's retries instead of failing the request.
  await deps.mailer.send({
    ...message,
    organisationId: ctx.organisationId,
    replyTo: company?.email || undefined,
    about: { jobId: ctx.jobId, userId: ctx.userId, purpose: ctx.purpose, quoteId: ctx.quoteId ?? null },
  });
}

/** The one office notification address: the company's e-mail, else every active office user. */
export async function officeRecipients(organisationId: string): Promise<string[]> {
  const settings = await loadCompanySettings(organisationId);
  if (settings.email) return [settings.email];
  const office = await User.findAll({ where: { organisationId, role: 'office', active: true, email: { [Op.ne]: '' } }, attributes: ['email'] });
  return office.map((u) => u.email);
}

/** Tells the office (see `officeRecipients`); recorded on the job's history when it is about one. Nobody to tell: nothing sent. */
export async function mailOffice(deps: Pick<AppDeps, 'mailer'>, ctx: Omit<MailContext, 'audience'>, subject: string, text: string): Promise<void> {
  const to = await officeRecipients(ctx.organisationId);
  if (to.length === 0) return;
  await sendCompanyMail(deps, { ...ctx, audience: 'office' }, { to: to.join(', '), subject, text });
}

/** The company's e-mail as its Mail page lists it (newest first), and sending a failed one again. */
export function createMailService(deps: Pick<AppDeps, 'mailQueue'>) {
  return {
    async list(organisationId: string): Promise<MailRecord[]> {
      const rows = await MailMessageRow.findAll({ where: { organisationId }, order: [['createdAt', 'DESC']], limit: 100 });
      return rows.map(toRecord);
    },
    async resend(organisationId: string, id: string): Promise<MailRecord> {
      await deps.mailQueue.resend(organisationId, id);
      const row = await MailMessageRow.findOne({ where: { id, organisationId } });
      return toRecord(row!);
    },
  };
}

export type MailService = ReturnType<typeof createMailService>;

function toRecord(m: MailMessageRow): MailRecord {
  return {
    id: m.id,
    to: m.recipient,
    subject: m.subject,
    purpose: m.purpose,
    status: m.status,
    attempts: m.attempts,
    lastError: m.lastError,
    createdAt: m.createdAt.toISOString(),
    sentAt: m.sentAt?.toISOString() ?? null,
  };
}
