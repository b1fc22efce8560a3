import { Router } from 'express';
import { assignBodySchema, installSettingsPatchSchema, scheduleQuerySchema } from '../../../shared/api/schedule';
import type { AppDeps } from '../../deps';
import { currentUser, requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { createScheduleService, loadInstallSettings, updateInstallSettings } from './schedule.service';

/** /api/schedule: the week view, booking, and the install settings (capacity, handover wording). */
export function scheduleRouter(deps: AppDeps) {
  const schedule = createScheduleService(deps);
  const r = Router();
  r.use(requireAuth);

  r.get('/', requireCan('jobs:read-all'), validate({ query: scheduleQuerySchema }), async (req, res) => {
    const q = req.query as { weekStart?: string };
    res.json(await schedule.week(currentUser(req), q.weekStart));
  });

  r.post('/assign', requireCan('jobs:assign'), validate({ body: assignBodySchema }), async (req, res) => {
    res.json(await schedule.assign(currentUser(req), req.body));
  });

  r.get('/settings', requireCan('jobs:read-all'), async (req, res) => {
    res.json({ settings: await loadInstallSettings(currentUser(req).organisationId) });
  });

  r.patch('/settings', requireCan('settings:manage'), validate({ body: installSettingsPatchSchema }), async (req, res) => {
    res.json({ settings: await updateInstallSettings(currentUser(req).organisationId, req.body) });
  });
  return r;
}
