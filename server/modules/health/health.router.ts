import { Router } from 'express';
import type { AppDeps } from '../../deps';

/** GET /api/health → { ok, db }: 200 when the database answers, 503 when it does not. */
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
