import { Router } from 'express';
import { idParamsSchema } from '../../../shared/api/common';
import { finishBodySchema } from '../../../shared/api/job-sheet';
import type { AppDeps } from '../../deps';
import { currentUser, requireAuth } from '../../middleware/require-auth';
import { validate } from '../../middleware/validate';
import { createHandoverService } from './handover.service';

/**
 * Finishing a job and its handover pack, composed into the jobs router (/api/jobs):
 *   POST /:id/finish          mark installed (a repeat gets 409 job_installed)
 *   GET  /:id/handover.pdf    the handover pack of an installed job
 */
export function handoverRouter(deps: AppDeps) {
  const handover = createHandoverService(deps);
  const params = validate({ params: idParamsSchema });
  const r = Router();
  r.post('/:id/finish', requireAuth, params, validate({ body: finishBodySchema }), async (req, res) => {
    // Not replayed by key: finishing has effects after its commit (the pack, the e-mail); a repeat is refused as already installed.
    res.json(await handover.finish(currentUser(req), String(req.params.id), req.body.reasons ?? {}));
  });
  r.get('/:id/handover.pdf', requireAuth, params, async (req, res) => {
    const { filename, pdf } = await handover.pdf(currentUser(req), String(req.params.id));
    res.set('Content-Type', 'application/pdf');
    res.set('Content-Disposition', `attachment; filename="${filename}"`);
    res.send(pdf);
  });
  return r;
}
