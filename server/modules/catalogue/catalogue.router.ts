import { Router, type Request, type Response } from 'express';
import type { z } from 'zod';
import { idParamsSchema } from '../../../shared/api/common';
import { extraBodySchema, productBodySchema, taxRateBodySchema } from '../../../shared/api/settings';
import type { AppDeps } from '../../deps';
import { currentUser, requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { catalogueServices } from './catalogue.service';

const SCHEMAS: Record<keyof typeof catalogueServices, { body: z.ZodObject; key: string }> = {
  products: { body: productBodySchema, key: 'product' },
  extras: { body: extraBodySchema, key: 'extra' },
  'tax-rates': { body: taxRateBodySchema, key: 'taxRate' },
};

/**
 * /api/catalogue/{products,extras,tax-rates}: office edits; estimators read (they price drafts);
 * installers never see prices (403).
 */
export function catalogueRouter(_deps: AppDeps) {
  const r = Router();
  r.use(requireAuth, requireCan('prices:read'));
  for (const [name, service] of Object.entries(catalogueServices)) {
    const { body, key } = SCHEMAS[name as keyof typeof catalogueServices];
    r.get(`/${name}`, async (req: Request, res: Response) => {
      res.json({ items: await service.list(currentUser(req)) });
    });
    r.post(`/${name}`, requireCan('settings:manage'), validate({ body }), async (req: Request, res: Response) => {
      res.status(201).json({ [key]: await service.create(currentUser(req), req.body) });
    });
    r.patch(`/${name}/:id`, requireCan('settings:manage'), validate({ params: idParamsSchema, body: body.partial() }), async (req: Request, res: Response) => {
      res.json({ [key]: await service.update(currentUser(req), String(req.params.id), req.body) });
    });
    r.delete(`/${name}/:id`, requireCan('settings:manage'), validate({ params: idParamsSchema }), async (req: Request, res: Response) => {
      await service.remove(currentUser(req), String(req.params.id));
      res.status(204).end();
    });
  }
  return r;
}
