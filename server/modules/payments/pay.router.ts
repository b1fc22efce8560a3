import express, { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import { payTokenParamsSchema, quoteLinkParamsSchema } from '../../../shared/api/payments';
import { validate } from '../../middleware/validate';
import { createPayController } from './pay.controller';
import type { PayService } from './pay.service';

/**
 * /pay — the customer's pages around the hosted checkout (no sign-in; private random links):
 *   GET/POST /pay/deposit/:link         deposit of an accepted quote (POST → 303 to the checkout)
 *   GET/POST /pay/invoice/:token        an invoice's balance; GET …/pdf for the PDF
 *   GET /pay/done/:token                our success page (waits for the signed webhook; never marks paid itself)
 *   GET /pay/cancelled/:token           our cancel page: nothing paid, try again
 *   POST /pay/retry/:token              a new checkout for the same thing
 */
export function payRouter(service: PayService) {
  const c = createPayController(service);
  const r = Router();
  r.use(express.urlencoded({ extended: false, limit: '10kb' }));
  // Each POST opens a checkout at the payment service: keep a stranger from opening thousands.
  const startLimit = rateLimit({
    windowMs: 15 * 60_000,
    limit: 60,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    message: 'Too many attempts: wait a few minutes.',
  });
  r.post('/{*rest}', startLimit);
  r.use(c.pageHeaders);
  for (const weight of ['400', '600', '700']) r.get(`/fonts/inter-${weight}.woff2`, c.font(weight));

  const byLink = validate({ params: quoteLinkParamsSchema });
  const byToken = validate({ params: payTokenParamsSchema });
  r.get('/deposit/:link', byLink, c.deposit);
  r.post('/deposit/:link', byLink, c.startDeposit);
  r.get('/invoice/:token', byToken, c.invoice);
  r.post('/invoice/:token', byToken, c.startInvoice);
  r.get('/invoice/:token/pdf', byToken, c.invoicePdf);
  r.get('/done/:token', byToken, c.done);
  r.get('/cancelled/:token', byToken, c.cancelled);
  r.post('/retry/:token', byToken, c.retry);
  r.use(c.errorPage);
  return r;
}
