import type { NextFunction, Request, Response } from 'express';
import { can, type Action } from '../../shared/auth/policies';
import type { Role } from '../../shared/auth/roles';
import { ForbiddenError, UnauthorizedError } from '../lib/errors';

/** 403 unless the signed-in user's role is one of these. */
export function requireRole(...roles: Role[]) {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (!req.user) return next(new UnauthorizedError());
    if (!roles.includes(req.user.role)) return next(new ForbiddenError());
    next();
  };
}

/** 403 unless `can(user, action)` (shared/auth/policies.ts) — the same rule the UI uses. */
export function requireCan(action: Action) {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (!req.user) return next(new UnauthorizedError());
    if (!can(req.user, action)) return next(new ForbiddenError());
    next();
  };
}
