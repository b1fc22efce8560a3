import { Router } from 'express';
import { idParamsSchema } from '../../../shared/api/common';
import { jobBodySchema, jobListQuerySchema, jobPatchSchema } from '../../../shared/api/jobs';
import type { AppDeps } from '../../deps';
import { requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { createJobsController } from './jobs.controller';
import { createJobsService } from './jobs.service';

/**
 * /api/jobs, the one router mounted there. Everyone signed in may list and read jobs; the service
 * limits installers to their assigned jobs (others → 404) and strips prices. Writing needs
 * `jobs:write`; assigning/scheduling `jobs:assign`. GET /:id has one shape for every role.
 *
 * `jobRouters` are the other modules' routes about one job (/:id/spaces, /:id/quotes,
 * /:id/job-sheet, ...), composed here by server/app.ts so this module imports none of them.
 */
export function jobsRouter(deps: AppDeps, jobRouters: Router[] = []) {
  const c = createJobsController(createJobsService(deps));
  const r = Router();
  r.use(requireAuth);
  r.get('/', validate({ query: jobListQuerySchema }), c.list);
  r.get('/installers', requireCan('jobs:read-all'), c.installers);
  r.post('/', requireCan('jobs:write'), validate({ body: jobBodySchema }), c.create);
  r.get('/:id', validate({ params: idParamsSchema }), c.get);
  r.patch('/:id', requireCan('jobs:write'), validate({ params: idParamsSchema, body: jobPatchSchema }), c.update);
  r.get('/:id/events', validate({ params: idParamsSchema }), c.events);
  for (const sub of jobRouters) r.use(sub);
  return r;
}
