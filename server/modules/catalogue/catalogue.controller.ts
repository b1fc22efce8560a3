import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/require-auth';
import type { CatalogueService } from './catalogue.service';

type Table = CatalogueService[keyof CatalogueService];

/** Handlers for one catalogue table; `key` names the item in the response body (`product`, `extra`, `taxRate`). */
export function createCatalogueController(table: Table, key: string) {
  return {
    async list(req: Request, res: Response) {
      res.json({ items: await table.list(currentUser(req)) });
    },
    async create(req: Request, res: Response) {
      res.status(201).json({ [key]: await table.create(currentUser(req), req.body) });
    },
    async update(req: Request, res: Response) {
      res.json({ [key]: await table.update(currentUser(req), String(req.params.id), req.body) });
    },
    async remove(req: Request, res: Response) {
      await table.remove(currentUser(req), String(req.params.id));
      res.status(204).end();
    },
  };
}
