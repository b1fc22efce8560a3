import { Router } from 'express';
import { idParamsSchema } from '../../../shared/api/common';
import { inviteUserBodySchema, updateUserBodySchema } from '../../../shared/api/users';
import type { AppDeps } from '../../deps';
import { requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import type { AuthService } from '../auth/auth.service';
import { createUsersController } from './users.controller';
import { createUsersService } from './users.service';

/** Office only: list, invite by e-mail, change name/role/active. */
export function usersRouter(deps: AppDeps, auth: AuthService) {
  const c = createUsersController(createUsersService(deps, auth));
  const r = Router();
  r.use(requireAuth, requireCan('users:manage'));
  r.get('/', c.list);
  r.post('/', validate({ body: inviteUserBodySchema }), c.invite);
  r.get('/:id', validate({ params: idParamsSchema }), c.get);
  r.patch('/:id', validate({ params: idParamsSchema, body: updateUserBodySchema }), c.update);
  r.post('/:id/resend-invite', validate({ params: idParamsSchema }), c.resendInvite);
  return r;
}
