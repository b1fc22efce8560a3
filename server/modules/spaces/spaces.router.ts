import { Router } from 'express';
import { idParamsSchema } from '../../../shared/api/common';
import { spacePatchSchema } from '../../../shared/api/spaces';
import type { AppDeps } from '../../deps';
import { requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { createSpacesController } from './spaces.controller';
import { createSpacesService } from './spaces.service';

/**
 * GET/PATCH/DELETE /api/spaces/:id (POST lives under /api/jobs/:id/spaces). The plan and its
 * revisions (/api/spaces/:id/plan, /revisions) belong to server/modules/plans.
 */
export function spacesRouter(deps: AppDeps) {
  const c = createSpacesController(createSpacesService(deps));
  const r = Router();
  r.use(requireAuth);
  r.get('/:id', validate({ params: idParamsSchema }), c.get);
  r.patch('/:id', requireCan('plans:write'), validate({ params: idParamsSchema, body: spacePatchSchema }), c.update);
  r.delete('/:id', requireCan('plans:write'), validate({ params: idParamsSchema }), c.remove);
  return r;
}
