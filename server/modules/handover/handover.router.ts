import { Router } from 'express';
import { idParamsSchema } from '../../../shared/api/common';
import { finishBodySchema } from '../../../shared/api/job-sheet';
import type { AppDeps } from '../../deps';
import { requireAuth } from '../../middleware/require-auth';
import { validate } from '../../middleware/validate';
import { createHandoverController } from './handover.controller';
import type { HandoverService } from './handover.service';

/**
 * Finishing a job and its handover pack, composed into the jobs router (/api/jobs):
 *   POST /:id/finish          mark installed, with the actuals (a resend with the same Idempotency-Key is answered as done; another repeat gets 409 job_installed)
 *   GET  /:id/handover.pdf    the handover pack of an installed job
 */
export function handoverRouter(_deps: AppDeps, handover: HandoverService) {
  const c = createHandoverController(handover);
  const params = validate({ params: idParamsSchema });
  const r = Router();
  r.post('/:id/finish', requireAuth, params, validate({ body: finishBodySchema }), c.finish);
  r.get('/:id/handover.pdf', requireAuth, params, c.pdf);
  return r;
}
