import type { Request, Response } from 'express';
import type { ReportQuery } from '../../../shared/api/actuals';
import { currentUser } from '../../middleware/require-auth';
import type { ActualsService } from './actuals.service';

export function createActualsController(actuals: ActualsService) {
  return {
    async job(req: Request, res: Response) {
      res.json(await actuals.job(currentUser(req), String(req.params.id)));
    },
    async edit(req: Request, res: Response) {
      res.json({ actuals: await actuals.edit(currentUser(req), String(req.params.id), req.body) });
    },
    async report(req: Request, res: Response) {
      res.json(await actuals.report(currentUser(req), req.query as unknown as Required<ReportQuery>));
    },
    async suggestions(req: Request, res: Response) {
      res.json({ suggestions: await actuals.suggestions(currentUser(req), Number(req.query.last ?? 20)), history: await actuals.history(currentUser(req)) });
    },
    async apply(req: Request, res: Response) {
      res.json(await actuals.apply(currentUser(req), req.body));
    },
  };
}
