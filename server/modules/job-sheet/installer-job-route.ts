import type { NextFunction, Request, Response } from 'express';
import type { AppDeps } from '../../deps';
import { currentUser } from '../../middleware/require-auth';
import { createJobsService } from '../jobs/jobs.service';
import { createJobSheetService } from './job-sheet.service';

/**
 * Middleware for the jobs module's GET /api/jobs/:id: for an installer it answers with the job
 * (as the jobs module shapes it for installers) and the job sheet, both free of prices; for
 * everyone else it passes on to the jobs controller.
 */
export function installerJobRoute(deps: AppDeps) {
  const sheets = createJobSheetService(deps);
  const jobs = createJobsService(deps);
  return async (req: Request, res: Response, next: NextFunction) => {
    const user = currentUser(req);
    if (user.role !== 'installer') return next();
    const id = String(req.params.id);
    const sheet = await sheets.sheet(user, id);
    res.json({ job: await jobs.get(user, id), sheet });
  };
}
