import { Router, type NextFunction, type Request, type Response } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { loginBodySchema, requestResetBodySchema, setPasswordBodySchema } from '../../../shared/api/auth';
import type { AppDeps } from '../../deps';
import { requireAuth } from '../../middleware/require-auth';
import type { AppPassport } from '../../middleware/session';
import { validate } from '../../middleware/validate';
import { createAuthController } from './auth.controller';
import type { AuthService } from './auth.service';
import { pgLoginThrottles } from './login-limits-pg';

const tooMany = { error: { code: 'rate_limited', message: 'too many attempts; wait a few minutes and try again' } };

export function authRouter(deps: AppDeps, auth: AuthService, passport: AppPassport) {
  const c = createAuthController(auth, passport);
  // Failures per account and per address, each with a short back-off (login-throttle.ts), counted in
  // PostgreSQL so that every instance behind the load balancer sees the same failures.
  const throttles = pgLoginThrottles(deps.config.loginRateLimit, deps.pool);
  const keysOf = (req: Request) => ({
    account: String(req.body?.email ?? '')
      .trim()
      .toLowerCase(),
    address: ipKeyGenerator(req.ip ?? ''),
  });
  const loginThrottle = async (req: Request, res: Response, next: NextFunction) => {
    const keys = keysOf(req);
    const wait = Math.max(await throttles.account.waitMs(keys.account), await throttles.address.waitMs(keys.address));
    if (wait > 0) {
      res.setHeader('Retry-After', String(Math.ceil(wait / 1000)));
      res.status(429).json({ error: { code: 'rate_limited', message: `too many failed sign-ins; wait ${Math.ceil(wait / 1000)} s and try again` } });
      return;
    }
    // A success clears the account's count (a late clear is harmless).
    res.on('finish', () => {
      if (res.statusCode === 200) throttles.account.clear(keys.account).catch((err: Error) => req.log.warn(`sign-in limit not cleared: ${err.message}`));
    });
    // A failure is counted before the 401 goes out, so the next attempt, on any instance, sees it.
    c.login(req, res, (err?: unknown) => {
      if ((err as { status?: number } | undefined)?.status !== 401) return next(err);
      Promise.all([throttles.account.recordFailure(keys.account), throttles.address.recordFailure(keys.address)]).then(
        () => next(err),
        () => next(err),
      );
    });
  };
  const mailLimiter = rateLimit({
    windowMs: 15 * 60_000,
    limit: deps.config.loginRateLimit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    message: tooMany,
  });

  const r = Router();
  r.post('/login', validate({ body: loginBodySchema }), loginThrottle);
  // req.logout comes from passport's initialize (sign-in gets it from passport.authenticate).
  r.post('/logout', passport.initialize(), c.logout);
  r.get('/me', requireAuth, c.me);
  r.post('/request-reset', mailLimiter, validate({ body: requestResetBodySchema }), c.requestReset);
  r.post('/set-password', mailLimiter, validate({ body: setPasswordBodySchema }), c.setPassword);
  return r;
}
