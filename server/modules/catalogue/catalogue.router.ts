import { Router } from 'express';
import type { z } from 'zod';
import { idParamsSchema } from '../../../shared/api/common';
import { extraBodySchema, productBodySchema, taxRateBodySchema } from '../../../shared/api/settings';
import { requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { createCatalogueController } from './catalogue.controller';
import type { CatalogueService } from './catalogue.service';

const SCHEMAS: Record<keyof CatalogueService, { body: z.ZodObject; key: string }> = {
  products: { body: productBodySchema, key: 'product' },
  extras: { body: extraBodySchema, key: 'extra' },
  'tax-rates': { body: taxRateBodySchema, key: 'taxRate' },
};

/**
 * /api/catalogue/{products,extras,tax-rates}: office edits; estimators read (they price drafts);
 * installers never see prices (403).
 */
export function catalogueRouter(catalogue: CatalogueService) {
  const r = Router();
  r.use(requireAuth, requireCan('prices:read'));
  for (const [name, table] of Object.entries(catalogue)) {
    const { body, key } = SCHEMAS[name as keyof CatalogueService];
    const c = createCatalogueController(table, key);
    r.get(`/${name}`, c.list);
    r.post(`/${name}`, requireCan('settings:manage'), validate({ body }), c.create);
    r.patch(`/${name}/:id`, requireCan('settings:manage'), validate({ params: idParamsSchema, body: body.partial() }), c.update);
    r.delete(`/${name}/:id`, requireCan('settings:manage'), validate({ params: idParamsSchema }), c.remove);
  }
  return r;
}
