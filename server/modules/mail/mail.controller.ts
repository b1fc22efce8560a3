import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/require-auth';
import type { MailService } from './mail.service';

/** HTTP only: reads the validated request, calls the mail service, shapes the response. */
export function createMailController(service: MailService) {
  return {
    async list(req: Request, res: Response) {
      res.json({ messages: await service.list(currentUser(req).organisationId) });
    },
    async resend(req: Request, res: Response) {
      res.status(202).json({ message: await service.resend(currentUser(req).organisationId, String(req.params.id)) });
    },
  };
}
