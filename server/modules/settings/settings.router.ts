import { Router, type Request, type Response } from 'express';
import { companySettingsBodySchema } from '../../../shared/api/settings';
import type { AppDeps } from '../../deps';
import { currentUser, requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { receiveFile } from '../../lib/uploads';
import { createSettingsService } from './settings.service';

/** Company settings: office changes them; estimators read them (they draft quotes); installers get 403. */
export function settingsRouter(deps: AppDeps) {
  const s = createSettingsService(deps.storage);
  const receiveLogo = receiveFile({
    field: 'logo',
    maxBytes: 1024 * 1024,
    tooLarge: { code: 'logo_too_large', message: 'the logo is larger than 1 MB; save it smaller (a few hundred pixels wide is plenty)' },
  });
  const r = Router();
  r.use(requireAuth, requireCan('prices:read'));
  r.get('/', async (req: Request, res: Response) => {
    res.json({ settings: await s.get(currentUser(req)) });
  });
  r.put('/', requireCan('settings:manage'), validate({ body: companySettingsBodySchema }), async (req: Request, res: Response) => {
    res.json({ settings: await s.update(currentUser(req), req.body) });
  });
  r.get('/logo', async (req: Request, res: Response) => {
    const logo = await s.logo(currentUser(req));
    res.type(logo.type).setHeader('Cache-Control', 'no-cache');
    res.send(logo.data);
  });
  r.post('/logo', requireCan('settings:manage'), receiveLogo, async (req: Request, res: Response) => {
    res.json({ settings: await s.setLogo(currentUser(req), req.file) });
  });
  r.delete('/logo', requireCan('settings:manage'), async (req: Request, res: Response) => {
    res.json({ settings: await s.removeLogo(currentUser(req)) });
  });
  return r;
}
