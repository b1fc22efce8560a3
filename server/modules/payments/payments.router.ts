import { linkSecret } from '../quotes/quote-send.service';
import express, { Router } from 'express';
import { z } from 'zod';
import { idParamsSchema } from '../../../shared/api/common';
import { paymentSettingsBodySchema } from '../../../shared/api/payments';
import type { AppDeps } from '../../deps';
import { currentUser, requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { NotFoundError } from '../../lib/errors';
import { createPaymentsService, type PaymentsService } from './payments.service';
import { quoteFromLink } from './quote-link-resolver';

/**
 * POST /api/payments/webhook — the payment service's signed events. Mounted BEFORE the app's JSON
 * parser: the signature is over the exact raw bytes, so the body must stay a Buffer.
 * Bad or missing signature → 400 and nothing changes; a replayed event → 200 and nothing changes.
 */
export function paymentsWebhookRouter(deps: AppDeps, service: PaymentsService = createPaymentsService(deps)) {
  const r = Router();
  r.post('/', express.raw({ type: '*/*', limit: '1mb' }), async (req, res) => {
    const raw = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
    const result = await service.handleWebhook(raw, req.get('stripe-signature'));
    res.json({ received: true, duplicate: result.duplicate });
  });
  return r;
}

/** /api/payments — settings (office) and deposit status for the quote and job pages. */
export function paymentsRouter(deps: AppDeps, service: PaymentsService = createPaymentsService(deps)) {
  const r = Router();
  // For the customer's quote page right after accepting (no sign-in; the signed quote link is the key):
  // whether a deposit is due and where to pay it.
  r.get('/public/deposit/:link', validate({ params: z.object({ link: z.string().min(10).max(500) }) }), async (req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    const link = String(req.params.link);
    const quote = await quoteFromLink(link, linkSecret(deps));
    if (!quote) throw new NotFoundError('quote');
    const d = await service.depositStatusOf(quote);
    res.json({
      deposit: {
        state: d.state,
        amountMinor: d.amountMinor,
        currency: d.currency,
        paidAt: d.paidAt,
        payUrl: quote.status === 'accepted' && d.state === 'due' ? `/pay/deposit/${encodeURIComponent(link)}` : null,
      },
    });
  });
  r.use(requireAuth);
  r.get('/settings', requireCan('settings:manage'), async (req, res) => {
    res.json({ settings: await service.settingsOf(currentUser(req).organisationId), provider: service.provider, enabled: service.provider !== 'off' });
  });
  r.put('/settings', requireCan('settings:manage'), validate({ body: paymentSettingsBodySchema }), async (req, res) => {
    res.json({
      settings: await service.updateSettings(currentUser(req).organisationId, req.body),
      provider: service.provider,
      enabled: service.provider !== 'off',
    });
  });
  r.get('/deposits/:quoteId', requireCan('prices:read'), validate({ params: z.object({ quoteId: z.uuid() }) }), async (req, res) => {
    res.json({ deposit: await service.depositStatus(currentUser(req).organisationId, String(req.params.quoteId)) });
  });
  r.get('/jobs/:id/timeline', requireCan('prices:read'), validate({ params: idParamsSchema }), async (req, res) => {
    res.json({ entries: await service.timeline(currentUser(req).organisationId, String(req.params.id)) });
  });
  return r;
}
