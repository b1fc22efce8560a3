import { Router } from 'express';
import { idParamsSchema } from '../../../shared/api/common';
import { spaceCreateBodySchema, spacePatchSchema } from '../../../shared/api/spaces';
import type { AppDeps } from '../../deps';
import { requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { createSpacesController } from './spaces.controller';
import { createSpacesService } from './spaces.service';

/**
 * `spaces`: GET/PATCH/DELETE /api/spaces/:id (a soft delete) and POST /api/spaces/:id/restore; `jobSpaces`: POST /api/jobs/:id/spaces (composed
 * into the jobs router). The plan and its revisions (/api/spaces/:id/plan, /revisions) belong to
 * server/modules/plans.
 */
export function spacesRouters(deps: AppDeps) {
  const c = createSpacesController(createSpacesService(deps));
  const spaces = Router();
  spaces.use(requireAuth);
  spaces.get('/:id', validate({ params: idParamsSchema }), c.get);
  spaces.patch('/:id', requireCan('plans:write'), validate({ params: idParamsSchema, body: spacePatchSchema }), c.update);
  spaces.delete('/:id', requireCan('plans:write'), validate({ params: idParamsSchema }), c.remove);
  spaces.post('/:id/restore', requireCan('plans:write'), validate({ params: idParamsSchema }), c.restore);

  const jobSpaces = Router();
  jobSpaces.post('/:id/spaces', requireAuth, requireCan('plans:write'), validate({ params: idParamsSchema, body: spaceCreateBodySchema }), c.create);
  return { spaces, jobSpaces };
}
