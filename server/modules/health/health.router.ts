import { Router } from 'express';
import type { AppDeps } from '../../deps';
import { checkReadiness } from './readiness';

/** GET /api/health → { ok, db }: liveness; 200 when the database answers, 503 when it does not. */
export function healthRouter(deps: AppDeps) {
  const r = Router();
  r.get('/', async (_req, res) => {
    let db = false;
    try {
      await deps.sequelize.query('SELECT 1');
      db = true;
    } catch {
      db = false;
    }
    res.status(db ? 200 : 503).json({ ok: db, db });
  });
  return r;
}

/**
 * GET /api/ready → { ready, checks, failing }: whether a load balancer should send this instance
 * traffic. 503 names what fails: the database, the mail queue, or a shutdown in progress.
 */
export function readyRouter(deps: AppDeps) {
  const r = Router();
  r.get('/', async (_req, res) => {
    const report = await checkReadiness(deps);
    res.setHeader('Cache-Control', 'no-store');
    res.status(report.ready ? 200 : 503).json(report);
  });
  return r;
}
