import { Router, type Request, type Response } from 'express';
import { idParamsSchema } from '../../../shared/api/common';
import type { MailRecord } from '../../../shared/api/mail';
import type { AppDeps } from '../../deps';
import { MailMessage } from '../../db/models';
import { requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';

function toRecord(m: MailMessage): MailRecord {
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

/** /api/mail: the company's sent and waiting e-mail with its status, and sending a failed one again (office). */
export function mailRouter(deps: AppDeps) {
  const r = Router();
  r.use(requireAuth, requireCan('outbox:read'));
  r.get('/messages', async (req: Request, res: Response) => {
    const rows = await MailMessage.findAll({ where: { organisationId: req.user!.organisationId }, order: [['createdAt', 'DESC']], limit: 100 });
    res.json({ messages: rows.map(toRecord) });
  });
  r.post('/messages/:id/resend', validate({ params: idParamsSchema }), async (req: Request, res: Response) => {
    const organisationId = req.user!.organisationId;
    await deps.mailQueue.resend(organisationId, String(req.params.id));
    const row = await MailMessage.findOne({ where: { id: String(req.params.id), organisationId } });
    res.status(202).json({ message: toRecord(row!) });
  });
  return r;
}
