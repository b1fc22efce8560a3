import { Router } from 'express';
import { idParamsSchema } from '../../../shared/api/common';
import { createQuoteBodySchema, quotePatchSchema, sendQuoteBodySchema } from '../../../shared/api/quotes';
import { requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { createQuotesController, type QuoteServices } from './quotes.controller';

const params = validate({ params: idParamsSchema });

/** /api/jobs/:id/quotes — list and build. Office and estimators; installers 403. */
export function jobQuotesRouter(services: QuoteServices) {
  const c = createQuotesController(services);
  const r = Router();
  r.get('/:id/quotes', requireAuth, requireCan('quotes:draft'), params, c.listForJob);
  r.post('/:id/quotes', requireAuth, requireCan('quotes:draft'), validate({ params: idParamsSchema, body: createQuoteBodySchema }), c.createFromJob);
  return r;
}

/** /api/quotes/:id — read, edit (new version once sent), send (office), exports. */
export function quotesRouter(services: QuoteServices) {
  const c = createQuotesController(services);
  const r = Router();
  r.use(requireAuth, requireCan('quotes:draft'));
  r.get('/:id', params, c.get);
  r.patch('/:id', validate({ params: idParamsSchema, body: quotePatchSchema }), c.patch);
  r.delete('/:id', params, c.remove);
  r.post('/:id/send', requireCan('quotes:manage'), validate({ params: idParamsSchema, body: sendQuoteBodySchema }), c.send);
  r.get('/:id/pdf', params, c.pdf);
  r.get('/:id/csv', params, c.csv);
  r.get('/:id/xlsx', params, c.xlsx);
  return r;
}
