import { Router } from 'express';
import { idParamsSchema } from '../../../shared/api/common';
import { creditNoteCreateSchema, invoiceCreateSchema, invoiceListQuerySchema, invoicePatchSchema } from '../../../shared/api/invoices';
import type { AppDeps } from '../../deps';
import { currentUser, requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import type { InvoicesService } from './invoices.service';

/** /api/invoices — the office's invoices and credit notes (other companies' ids → 404). */
export function invoicesRouter(_deps: AppDeps, service: InvoicesService) {
  const r = Router();
  r.use(requireAuth, requireCan('quotes:manage'));
  r.get('/', validate({ query: invoiceListQuerySchema }), async (req, res) => {
    res.json({ invoices: await service.list(currentUser(req), req.query as never) });
  });
  r.post('/', validate({ body: invoiceCreateSchema }), async (req, res) => {
    res.status(201).json({ invoice: await service.create(currentUser(req), req.body) });
  });
  r.get('/:id', validate({ params: idParamsSchema }), async (req, res) => {
    res.json({ invoice: await service.get(currentUser(req), String(req.params.id)) });
  });
  r.patch('/:id', validate({ params: idParamsSchema, body: invoicePatchSchema }), async (req, res) => {
    res.json({ invoice: await service.update(currentUser(req), String(req.params.id), req.body) });
  });
  r.get('/:id/pdf', validate({ params: idParamsSchema }), async (req, res) => {
    const { filename, pdf } = await service.pdf(currentUser(req), String(req.params.id));
    res.type('application/pdf').setHeader('Content-Disposition', `inline; filename="${filename}"`);
    res.send(pdf);
  });
  r.post('/:id/send', validate({ params: idParamsSchema }), async (req, res) => {
    res.json({ invoice: await service.send(currentUser(req), String(req.params.id)) });
  });
  r.post('/:id/credit-notes', validate({ params: idParamsSchema, body: creditNoteCreateSchema }), async (req, res) => {
    res.status(201).json({ creditNote: await service.creditNote(currentUser(req), String(req.params.id), req.body) });
  });
  return r;
}
