import type { NextFunction, Request, Response } from 'express';
import { pipeToResponse } from '../../lib/storage/pipe-to-response';
import { currentUser } from '../../middleware/require-auth';
import type { PlansService } from './plans.service';

/** HTTP only: the service does the rest. */
export function createPlansController(plans: PlansService) {
  const id = (req: Request) => String(req.params.id);
  return {
    /** Middleware: refuse before reading a large body when the space is not one this user may see. */
    async visibleSpace(req: Request, _res: Response, next: NextFunction) {
      await plans.assertVisible(currentUser(req), id(req));
      next();
    },
    async get(req: Request, res: Response) {
      res.json(await plans.get(currentUser(req), id(req)));
    },
    async save(req: Request, res: Response) {
      res.status(201).json(await plans.save(currentUser(req), id(req), req.body));
    },
    async revisions(req: Request, res: Response) {
      res.json({ items: await plans.revisions(currentUser(req), id(req)) });
    },
    async revision(req: Request, res: Response) {
      res.json(await plans.revision(currentUser(req), id(req), Number(req.params.rev)));
    },
    async restore(req: Request, res: Response) {
      res.status(201).json(await plans.restore(currentUser(req), id(req), Number(req.params.rev), req.body?.baseRevision));
    },
    async uploadBackground(req: Request, res: Response) {
      res.status(201).json(await plans.uploadBackground(currentUser(req), id(req), req.file));
    },
    async background(req: Request, res: Response) {
      const { stream, type } = await plans.background(currentUser(req), id(req), String(req.params.name));
      res.setHeader('Content-Type', type);
      res.setHeader('Cache-Control', 'private, max-age=86400');
      await pipeToResponse(res, stream);
    },
  };
}
