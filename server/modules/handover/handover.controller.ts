import type { Request, Response } from 'express';
import { IDEMPOTENCY_HEADER } from '../../../shared/api/job-sheet';
import { readIdempotencyKey } from '../../lib/idempotency';
import { currentUser } from '../../middleware/require-auth';
import type { HandoverService } from './handover.service';

export function createHandoverController(handover: HandoverService) {
  return {
    async finish(req: Request, res: Response) {
      // Not replayed from the idempotency store: finishing has effects after its commit (the pack, the e-mail). The key is kept on
      // the completion instead, so a resend with the same key is answered as done; any other repeat is refused as already installed.
      const out = await handover.finish(currentUser(req), String(req.params.id), req.body, readIdempotencyKey(req.get(IDEMPOTENCY_HEADER)));
      if (out.replayed) res.set('Idempotent-Replayed', 'true');
      res.json(out);
    },
    async pdf(req: Request, res: Response) {
      const { filename, pdf } = await handover.pdf(currentUser(req), String(req.params.id));
      res.set('Content-Type', 'application/pdf');
      res.set('Content-Disposition', `attachment; filename="${filename}"`);
      res.send(pdf);
    },
  };
}
