import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/require-auth';
import type { createUsersService } from './users.service';

export function createUsersController(users: ReturnType<typeof createUsersService>) {
  return {
    async list(req: Request, res: Response) {
      res.json({ users: await users.list(currentUser(req)) });
    },
    async get(req: Request, res: Response) {
      res.json({ user: await users.get(currentUser(req), String(req.params.id)) });
    },
    async invite(req: Request, res: Response) {
      res.status(201).json({ user: await users.invite(currentUser(req), req.body) });
    },
    async resendInvite(req: Request, res: Response) {
      res.json({ user: await users.resendInvite(currentUser(req), String(req.params.id)) });
    },
    async update(req: Request, res: Response) {
      res.json({ user: await users.update(currentUser(req), String(req.params.id), req.body) });
    },
  };
}
