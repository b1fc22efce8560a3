import express, { Router } from 'express';
import { z } from 'zod';
import { idParamsSchema } from '../../../shared/api/common';
import { paymentSettingsBodySchema, quoteLinkParamsSchema } from '../../../shared/api/payments';
import type { AppDeps } from '../../deps';
import { requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { createPaymentsController } from './payments.controller';
import { createPaymentsService, type PaymentsService } from './payments.service';

/**
 * POST /api/payments/webhook — the payment service's signed events. Mounted BEFORE the app's JSON
 * parser: the signature is over the exact raw bytes, so the body must stay a Buffer.
 * Bad or missing signature → 400 and nothing changes; a replayed event → 200 and nothing changes.
 */
export function paymentsWebhookRouter(deps: AppDeps, service: PaymentsService = createPaymentsService(deps)) {
  const c = createPaymentsController(deps, service);
  const r = Router();
  r.post('/', express.raw({ type: '*/*', limit: '1mb' }), c.webhook);
  return r;
}

/** /api/payments — settings (office) and deposit status for the quote and job pages. */
export function paymentsRouter(deps: AppDeps, service: PaymentsService = createPaymentsService(deps)) {
  const c = createPaymentsController(deps, service);
  const r = Router();
  // For the customer's quote page right after accepting (no sign-in; the signed quote link is the key):
  // whether a deposit is due and where to pay it.
  r.get('/public/deposit/:link', validate({ params: quoteLinkParamsSchema }), c.publicDeposit);
  r.use(requireAuth);
  r.get('/settings', requireCan('settings:manage'), c.getSettings);
  r.put('/settings', requireCan('settings:manage'), validate({ body: paymentSettingsBodySchema }), c.putSettings);
  r.get('/deposits/:quoteId', requireCan('prices:read'), validate({ params: z.object({ quoteId: z.uuid() }) }), c.deposit);
  r.get('/jobs/:id/timeline', requireCan('prices:read'), validate({ params: idParamsSchema }), c.timeline);
  return r;
}
