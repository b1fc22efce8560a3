import type { Request, Response } from 'express';
import type { AppDeps } from '../../deps';
import { NotFoundError } from '../../lib/errors';
import { currentUser } from '../../middleware/require-auth';
import { linkSecret } from '../quotes/quote-send.service';
import type { PaymentsService } from './payments.service';
import { quoteFromLink } from './quote-link-resolver';

/** HTTP only: reads the validated request, calls the payments service, shapes the response. */
export function createPaymentsController(deps: AppDeps, service: PaymentsService) {
  const settingsBody = (settings: unknown) => ({ settings, provider: service.provider, enabled: service.provider !== 'off' });
  return {
    async webhook(req: Request, res: Response) {
      const raw = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
      const result = await service.handleWebhook(raw, req.get('stripe-signature'));
      res.json({ received: true, duplicate: result.duplicate });
    },
    async publicDeposit(req: Request, res: Response) {
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
    },
    async getSettings(req: Request, res: Response) {
      res.json(settingsBody(await service.settingsOf(currentUser(req).organisationId)));
    },
    async putSettings(req: Request, res: Response) {
      res.json(settingsBody(await service.updateSettings(currentUser(req).organisationId, req.body)));
    },
    async deposit(req: Request, res: Response) {
      res.json({ deposit: await service.depositStatus(currentUser(req).organisationId, String(req.params.quoteId)) });
    },
    async timeline(req: Request, res: Response) {
      res.json({ entries: await service.timeline(currentUser(req).organisationId, String(req.params.id)) });
    },
  };
}
