import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/require-auth';
import type { createJobsService } from './jobs.service';

export function createJobsController(jobs: ReturnType<typeof createJobsService>) {
  return {
    async list(req: Request, res: Response) {
      res.json(await jobs.list(currentUser(req), req.query as never));
    },
    async get(req: Request, res: Response) {
      res.json({ job: await jobs.get(currentUser(req), String(req.params.id)) });
    },
    async create(req: Request, res: Response) {
      res.status(201).json({ job: await jobs.create(currentUser(req), req.body) });
    },
    async update(req: Request, res: Response) {
      res.json({ job: await jobs.update(currentUser(req), String(req.params.id), req.body) });
    },
    async events(req: Request, res: Response) {
      res.json({ events: await jobs.events(currentUser(req), String(req.params.id)) });
    },
    async installers(req: Request, res: Response) {
      res.json({ installers: await jobs.installers(currentUser(req)) });
    },
  };
}
