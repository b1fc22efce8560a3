import type { Express } from 'express';
import type { AppDeps } from '../../deps';
import { invoicesRouter } from '../invoices/invoices.router';
import { createInvoicesService } from '../invoices/invoices.service';
import { payRouter } from './pay.router';
import { paymentsRouter, paymentsWebhookRouter } from './payments.router';
import { createPaymentsService } from './payments.service';

const services = new WeakMap<AppDeps, { payments: ReturnType<typeof createPaymentsService>; invoices: ReturnType<typeof createInvoicesService> }>();
function servicesFor(deps: AppDeps) {
  let s = services.get(deps);
  if (!s) {
    const payments = createPaymentsService(deps);
    s = { payments, invoices: createInvoicesService(deps, payments) };
    services.set(deps, s);
  }
  return s;
}

/** Mount BEFORE express.json(): the webhook's signature is over the raw body. */
export function mountPaymentsWebhook(app: Express, deps: AppDeps): void {
  app.use('/api/payments/webhook', paymentsWebhookRouter(deps, servicesFor(deps).payments));
}

/** /api/payments, /api/invoices and the customer's /pay pages. */
export function mountPayments(app: Express, deps: AppDeps): void {
  const { payments, invoices } = servicesFor(deps);
  app.use('/api/payments', paymentsRouter(deps, payments));
  app.use('/api/invoices', invoicesRouter(deps, invoices));
  app.use('/pay', payRouter(deps, payments, invoices));
}
