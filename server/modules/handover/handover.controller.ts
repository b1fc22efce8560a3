import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/require-auth';
import type { HandoverService } from './handover.service';

export function createHandoverController(handover: HandoverService) {
  return {
    async finish(req: Request, res: Response) {
      // Not replayed by key: finishing has effects after its commit (the pack, the e-mail); a repeat is refused as already installed.
      res.json(await handover.finish(currentUser(req), String(req.params.id), req.body.reasons ?? {}));
    },
    async pdf(req: Request, res: Response) {
      const { filename, pdf } = await handover.pdf(currentUser(req), String(req.params.id));
      res.set('Content-Type', 'application/pdf');
      res.set('Content-Disposition', `attachment; filename="${filename}"`);
      res.send(pdf);
    },
  };
}
