import type { NextFunction, Request, Response } from 'express';
import { can, type Action } from '../../shared/auth/policies';
import { ForbiddenError, UnauthorizedError } from '../lib/errors';

/** 403 unless `can(user, action)` (shared/auth/policies.ts) — the same rule the UI uses. */
export function requireCan(action: Action) {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (!req.user) return next(new UnauthorizedError());
    if (!can(req.user, action)) return next(new ForbiddenError());
    next();
  };
}
