import type { Mailer } from '../../lib/mailer';
import { officeRecipients } from '../mail/mail.service';

/** E-mail the office about a payment (the company's one notification address; see officeRecipients). */
export async function mailOffice(mailer: Mailer, organisationId: string, subject: string, text: string): Promise<void> {
  const to = await officeRecipients(organisationId);
  if (to.length === 0) return;
  await mailer.send({ to: to.join(', '), organisationId, subject, text });
}
