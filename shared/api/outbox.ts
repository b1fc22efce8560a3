import { z } from 'zod';

/** One e-mail caught by the local fake SMTP server (development only). */
export const outboxMessageSchema = z.object({
  id: z.number().int(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.string(),
  /** Where replies go ('' when the message sets no Reply-To). */
  replyTo: z.string(),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  links: z.array(z.string()),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;

/** GET /api/dev/outbox — newest first. `enabled` is false when a real SMTP relay is configured. */
export const outboxResponseSchema = z.object({ enabled: z.boolean(), messages: z.array(outboxMessageSchema) });
export type OutboxResponse = z.infer<typeof outboxResponseSchema>;
