import { z } from 'zod';

/** Where a recorded e-mail is: queued or retrying, accepted by the mail server, or given up on after every retry. */
export const mailStatusSchema = z.enum(['waiting', 'sent', 'failed']);
export type MailStatusValue = z.infer<typeof mailStatusSchema>;

/** One e-mail the company's account sent or is sending (the queue's record of it, not its body). */
export const mailRecordSchema = z.object({
  id: z.string(),
  to: z.string(),
  subject: z.string(),
  /** What it was for, e.g. 'quote', 'invoice'; '' for account mail (invites, resets). */
  purpose: z.string(),
  status: mailStatusSchema,
  /** Tries made so far. */
  attempts: z.number().int(),
  /** The mail server's answer to the last failed try; null once sent. */
  lastError: z.string().nullable(),
  createdAt: z.string(),
  sentAt: z.string().nullable(),
});
export type MailRecord = z.infer<typeof mailRecordSchema>;

/** GET /api/mail/messages — the company's latest 100 messages, newest first. */
export const mailRecordsResponseSchema = z.object({ messages: z.array(mailRecordSchema) });
export type MailRecordsResponse = z.infer<typeof mailRecordsResponseSchema>;
