import { Router } from 'express';
import { z } from 'zod';
import { idSchema } from '../../../shared/api/common';
import { restoreRevisionBodySchema, savePlanBodySchema } from '../../../shared/api/spaces';
import type { AppDeps } from '../../deps';
import { receiveFile } from '../../lib/uploads';
import { requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { createPlansController } from './plans.controller';
import { BACKGROUND_MAX_BYTES, createPlansService } from './plans.service';

const params = z.object({ id: idSchema });
const revParams = z.object({ id: idSchema, rev: z.coerce.number().int().min(1) });
const fileParams = z.object({ id: idSchema, name: z.string().max(60) });

/** One image in field `image`, size-limited; every upload error a clear answer. */
const receiveImage = () =>
  receiveFile({
    field: 'image',
    maxBytes: BACKGROUND_MAX_BYTES,
    tooLarge: { code: 'image_too_large', message: `the underlay image is larger than ${BACKGROUND_MAX_BYTES / 1024 / 1024} MB; scan or export it smaller` },
  });

/**
 * The plan of a space and its revisions (mounted at /api/spaces beside the spaces router):
 * GET /:id/plan, PUT /:id/plan, GET /:id/revisions, GET /:id/revisions/:rev,
 * POST /:id/revisions/:rev/restore, POST /:id/background, GET /:id/background/:name.
 * Office and estimators write; installers read the plans of jobs assigned to them; other
 * companies' spaces are 404.
 */
export function plansRouter(deps: AppDeps) {
  const c = createPlansController(createPlansService(deps));
  const r = Router();
  const write = requireCan('plans:write');
  // The ordinary signed-in read is answered before this, with its session (plan-read-session.ts, mounted
  // in app.ts); this route answers the rest. A check added here belongs there too.
  r.get('/:id/plan', requireAuth, validate({ params }), c.get);
  r.put('/:id/plan', requireAuth, write, validate({ params, body: savePlanBodySchema }), c.save);
  r.get('/:id/revisions', requireAuth, validate({ params }), c.revisions);
  r.get('/:id/revisions/:rev', requireAuth, validate({ params: revParams }), c.revision);
  r.post('/:id/revisions/:rev/restore', requireAuth, write, validate({ params: revParams, body: restoreRevisionBodySchema }), c.restore);
  r.post('/:id/background', requireAuth, write, validate({ params }), c.visibleSpace, receiveImage(), c.uploadBackground);
  r.get('/:id/background/:name', requireAuth, validate({ params: fileParams }), c.background);
  return r;
}
