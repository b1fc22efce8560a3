import { Router } from 'express';
import { idParamsSchema } from '../../../shared/api/common';
import { jobBodySchema, jobListQuerySchema, jobPatchSchema } from '../../../shared/api/jobs';
import { spaceCreateBodySchema } from '../../../shared/api/spaces';
import type { AppDeps } from '../../deps';
import { requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { createSpacesController } from '../spaces/spaces.controller';
import { createSpacesService } from '../spaces/spaces.service';
import { installerJobRoute } from '../job-sheet/installer-job-route';
import { createJobsController } from './jobs.controller';
import { createJobsService } from './jobs.service';

/**
 * Everyone signed in may list and read jobs; the service limits installers to their assigned jobs
 * (others → 404) and strips prices. Writing needs `jobs:write`; assigning/scheduling `jobs:assign`.
 */
export function jobsRouter(deps: AppDeps) {
  const c = createJobsController(createJobsService(deps));
  const spaces = createSpacesController(createSpacesService(deps));
  const r = Router();
  r.use(requireAuth);
  r.get('/', validate({ query: jobListQuerySchema }), c.list);
  r.get('/installers', requireCan('jobs:read-all'), c.installers);
  r.post('/', requireCan('jobs:write'), validate({ body: jobBodySchema }), c.create);
  // An installer's GET /:id also carries the job sheet (no prices); others fall through to c.get
  r.get('/:id', validate({ params: idParamsSchema }), installerJobRoute(deps), c.get);
  r.patch('/:id', requireCan('jobs:write'), validate({ params: idParamsSchema, body: jobPatchSchema }), c.update);
  r.get('/:id/events', validate({ params: idParamsSchema }), c.events);
  r.post('/:id/spaces', requireCan('plans:write'), validate({ params: idParamsSchema, body: spaceCreateBodySchema }), spaces.create);
  return r;
}
