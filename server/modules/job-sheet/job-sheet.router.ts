import { Router, type Request, type Response } from 'express';
import { idParamsSchema } from '../../../shared/api/common';
import { finishBodySchema, IDEMPOTENCY_HEADER, noteBodySchema, tickBodySchema } from '../../../shared/api/job-sheet';
import type { AppDeps } from '../../deps';
import { currentUser, requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { createHandoverService } from '../handover/handover.service';
import { readIdempotencyKey, runOnce, type StoredResult } from './idempotency';
import { createJobSheetService } from './job-sheet.service';
import { createSiteRecordsService } from './site-records.service';

/**
 * The installer's API, mounted at /api:
 *   GET  /my-jobs                  the installer's own jobs
 *   GET  /jobs/:id/job-sheet       the job sheet (any role of the company; installers only their jobs)
 *   POST /jobs/:id/ticks           strip cut / strip laid / site check (Idempotency-Key)
 *   POST /jobs/:id/notes           a note (Idempotency-Key)
 *   POST /jobs/:id/finish          mark installed (a repeat gets 409 job_installed)
 *   GET  /jobs/:id/handover.pdf    the handover pack of an installed job
 */
export function jobSheetRouter(deps: AppDeps) {
  const sheets = createJobSheetService(deps);
  const records = createSiteRecordsService(deps);
  const handover = createHandoverService(deps);
  const r = Router();
  const params = validate({ params: idParamsSchema });

  /** Runs a write once per Idempotency-Key and answers with the stored (or fresh) result. */
  const once = (req: Request, res: Response, work: Parameters<typeof runOnce>[4]) =>
    runOnce(deps.sequelize, currentUser(req), readIdempotencyKey(req.get(IDEMPOTENCY_HEADER)), `${req.method} ${req.baseUrl}${req.path}`, work).then(
      (out: StoredResult & { replayed: boolean }) => {
        if (out.replayed) res.set('Idempotent-Replayed', 'true');
        res.status(out.status).json(out.body);
      },
    );

  r.get('/my-jobs', requireAuth, requireCan('jobsheet:work'), async (req, res) => {
    res.json({ jobs: await sheets.myJobs(currentUser(req)) });
  });

  r.get('/jobs/:id/job-sheet', requireAuth, params, async (req, res) => {
    res.json({ sheet: await sheets.sheet(currentUser(req), String(req.params.id)) });
  });

  r.post('/jobs/:id/ticks', requireAuth, params, validate({ body: tickBodySchema }), (req, res) =>
    once(req, res, async (t) => ({ status: 200, body: { tick: await records.setTick(currentUser(req), String(req.params.id), req.body, t) } })),
  );

  r.post('/jobs/:id/notes', requireAuth, params, validate({ body: noteBodySchema }), (req, res) =>
    once(req, res, async (t) => ({ status: 201, body: { note: await records.addNote(currentUser(req), String(req.params.id), req.body, t) } })),
  );

  r.post('/jobs/:id/finish', requireAuth, params, validate({ body: finishBodySchema }), async (req, res) => {
    // Not replayed by key: finishing has effects after its commit (the pack, the e-mail); a repeat is refused as already installed.
    const user = currentUser(req);
    res.json(await handover.finish(user, String(req.params.id), req.body.reasons ?? {}));
  });

  r.get('/jobs/:id/handover.pdf', requireAuth, params, async (req, res) => {
    const { filename, pdf } = await handover.pdf(currentUser(req), String(req.params.id));
    res.set('Content-Type', 'application/pdf');
    res.set('Content-Disposition', `attachment; filename="${filename}"`);
    res.send(pdf);
  });
  return r;
}
