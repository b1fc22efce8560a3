import { Router } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { loginBodySchema, requestResetBodySchema, setPasswordBodySchema } from '../../../shared/api/auth';
import type { AppDeps } from '../../deps';
import { requireAuth } from '../../middleware/require-auth';
import type { AppPassport } from '../../middleware/session';
import { validate } from '../../middleware/validate';
import { createAuthController } from './auth.controller';
import type { AuthService } from './auth.service';

const tooMany = { error: { code: 'rate_limited', message: 'too many attempts; wait a few minutes and try again' } };

export function authRouter(deps: AppDeps, auth: AuthService, passport: AppPassport) {
  const c = createAuthController(auth, passport);
  // Per address and e-mail: a guesser is slowed down without locking out a whole office behind one IP.
  const loginLimiter = rateLimit({
    windowMs: 15 * 60_000,
    limit: deps.config.loginRateLimit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String(req.body?.email ?? '').toLowerCase()}`,
    message: tooMany,
  });
  const mailLimiter = rateLimit({
    windowMs: 15 * 60_000,
    limit: deps.config.loginRateLimit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    message: tooMany,
  });

  const r = Router();
  r.post('/login', loginLimiter, validate({ body: loginBodySchema }), c.login);
  r.post('/logout', c.logout);
  r.get('/me', requireAuth, c.me);
  r.post('/request-reset', mailLimiter, validate({ body: requestResetBodySchema }), c.requestReset);
  r.post('/set-password', mailLimiter, validate({ body: setPasswordBodySchema }), c.setPassword);
  return r;
}
