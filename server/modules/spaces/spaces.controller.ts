import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/require-auth';
import type { createSpacesService } from './spaces.service';

export function createSpacesController(spaces: ReturnType<typeof createSpacesService>) {
  return {
    async create(req: Request, res: Response) {
      res.status(201).json({ space: await spaces.create(currentUser(req), String(req.params.id), req.body) });
    },
    async get(req: Request, res: Response) {
      res.json({ space: await spaces.get(currentUser(req), String(req.params.id)) });
    },
    async update(req: Request, res: Response) {
      res.json({ space: await spaces.update(currentUser(req), String(req.params.id), req.body) });
    },
    async remove(req: Request, res: Response) {
      await spaces.remove(currentUser(req), String(req.params.id));
      res.status(204).end();
    },
    async restore(req: Request, res: Response) {
      res.json({ space: await spaces.restore(currentUser(req), String(req.params.id)) });
    },
  };
}
