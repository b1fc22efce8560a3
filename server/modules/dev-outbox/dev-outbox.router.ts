import { Router } from 'express';
import type { OutboxMessage } from '../../../shared/api/outbox';
import type { AppDeps } from '../../deps';
import { Customer, User } from '../../db/models';
import type { CapturedMail } from '../../lib/fake-smtp';
import { requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';

function toDto(m: CapturedMail): OutboxMessage {
  return { id: m.id, receivedAt: m.receivedAt, from: m.from, to: m.to, subject: m.subject, text: m.text, html: m.html, links: m.links };
}

/**
 * GET /api/dev/outbox: the messages the local fake SMTP server received (office only; never
 * mounted in production). The fake is one per server process, so it holds every company's mail:
 * an office user only sees messages addressed to their own company's users and customers.
 */
export function devOutboxRouter(deps: AppDeps) {
  const r = Router();
  r.use(requireAuth, requireCan('outbox:read'));
  r.get('/', async (req, res) => {
    const organisationId = req.user!.organisationId;
    const users = await User.findAll({ where: { organisationId }, attributes: ['email'] });
    const customers = await Customer.findAll({ where: { organisationId }, attributes: ['email'] });
    const ours = new Set([...users, ...customers].map((x) => x.email.toLowerCase()).filter(Boolean));
    const messages = (deps.outbox?.messages() ?? []).filter((m) => m.envelopeTo.some((a) => ours.has(a.toLowerCase())));
    res.json({ enabled: !!deps.outbox, messages: messages.reverse().map(toDto) });
  });
  return r;
}
