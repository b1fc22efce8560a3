import { Router } from 'express';
import type { OutboxMessage } from '../../../shared/api/outbox';
import type { AppDeps } from '../../deps';
import type { CapturedMail } from '../../lib/fake-smtp';
import { requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';

function toDto(m: CapturedMail): OutboxMessage {
  return { id: m.id, receivedAt: m.receivedAt, from: m.from, to: m.to, replyTo: m.replyTo, subject: m.subject, text: m.text, html: m.html, links: m.links };
}

/**
 * GET /api/dev/outbox: the messages the local fake SMTP server received (office only; never
 * mounted in production). The fake is one per server process, so it holds every company's mail:
 * an office user sees only the messages their own company sent (the sender's organisation header),
 * never another company's mail to a shared address (a reset link to someone else's account).
 */
export function devOutboxRouter(deps: AppDeps) {
  const r = Router();
  r.use(requireAuth, requireCan('outbox:read'));
  r.get('/', async (req, res) => {
    const organisationId = req.user!.organisationId;
    const messages = (deps.outbox?.messages() ?? []).filter((m) => m.organisationId === organisationId);
    res.json({ enabled: !!deps.outbox, messages: messages.reverse().map(toDto) });
  });
  return r;
}
