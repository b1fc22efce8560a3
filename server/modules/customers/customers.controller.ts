import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/require-auth';
import type { createCustomersService } from './customers.service';

export function createCustomersController(customers: ReturnType<typeof createCustomersService>) {
  return {
    async list(req: Request, res: Response) {
      res.json({ customers: await customers.list(currentUser(req), req.query as never) });
    },
    async get(req: Request, res: Response) {
      res.json({ customer: await customers.get(currentUser(req), String(req.params.id)) });
    },
    async create(req: Request, res: Response) {
      res.status(201).json({ customer: await customers.create(currentUser(req), req.body) });
    },
    async update(req: Request, res: Response) {
      res.json({ customer: await customers.update(currentUser(req), String(req.params.id), req.body) });
    },
    async remove(req: Request, res: Response) {
      await customers.remove(currentUser(req), String(req.params.id));
      res.status(204).end();
    },
  };
}
