import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type pg from 'pg';
import type { Role } from '../../shared/auth/roles';
import type { SessionUser } from '../types';

declare module 'express-session' {
  interface SessionData {
    /** When the session's expiry was last pushed forward (ms since epoch); see refreshSession. */
    refreshedAt?: number;
    /**
     * The signed-in user as read with the session row in the same query (never stored: set()
     * leaves it out). null when the session names a user who is gone, inactive or has no company.
     */
    loadedUser?: SessionUser | null;
  }
}

/** A row of sessionWithUserSql. */
export interface SessionUserRow {
  sess: session.SessionData | string;
  user_id: string | null;
  email: string;
  user_name: string;
  role: Role;
  active: boolean;
  organisation_id: string | null;
  organisation_name: string;
}

/**
 * The session row with its user and company (one round trip per request instead of two), the
 * session's id in `sidParam`. The cast is on the session side so the users primary key is used.
 * Also the first part of the plan read that brings its session along (plans/plan-read-session.ts).
 */
export const sessionWithUserSql = (sidParam: string) => `
  SELECT s.sess, u.id AS user_id, u.email, u.name AS user_name, u.role, u.active, o.id AS organisation_id, o.name AS organisation_name
  FROM "session" s
  LEFT JOIN users u ON u.id = (s.sess->'passport'->>'user')::uuid
  LEFT JOIN organisations o ON o.id = u.organisation_id
  WHERE s.sid = ${sidParam} AND s.expire >= now()`;
const GET = sessionWithUserSql('$1');

/** The stored session (null when its JSON does not parse). */
export function sessionOf(row: SessionUserRow): session.SessionData | null {
  try {
    return typeof row.sess === 'string' ? (JSON.parse(row.sess) as session.SessionData) : row.sess;
  } catch {
    return null;
  }
}

/** The user the session names, when that user is still there, active and in a company; else null. */
export function sessionUserOf(row: SessionUserRow, named: string): SessionUser | null {
  return row.user_id === named && row.active && row.organisation_id
    ? { id: row.user_id, email: row.email, name: row.user_name, role: row.role, organisationId: row.organisation_id, organisationName: row.organisation_name }
    : null;
}

/**
 * connect-pg-simple's store (its table, writes and pruning) reading each session together with
 * its user. Touch is off: the expiry moves forward through refreshSession, not with a write on
 * every request.
 */
export function createSessionStore(pool: pg.Pool, opts: { prune: boolean }): session.Store {
  const PgStore = connectPgSimple(session);
  class UserLoadingStore extends PgStore {
    override get(sid: string, fn: (err: unknown, sess?: session.SessionData | null) => void) {
      // A named statement: parsed and planned once per connection, not on every request.
      pool.query<SessionUserRow>({ name: 'session-get', text: GET, values: [sid] }).then(
        ({ rows: [row] }) => {
          if (!row) return fn(null, null);
          const sess = sessionOf(row);
          if (!sess) return this.destroy(sid, (err) => fn(err, null));
          const named = (sess as { passport?: { user?: string } }).passport?.user;
          if (named) sess.loadedUser = sessionUserOf(row, named);
          fn(null, sess);
        },
        (err: unknown) => fn(err),
      );
    }

    override set(sid: string, sess: session.SessionData, fn?: (err?: unknown) => void) {
      const { loadedUser: _loaded, ...stored } = sess;
      super.set(sid, stored as session.SessionData, fn);
    }
  }
  return new UserLoadingStore({
    pool,
    tableName: 'session',
    createTableIfMissing: false,
    disableTouch: true,
    pruneSessionInterval: opts.prune ? 15 * 60 : false,
  });
}
