import { Router } from 'express';
import { z } from 'zod';
import { applySuggestionBodySchema, reportQuerySchema } from '../../../shared/api/actuals';
import { idParamsSchema } from '../../../shared/api/common';
import { requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { createActualsController } from './actuals.controller';
import type { ActualsService } from './actuals.service';

/**
 * Estimate against actual, office only (`reports:read`; applying also `settings:manage`):
 *   GET  /api/jobs/:id/estimate-vs-actual      one job (composed into the jobs router)
 *   GET  /api/reports/estimate-vs-actual       ?from=&to= (finished dates), per-job rows and summary
 *   GET  /api/reports/suggestions              ?last=N: waste allowance and laying rates, and the changes applied
 *   POST /api/reports/suggestions/apply        sets the setting if the suggestion is still the one shown
 */
export function actualsRouters(service: ActualsService) {
  const c = createActualsController(service);
  const job = Router();
  job.get('/:id/estimate-vs-actual', requireAuth, requireCan('reports:read'), validate({ params: idParamsSchema }), c.job);
  const reports = Router();
  reports.use(requireAuth, requireCan('reports:read'));
  reports.get('/estimate-vs-actual', validate({ query: reportQuerySchema }), c.report);
  reports.get('/suggestions', validate({ query: z.object({ last: z.coerce.number().int().min(1).max(200).default(20) }) }), c.suggestions);
  reports.post('/suggestions/apply', requireCan('settings:manage'), validate({ body: applySuggestionBodySchema }), c.apply);
  return { job, reports };
}
