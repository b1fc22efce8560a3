import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/require-auth';
import type { ScheduleService } from './schedule.service';

export function createScheduleController(schedule: ScheduleService) {
  return {
    async week(req: Request, res: Response) {
      const q = req.query as { weekStart?: string };
      res.json(await schedule.week(currentUser(req), q.weekStart));
    },
    async assign(req: Request, res: Response) {
      res.json(await schedule.assign(currentUser(req), req.body));
    },
    async settings(req: Request, res: Response) {
      res.json({ settings: await schedule.installSettings(currentUser(req)) });
    },
    async updateSettings(req: Request, res: Response) {
      res.json({ settings: await schedule.updateInstallSettings(currentUser(req), req.body) });
    },
  };
}
