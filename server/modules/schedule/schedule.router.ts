import { Router } from 'express';
import { assignBodySchema, installSettingsPatchSchema, scheduleQuerySchema } from '../../../shared/api/schedule';
import { requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { createScheduleController } from './schedule.controller';
import type { ScheduleService } from './schedule.service';

/** /api/schedule: the week view, booking, and the install settings (capacity, handover wording). */
export function scheduleRouter(schedule: ScheduleService) {
  const c = createScheduleController(schedule);
  const r = Router();
  r.use(requireAuth);
  r.get('/', requireCan('jobs:read-all'), validate({ query: scheduleQuerySchema }), c.week);
  r.post('/assign', requireCan('jobs:assign'), validate({ body: assignBodySchema }), c.assign);
  r.get('/settings', requireCan('jobs:read-all'), c.settings);
  r.patch('/settings', requireCan('settings:manage'), validate({ body: installSettingsPatchSchema }), c.updateSettings);
  return r;
}
