import { Router } from 'express';
import { z } from 'zod';
import { applySuggestionBodySchema, editActualsBodySchema, reportQuerySchema } from '../../../shared/api/actuals';
import { idParamsSchema } from '../../../shared/api/common';
import { requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { createActualsController } from './actuals.controller';
import type { ActualsService } from './actuals.service';

/**
 * Estimate against actual, office only (`reports:read`; applying also `settings:manage`; correcting actuals `sitework:record`):
 *   GET  /api/jobs/:id/estimate-vs-actual      one job (composed into the jobs router)
 *   PUT  /api/jobs/:id/actuals                 corrects what was used (office; the installer until invoiced), expectedVersion or 409
 *   GET  /api/reports/estimate-vs-actual       ?from=&to= (finished dates), per-job rows and summary
 *   GET  /api/reports/suggestions              ?last=N: waste allowance and laying rates, and the changes applied
 *   POST /api/reports/suggestions/apply        sets the setting if the suggestion is still the one shown
 */
export function actualsRouters(service: ActualsService) {
  const c = createActualsController(service);
  const job = Router();
  job.get('/:id/estimate-vs-actual', requireAuth, requireCan('reports:read'), validate({ params: idParamsSchema }), c.job);
  job.put('/:id/actuals', requireAuth, requireCan('sitework:record'), validate({ params: idParamsSchema, body: editActualsBodySchema }), c.edit);
  const reports = Router();
  reports.use(requireAuth, requireCan('reports:read'));
  reports.get('/estimate-vs-actual', validate({ query: reportQuerySchema }), c.report);
  reports.get('/suggestions', validate({ query: z.object({ last: z.coerce.number().int().min(1).max(200).default(20) }) }), c.suggestions);
  reports.post('/suggestions/apply', requireCan('settings:manage'), validate({ body: applySuggestionBodySchema }), c.apply);
  return { job, reports };
}
