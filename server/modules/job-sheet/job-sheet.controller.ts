import type { Request, Response } from 'express';
import { IDEMPOTENCY_HEADER } from '../../../shared/api/job-sheet';
import type { AppDeps } from '../../deps';
import { readIdempotencyKey, runOnce, type StoredResult } from '../../lib/idempotency';
import { currentUser } from '../../middleware/require-auth';
import type { createJobSheetExportService } from './job-sheet-export.service';
import type { JobSheetService } from './job-sheet.service';
import type { SiteRecordsService } from './site-records.service';

export type JobSheetServices = {
  sheets: JobSheetService;
  records: SiteRecordsService;
  exports: ReturnType<typeof createJobSheetExportService>;
};

export function createJobSheetController(deps: Pick<AppDeps, 'sequelize'>, { sheets, records, exports }: JobSheetServices) {
  /** Runs a write once per Idempotency-Key and answers with the stored (or fresh) result. */
  const once = (req: Request, res: Response, work: Parameters<typeof runOnce>[4]) =>
    runOnce(deps.sequelize, currentUser(req), readIdempotencyKey(req.get(IDEMPOTENCY_HEADER)), `${req.method} ${req.baseUrl}${req.path}`, work).then(
      (out: StoredResult & { replayed: boolean }) => {
        if (out.replayed) res.set('Idempotent-Replayed', 'true');
        res.status(out.status).json(out.body);
      },
    );

  return {
    async myJobs(req: Request, res: Response) {
      res.json({ jobs: await sheets.myJobs(currentUser(req)) });
    },
    async sheet(req: Request, res: Response) {
      res.json({ sheet: await sheets.sheet(currentUser(req), String(req.params.id)) });
    },
    tick(req: Request, res: Response) {
      return once(req, res, async (t) => ({ status: 200, body: { tick: await records.setTick(currentUser(req), String(req.params.id), req.body, t) } }));
    },
    note(req: Request, res: Response) {
      return once(req, res, async (t) => ({ status: 201, body: { note: await records.addNote(currentUser(req), String(req.params.id), req.body, t) } }));
    },
    async pdf(req: Request, res: Response) {
      const { filename, pdf } = await exports.pdf(currentUser(req), String(req.params.id));
      res.type('application/pdf').setHeader('Content-Disposition', `inline; filename="${filename}"`);
      res.send(pdf);
    },
    async send(req: Request, res: Response) {
      res.json(await exports.sendToInstaller(currentUser(req), String(req.params.id)));
    },
  };
}
