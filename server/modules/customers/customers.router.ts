import { Router } from 'express';
import { idParamsSchema } from '../../../shared/api/common';
import { customerBodySchema, customerListQuerySchema, customerPatchSchema } from '../../../shared/api/customers';
import type { AppDeps } from '../../deps';
import { requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { createCustomersController } from './customers.controller';
import { createCustomersService } from './customers.service';

/** Office and estimators; installers get 403 (they reach customer details through their jobs). */
export function customersRouter(_deps: AppDeps) {
  const c = createCustomersController(createCustomersService());
  const r = Router();
  r.use(requireAuth, requireCan('customers:read'));
  r.get('/', validate({ query: customerListQuerySchema }), c.list);
  r.get('/:id', validate({ params: idParamsSchema }), c.get);
  r.post('/', requireCan('customers:write'), validate({ body: customerBodySchema }), c.create);
  r.patch('/:id', requireCan('customers:write'), validate({ params: idParamsSchema, body: customerPatchSchema }), c.update);
  r.delete('/:id', requireCan('customers:write'), validate({ params: idParamsSchema }), c.remove);
  return r;
}
