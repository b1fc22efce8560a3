import type { NextFunction, Request, Response } from 'express';
import { UnauthorizedError } from '../lib/errors';
import type { SessionUser } from '../types';

/** 401 JSON unless a user is signed in. */
export function requireAuth(req: Request, _res: Response, next: NextFunction) {
  if (!req.user) return next(new UnauthorizedError());
  next();
}

/** The signed-in user; only call behind requireAuth. */
export function currentUser(req: Request): SessionUser {
  if (!req.user) throw new UnauthorizedError();
  return req.user;
}
