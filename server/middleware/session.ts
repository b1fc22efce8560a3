import connectPgSimple from 'connect-pg-simple';
import type { RequestHandler } from 'express';
import session from 'express-session';
import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { AppDeps } from '../deps';
import type { AuthService } from '../modules/auth/auth.service';

export const SESSION_COOKIE = 'quiltline.sid';
export type AppPassport = InstanceType<typeof Passport>;

/**
 * Sessions in PostgreSQL (connect-pg-simple) and a passport instance of this app's own
 * (not the global one, so several apps in one test process never share strategies).
 */
export function createSessionStack(deps: AppDeps, auth: AuthService) {
  const PgStore = connectPgSimple(session);
  const store = new PgStore({
    pool: deps.pool,
    tableName: 'session',
    createTableIfMissing: false,
    pruneSessionInterval: deps.config.pruneSessions ? 15 * 60 : false,
  });

  const sessionMiddleware = session({
    name: SESSION_COOKIE,
    secret: deps.config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      // Secure whenever the request arrived over HTTPS (directly, or via a trusted proxy).
      secure: 'auto',
      maxAge: 7 * 24 * 3600_000,
    },
  });

  const passport = new Passport();
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      auth.verifyCredentials(email, password).then((user) => done(null, user ?? false), done);
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  passport.deserializeUser((id: string, done) => {
    auth.loadSessionUser(id).then((user) => done(null, user ?? false), done);
  });

  const handlers: RequestHandler[] = [sessionMiddleware, passport.initialize(), passport.session()];
  return { handlers, passport, store };
}
