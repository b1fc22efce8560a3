import type { Request, Response } from 'express';
import { pipeToResponse } from '../../lib/storage/pipe-to-response';
import { currentUser } from '../../middleware/require-auth';
import type { SettingsService } from './settings.service';

export function createSettingsController(settings: SettingsService) {
  return {
    async get(req: Request, res: Response) {
      res.json({ settings: await settings.get(currentUser(req)) });
    },
    async update(req: Request, res: Response) {
      res.json({ settings: await settings.update(currentUser(req), req.body) });
    },
    async logo(req: Request, res: Response) {
      const logo = await settings.logo(currentUser(req));
      res.type(logo.type).setHeader('Cache-Control', 'no-cache');
      await pipeToResponse(res, logo.body);
    },
    async setLogo(req: Request, res: Response) {
      res.json({ settings: await settings.setLogo(currentUser(req), req.file) });
    },
    async removeLogo(req: Request, res: Response) {
      res.json({ settings: await settings.removeLogo(currentUser(req)) });
    },
  };
}
