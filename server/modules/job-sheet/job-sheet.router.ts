import { Router } from 'express';
import { idParamsSchema } from '../../../shared/api/common';
import { noteBodySchema, tickBodySchema } from '../../../shared/api/job-sheet';
import type { AppDeps } from '../../deps';
import { requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { createJobSheetController, type JobSheetServices } from './job-sheet.controller';

/**
 * The installer's API. `myJobs` is mounted at /api/my-jobs; `jobSheet` is composed into the jobs
 * router, so its paths are under /api/jobs:
 *   GET  /:id/job-sheet        the job sheet (any role of the company; installers only their jobs)
 *   POST /:id/ticks            strip cut / strip laid / site check (Idempotency-Key)
 *   POST /:id/notes            a note (Idempotency-Key)
 *   GET  /:id/sheet.pdf        the job sheet as a PDF
 *   POST /:id/sheet/send       the office e-mails it to the assigned installer
 */
export function jobSheetRouters(deps: AppDeps, services: JobSheetServices) {
  const c = createJobSheetController(deps, services);
  const params = validate({ params: idParamsSchema });

  const myJobs = Router();
  myJobs.get('/', requireAuth, requireCan('jobsheet:work'), c.myJobs);

  const jobSheet = Router();
  jobSheet.get('/:id/job-sheet', requireAuth, params, c.sheet);
  jobSheet.post('/:id/ticks', requireAuth, params, validate({ body: tickBodySchema }), c.tick);
  jobSheet.post('/:id/notes', requireAuth, params, validate({ body: noteBodySchema }), c.note);
  jobSheet.get('/:id/sheet.pdf', requireAuth, params, c.pdf);
  jobSheet.post('/:id/sheet/send', requireAuth, requireCan('jobs:assign'), params, c.send);
  return { myJobs, jobSheet };
}
