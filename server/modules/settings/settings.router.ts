import { Router } from 'express';
import { companySettingsBodySchema } from '../../../shared/api/settings';
import { requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { receiveFile } from '../../lib/uploads';
import { createSettingsController } from './settings.controller';
import type { SettingsService } from './settings.service';

/** Company settings: office changes them; estimators read them (they draft quotes); installers get 403. */
export function settingsRouter(settings: SettingsService) {
  const c = createSettingsController(settings);
  const receiveLogo = receiveFile({
    field: 'logo',
    maxBytes: 1024 * 1024,
    tooLarge: { code: 'logo_too_large', message: 'the logo is larger than 1 MB; save it smaller (a few hundred pixels wide is plenty)' },
  });
  const r = Router();
  r.use(requireAuth, requireCan('prices:read'));
  r.get('/', c.get);
  r.put('/', requireCan('settings:manage'), validate({ body: companySettingsBodySchema }), c.update);
  r.get('/logo', c.logo);
  r.post('/logo', requireCan('settings:manage'), receiveLogo, c.setLogo);
  r.delete('/logo', requireCan('settings:manage'), c.removeLogo);
  return r;
}
