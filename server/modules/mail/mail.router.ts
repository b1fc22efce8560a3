import { Router } from 'express';
import { idParamsSchema } from '../../../shared/api/common';
import { requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { createMailController } from './mail.controller';
import type { MailService } from './mail.service';

/** /api/mail: the company's sent and waiting e-mail with its status, and sending a failed one again (office). */
export function mailRouter(service: MailService) {
  const c = createMailController(service);
  const r = Router();
  r.use(requireAuth, requireCan('outbox:read'));
  r.get('/messages', c.list);
  r.post('/messages/:id/resend', validate({ params: idParamsSchema }), c.resend);
  return r;
}
