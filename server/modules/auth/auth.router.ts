import { Router, type NextFunction, type Request, type Response } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { loginBodySchema, requestResetBodySchema, setPasswordBodySchema } from '../../../shared/api/auth';
import type { AppDeps } from '../../deps';
import { requireAuth } from '../../middleware/require-auth';
import type { AppPassport } from '../../middleware/session';
import { validate } from '../../middleware/validate';
import { createAuthController } from './auth.controller';
import type { AuthService } from './auth.service';
import { loginThrottles } from './login-throttle';

const tooMany = { error: { code: 'rate_limited', message: 'too many attempts; wait a few minutes and try again' } };

export function authRouter(deps: AppDeps, auth: AuthService, passport: AppPassport) {
  const c = createAuthController(auth, passport);
  // Failures per account and per address, each with a short back-off (login-throttle.ts).
  const throttles = loginThrottles(deps.config.loginRateLimit);
  const keysOf = (req: Request) => ({
    account: String(req.body?.email ?? '')
      .trim()
      .toLowerCase(),
    address: ipKeyGenerator(req.ip ?? ''),
  });
  const loginThrottle = (req: Request, res: Response, next: NextFunction) => {
    const keys = keysOf(req);
    const wait = Math.max(throttles.account.waitMs(keys.account), throttles.address.waitMs(keys.address));
    if (wait > 0) {
      res.setHeader('Retry-After', String(Math.ceil(wait / 1000)));
      res.status(429).json({ error: { code: 'rate_limited', message: `too many failed sign-ins; wait ${Math.ceil(wait / 1000)} s and try again` } });
      return;
    }
    res.on('finish', () => {
      if (res.statusCode === 401) {
        throttles.account.recordFailure(keys.account);
        throttles.address.recordFailure(keys.address);
      } else if (res.statusCode === 200) throttles.account.clear(keys.account);
    });
    next();
  };
  const mailLimiter = rateLimit({
    windowMs: 15 * 60_000,
    limit: deps.config.loginRateLimit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    message: tooMany,
  });

  const r = Router();
  r.post('/login', validate({ body: loginBodySchema }), loginThrottle, c.login);
  r.post('/logout', c.logout);
  r.get('/me', requireAuth, c.me);
  r.post('/request-reset', mailLimiter, validate({ body: requestResetBodySchema }), c.requestReset);
  r.post('/set-password', mailLimiter, validate({ body: setPasswordBodySchema }), c.setPassword);
  return r;
}
