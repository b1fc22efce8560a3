import { Router } from 'express';
import { idParamsSchema } from '../../../shared/api/common';
import { creditNoteCreateSchema, invoiceCreateSchema, invoiceListQuerySchema, invoicePatchSchema } from '../../../shared/api/invoices';
import type { AppDeps } from '../../deps';
import { requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { createInvoicesController } from './invoices.controller';
import type { InvoicesService } from './invoices.service';

/** /api/invoices — the office's invoices and credit notes (other companies' ids → 404). */
export function invoicesRouter(_deps: AppDeps, service: InvoicesService) {
  const c = createInvoicesController(service);
  const r = Router();
  r.use(requireAuth, requireCan('quotes:manage'));
  r.get('/', validate({ query: invoiceListQuerySchema }), c.list);
  r.post('/', validate({ body: invoiceCreateSchema }), c.create);
  r.get('/:id', validate({ params: idParamsSchema }), c.get);
  r.patch('/:id', validate({ params: idParamsSchema, body: invoicePatchSchema }), c.update);
  r.get('/:id/pdf', validate({ params: idParamsSchema }), c.pdf);
  r.post('/:id/send', validate({ params: idParamsSchema }), c.send);
  r.post('/:id/credit-notes', validate({ params: idParamsSchema, body: creditNoteCreateSchema }), c.creditNote);
  return r;
}
