import type { NextFunction, Request, Response } from 'express';
import type { LoginBody, Me, RequestResetBody, SetPasswordBody } from '../../../shared/api/auth';
import { UnauthorizedError } from '../../lib/errors';
import { currentUser } from '../../middleware/require-auth';
import { SESSION_COOKIE, type AppPassport } from '../../middleware/session';
import type { SessionUser } from '../../types';
import type { AuthService } from './auth.service';

export function toMe(u: SessionUser): Me {
  return { id: u.id, email: u.email, name: u.name, role: u.role, organisation: { id: u.organisationId, name: u.organisationName } };
}

export function createAuthController(auth: AuthService, passport: AppPassport) {
  return {
    login(req: Request<unknown, unknown, LoginBody>, res: Response, next: NextFunction) {
      passport.authenticate('local', { session: false }, (err: unknown, user: SessionUser | false) => {
        if (err) return next(err);
        if (!user) return next(new UnauthorizedError('that e-mail and password do not match an active account', 'invalid_credentials'));
        // passport 0.7 regenerates the session id here (no session fixation).
        req.login(user, (loginErr) => {
          if (loginErr) return next(loginErr);
          res.json({ user: toMe(user) });
        });
      })(req, res, next);
    },

    logout(req: Request, res: Response, next: NextFunction) {
      req.logout((err) => {
        if (err) return next(err);
        req.session.destroy((destroyErr) => {
          if (destroyErr) return next(destroyErr);
          res.clearCookie(SESSION_COOKIE);
          res.status(204).end();
        });
      });
    },

    me(req: Request, res: Response) {
      res.json({ user: toMe(currentUser(req)) });
    },

    /**
     * Answers at once with one body, and looks the address up and sends the mail afterwards: the
     * answer takes the same time, and says the same, whether or not an account has that address
     * and whether or not the mail server is up (a failure is logged for the operator only).
     */
    requestReset(req: Request<unknown, unknown, RequestResetBody>, res: Response) {
      res.json({ ok: true, message: 'if that address belongs to an account, a reset link is on its way' });
      auth
        .requestPasswordReset(req.body.email)
        .catch((e: unknown) => req.log.error(`password reset mail not sent: ${e instanceof Error ? e.message : String(e)}`));
    },

    async setPassword(req: Request<unknown, unknown, SetPasswordBody>, res: Response) {
      const { email } = await auth.setPasswordFromToken(req.body.token, req.body.password);
      res.json({ ok: true, email });
    },
  };
}
