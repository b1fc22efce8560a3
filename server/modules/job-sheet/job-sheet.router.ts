import { Router, type Request, type Response } from 'express';
import { idParamsSchema } from '../../../shared/api/common';
import { IDEMPOTENCY_HEADER, noteBodySchema, tickBodySchema } from '../../../shared/api/job-sheet';
import type { AppDeps } from '../../deps';
import { readIdempotencyKey, runOnce, type StoredResult } from '../../lib/idempotency';
import { currentUser, requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { createJobSheetExportService } from './job-sheet-export.service';
import { createJobSheetService } from './job-sheet.service';
import { createSiteRecordsService } from './site-records.service';

/**
 * The installer's API. `myJobs` is mounted at /api/my-jobs; `jobSheet` is composed into the jobs
 * router, so its paths are under /api/jobs:
 *   GET  /:id/job-sheet        the job sheet (any role of the company; installers only their jobs)
 *   POST /:id/ticks            strip cut / strip laid / site check (Idempotency-Key)
 *   POST /:id/notes            a note (Idempotency-Key)
 *   GET  /:id/sheet.pdf        the job sheet as a PDF
 *   POST /:id/sheet/send       the office e-mails it to the assigned installer
 */
export function jobSheetRouters(deps: AppDeps) {
  const sheets = createJobSheetService(deps);
  const records = createSiteRecordsService(deps);
  const exports = createJobSheetExportService(deps, sheets);
  const params = validate({ params: idParamsSchema });

  /** Runs a write once per Idempotency-Key and answers with the stored (or fresh) result. */
  const once = (req: Request, res: Response, work: Parameters<typeof runOnce>[4]) =>
    runOnce(deps.sequelize, currentUser(req), readIdempotencyKey(req.get(IDEMPOTENCY_HEADER)), `${req.method} ${req.baseUrl}${req.path}`, work).then(
      (out: StoredResult & { replayed: boolean }) => {
        if (out.replayed) res.set('Idempotent-Replayed', 'true');
        res.status(out.status).json(out.body);
      },
    );

  const myJobs = Router();
  myJobs.get('/', requireAuth, requireCan('jobsheet:work'), async (req, res) => {
    res.json({ jobs: await sheets.myJobs(currentUser(req)) });
  });

  const jobSheet = Router();
  jobSheet.get('/:id/job-sheet', requireAuth, params, async (req, res) => {
    res.json({ sheet: await sheets.sheet(currentUser(req), String(req.params.id)) });
  });
  jobSheet.post('/:id/ticks', requireAuth, params, validate({ body: tickBodySchema }), (req, res) =>
    once(req, res, async (t) => ({ status: 200, body: { tick: await records.setTick(currentUser(req), String(req.params.id), req.body, t) } })),
  );
  jobSheet.post('/:id/notes', requireAuth, params, validate({ body: noteBodySchema }), (req, res) =>
    once(req, res, async (t) => ({ status: 201, body: { note: await records.addNote(currentUser(req), String(req.params.id), req.body, t) } })),
  );
  jobSheet.get('/:id/sheet.pdf', requireAuth, params, async (req, res) => {
    const { filename, pdf } = await exports.pdf(currentUser(req), String(req.params.id));
    res.type('application/pdf').setHeader('Content-Disposition', `inline; filename="${filename}"`);
    res.send(pdf);
  });
  jobSheet.post('/:id/sheet/send', requireAuth, requireCan('jobs:assign'), params, async (req, res) => {
    res.json(await exports.sendToInstaller(currentUser(req), String(req.params.id)));
  });
  return { myJobs, jobSheet };
}
