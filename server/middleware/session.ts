import type { NextFunction, Request, RequestHandler, Response } from 'express';
import session from 'express-session';
import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { AppDeps } from '../deps';
import type { AuthService } from '../modules/auth/auth.service';
import type { SessionUser } from '../types';
import { createSessionStore } from './session-store';

export const SESSION_COOKIE = 'quiltline.sid';
export type AppPassport = InstanceType<typeof Passport>;
export const SESSION_MAX_AGE_MS = 7 * 24 * 3600_000;
/** A session in use has its expiry pushed forward once this much of its life has passed (one write a day, not one a request). */
export const SESSION_REFRESH_AFTER_MS = SESSION_MAX_AGE_MS / 7;

/**
 * Sliding expiry without a write per request: once a signed-in session's cookie has less than
 * (max age − refresh interval) left, the expiry is reset to the full age and the change marked, so
 * express-session stores the row and sends the cookie again.
 */
export function refreshSession(req: Request, _res: Response, next: NextFunction) {
  const s = req.session;
  const signedIn = (s as { passport?: { user?: string } } | undefined)?.passport?.user;
  if (signedIn && (s.cookie.maxAge ?? 0) < SESSION_MAX_AGE_MS - SESSION_REFRESH_AFTER_MS) {
    s.cookie.maxAge = SESSION_MAX_AGE_MS;
    s.refreshedAt = Date.now();
  }
  next();
}

/**
 * Sessions in PostgreSQL (connect-pg-simple), the signed-in user on req.user, and a passport
 * instance of this app's own for signing in and out (not the global one, so several apps in one test
 * process never share strategies).
 */
export function createSessionStack(deps: AppDeps, auth: AuthService) {
  const store = createSessionStore(deps.pool, { prune: deps.config.pruneSessions });

  const sessionMiddleware = session({
    name: SESSION_COOKIE,
    secret: deps.config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    // Not rolling: that rewrites the row on every request; refreshSession slides the expiry instead.
    rolling: false,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      // Secure whenever the request arrived over HTTPS (directly, or via a trusted proxy).
      secure: 'auto',
      maxAge: SESSION_MAX_AGE_MS,
    },
  });

  const passport = new Passport();
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      auth.verifyCredentials(email, password).then((user) => done(null, user ?? false), done);
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));

  /**
   * req.user from the session, as passport's session strategy would set it, without its per-request
   * set-up (a strategy object and half a dozen closures for every request). The store read the user
   * with the session row, checked afresh on every request: a deactivated user, or one whose sessions
   * were ended, is signed out at once (the user id is dropped from the session, as passport does).
   * A session the store did not load (regenerated during this request) asks the database.
   */
  function sessionUser(req: Request, _res: Response, next: NextFunction) {
    const s = req.session as (typeof req.session & { passport?: { user?: string } }) | undefined;
    const id = s?.passport?.user;
    if (!s || !id) return next();
    const loaded = s.loadedUser;
    const found = (user: SessionUser | null) => {
      if (user) req.user = user;
      else delete s.passport!.user;
      next();
    };
    if (loaded !== undefined && (loaded === null || loaded.id === id)) return found(loaded);
    auth.loadSessionUser(id).then(found, next);
  }

  const handlers: RequestHandler[] = [sessionMiddleware, refreshSession, sessionUser];
  return { handlers, passport, store };
}
