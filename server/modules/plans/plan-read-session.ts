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
// for what would otherwise be the session read and then the plan read. Each side comes back as one
// JSON column (the types as the pg driver would parse them: json as objects, text, numbers, booleans)
// and the revision's time as its own, a Date as ever: node-postgres describes and parses every column
// of every row afresh, and 3 columns instead of 22 is about a tenth less of its time on this read.
const SQL = `
  WITH who AS (${sessionWithUserSql('$1')})
  SELECT to_json(who) AS who, to_json(plan_read) AS plan_read, plan_read."createdAt"
  FROM who LEFT JOIN LATERAL (${planReadSql({ spaceId: '$2', organisationId: 'who.organisation_id', withTakeoff: 'NOT (who.role = ANY($3::text[]))' })}) plan_read ON true`;

interface Row {
  who: SessionUserRow;
  /** null when there is no such space in the user's company */
  plan_read: (Omit<PlanReadRow, 'createdAt'> & { createdAt: unknown }) | null;
  createdAt: Date | null;
}

/**
 * GET /api/spaces/:id/plan, the editor's read and the busiest authenticated GET, answered in one
 * round trip to the database, ahead of express-session. It answers only the ordinary case: a
 * signed session cookie whose session names an active user, with no sliding-expiry refresh due,
 * and a space that user may see. Anything else (no or bad cookie, a refresh to store, a user to
 * sign out, a 404, a malformed id) is left to the usual stack, which reads again and decides,
 * so every answer other than this 200 comes from one place. The session is read afresh on every
 * request as there (a user deactivated through any instance is refused on their next read), and
 * nothing is written, as there for an unchanged session.
 */
export function planReadWithSession(pool: pg.Pool, sessionSecret: string): RequestHandler {
  return (req: Request, res: Response, next: NextFunction) => {
    const sid = sessionIdFromCookie(req.headers.cookie, SESSION_COOKIE, sessionSecret);
    const spaceId = idSchema.safeParse(req.params.id);
    if (!sid || !spaceId.success) return next();
    pool
      .query<Row>({ name: 'plan-read-session', text: SQL, values: [sid, spaceId.data, WRITER_ROLES] })
      .then(({ rows: [row] }) => {
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
