import DataLoader from 'dataloader';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type pg from 'pg';
import { idSchema } from '../../../shared/api/common';
import { can } from '../../../shared/auth/policies';
import { ROLES } from '../../../shared/auth/roles';
import { SESSION_COOKIE, SESSION_MAX_AGE_MS, SESSION_REFRESH_AFTER_MS } from '../../middleware/session';
import { sessionIdFromCookie } from '../../middleware/session-cookie';
import { sessionOf, sessionUserOf, sessionWithUserSql, type SessionUserRow } from '../../middleware/session-store';
import type { SessionUser } from '../../types';
import { planReadSql, visibleSpacePlan, type PlanReadRow } from './plan-read';
import { planAnswer } from './plans.service';

// Roles whose plan read leaves the takeoff body out (they compute it live): the one access rule
// decides, the statement only compares.
const WRITER_ROLES = ROLES.filter((role) => can({ role }, 'plans:write'));

// The session with its user, then that user's company's plan read: one statement and one round trip
// for what would otherwise be the session read and then the plan read, and one statement for all
// the plan reads that arrive together (VALUES numbers them, so each row says whose it is): each
// statement costs PostgreSQL and node a fixed price (a socket write and read, a wake-up, a portal)
// that is most of a single read's. VALUES rather than unnest of arrays: its row count is known to
// the generic plan, which PostgreSQL then keeps (for unnest it guesses ten rows and plans afresh on
// every call). OFFSET 0 keeps each side a lookup per row, never a join over every session or
// every space of the company. Each side comes back as one JSON column (the types as the pg driver
// would parse them: json as objects, text, numbers, booleans) and the revision's time as its own,
// a Date as ever: node-postgres describes and parses every column of every row afresh.
const sqlFor = (reads: number) => `
  SELECT req.i, to_json(who) AS who, to_json(plan_read) AS plan_read, plan_read."createdAt"
  FROM (VALUES ${Array.from({ length: reads }, (_, k) => `(${k}, $${2 * k + 2}::text, $${2 * k + 3}::uuid)`).join(', ')}) AS req(i, sid, space_id)
  CROSS JOIN LATERAL (${sessionWithUserSql('req.sid')} OFFSET 0) who
  LEFT JOIN LATERAL (${planReadSql({ spaceId: 'req.space_id', organisationId: 'who.organisation_id', withTakeoff: 'NOT (who.role = ANY($1::text[]))' })}
    OFFSET 0) plan_read ON true`;

interface Row {
  /** the read's place in the statement, from 0 */
  i: number;
  who: SessionUserRow;
  /** null when there is no such space in the user's company */
  plan_read: (Omit<PlanReadRow, 'createdAt'> & { createdAt: unknown }) | null;
  createdAt: Date | null;
}

interface Ask {
  sid: string;
  spaceId: string;
}

/** Plan reads waiting for the same statement: at most this many share one. */
const READS_PER_STATEMENT = 32;

/**
 * The reads asked for while the event loop polls sockets go out as one statement once it has
 * polled (setImmediate: the requests that arrived together, without waiting on any clock). Nothing
 * is cached: every read asks the database afresh.
 */
function planReadLoader(pool: pg.Pool): DataLoader<Ask, Row | undefined> {
  // One named statement per number of reads: each connection prepares a size on its first use.
  const statements = Array.from({ length: READS_PER_STATEMENT }, (_, k) => ({ name: `plan-read-session-${k + 1}`, text: sqlFor(k + 1) }));
  return new DataLoader<Ask, Row | undefined>(
    async (asks) => {
      const { rows } = await pool.query<Row>({ ...statements[asks.length - 1], values: [WRITER_ROLES, ...asks.flatMap((a) => [a.sid, a.spaceId])] });
      const answers: (Row | undefined)[] = new Array(asks.length);
      for (const row of rows) answers[row.i] = row;
      return answers;
    },
    { cache: false, batchScheduleFn: (dispatch) => setImmediate(dispatch), maxBatchSize: READS_PER_STATEMENT },
  );
}

/**
 * GET /api/spaces/:id/plan, the editor's read and the busiest authenticated GET, answered in one
 * round trip to the database (shared with the plan reads that arrive with it), ahead of express-session. It answers only the ordinary case: a
 * signed session cookie whose session names an active user, with no sliding-expiry refresh due,
 * and a space that user may see. Anything else (no or bad cookie, a refresh to store, a user to
 * sign out, a 404, a malformed id) is left to the usual stack, which reads again and decides,
 * so every answer other than this 200 comes from one place. The session is read afresh on every
 * request as there (a user deactivated through any instance is refused on their next read), and
 * nothing is written, as there for an unchanged session.
 */
export function planReadWithSession(pool: pg.Pool, sessionSecret: string): RequestHandler {
  const loader = planReadLoader(pool);
  return (req: Request, res: Response, next: NextFunction) => {
    const sid = sessionIdFromCookie(req.headers.cookie, SESSION_COOKIE, sessionSecret);
    const spaceId = idSchema.safeParse(req.params.id);
    if (!sid || !spaceId.success) return next();
    loader
      .load({ sid, spaceId: spaceId.data })
      .then((row) => {
        const user = row && ordinaryUser(row.who);
        const space = user && row.plan_read ? visibleSpacePlan(user, { ...row.plan_read, createdAt: row.createdAt }) : null;
        if (!user || !space) return next();
        req.user = user;
        res.json(planAnswer(user, space));
      })
      // A failure while answering goes to the error handler, as it would from the plans router.
      .catch(next);
  };
}

/** The session's user when express-session and refreshSession would change nothing for this request. */
function ordinaryUser(row: SessionUserRow): SessionUser | null {
  const sess = sessionOf(row);
  const named = (sess as { passport?: { user?: string } } | null)?.passport?.user;
  const expires = sess?.cookie?.expires ? new Date(sess.cookie.expires).getTime() : NaN;
  // refreshSession pushes the expiry forward once maxAge (expires − now) falls below this.
  if (!named || !(expires - Date.now() >= SESSION_MAX_AGE_MS - SESSION_REFRESH_AFTER_MS)) return null;
  return sessionUserOf(row, named);
}
