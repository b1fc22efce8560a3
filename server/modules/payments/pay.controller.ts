import { createRequire } from 'node:module';
import type { NextFunction, Request, Response } from 'express';
import { DB_RETRY_AFTER_SECONDS, isDatabaseUnavailable } from '../../lib/db-unavailable';
import { AppError, ValidationError } from '../../lib/errors';
import { describeError } from '../../lib/log-redact';
import { payPageCsp } from './pay-layout';
import type { PayService } from './pay.service';
import * as view from './pay-views';

const send = (res: Response, status: number, html: string) => res.status(status).type('html').send(html);
const notFound = (res: Response) => send(res, 404, view.linkNotRecognised());
const link = (req: Request) => String(req.params.link);
const token = (req: Request) => String(req.params.token);

/** HTTP only: reads the validated link or token, asks the pay service, answers with a page or a redirect. */
export function createPayController(service: PayService) {
  const require = createRequire(import.meta.url);
  return {
    /** Headers of every /pay answer: forms may post on to the hosted checkout only; nothing cached or referred. */
    pageHeaders(_req: Request, res: Response, next: NextFunction) {
      res.setHeader('Content-Security-Policy', payPageCsp(service.checkoutOrigins));
      res.setHeader('Cache-Control', 'no-store');
      res.setHeader('Referrer-Policy', 'no-referrer');
      next();
    },

    /** The pages' own font (Inter, shipped with the app as @fontsource files; no CDN). */
    font(weight: string) {
      const file = require.resolve(`@fontsource/inter/files/inter-latin-${weight}-normal.woff2`);
      return (_req: Request, res: Response) => {
        res.setHeader('Cache-Control', 'public, max-age=86400');
        res.type('font/woff2').sendFile(file);
      };
    },

    async deposit(req: Request, res: Response) {
      const found = await service.deposit(link(req));
      if (!found) return notFound(res);
      const { quote, status, company } = found;
      if (quote.status !== 'accepted') return send(res, 409, view.depositNotYet(quote.number, link(req), company));
      if (status.state === 'paid') return send(res, 200, view.depositPaid(quote.number, status, company));
      if (status.state === 'none') return send(res, 200, view.noDepositNeeded(quote.number, company));
      send(res, 200, view.depositDue(quote.number, status, service.cardPayments, company));
    },

    async startDeposit(req: Request, res: Response) {
      const started = await service.startDeposit(link(req));
      if (!started) return notFound(res);
      res.redirect(303, started.url ?? `/pay/deposit/${encodeURIComponent(link(req))}`);
    },

    async invoice(req: Request, res: Response) {
      const found = await service.invoice(token(req));
      if (!found) return notFound(res);
      send(res, 200, view.invoicePage(found.invoice, token(req), service.cardPayments, found.company));
    },

    async startInvoice(req: Request, res: Response) {
      const started = await service.startInvoice(token(req));
      if (!started) return notFound(res);
      res.redirect(303, started.url ?? `/pay/invoice/${encodeURIComponent(token(req))}`);
    },

    async invoicePdf(req: Request, res: Response) {
      const file = await service.invoicePdf(token(req));
      if (!file) return notFound(res);
      res.type('application/pdf').setHeader('Content-Disposition', `inline; filename="${file.filename}"`);
      res.send(file.pdf);
    },

    async done(req: Request, res: Response) {
      const found = await service.payment(token(req));
      if (!found) return notFound(res);
      send(res, 200, view.paymentDone(found.payment, found.company));
    },

    async cancelled(req: Request, res: Response) {
      const found = await service.payment(token(req));
      if (!found) return notFound(res);
      send(res, 200, view.paymentCancelled(found.payment, found.company));
    },

    async retry(req: Request, res: Response) {
      const again = await service.retry(token(req));
      if (!again) return notFound(res);
      res.redirect(303, again.url ?? `/pay/done/${encodeURIComponent(again.payment.token)}`);
    },

    /** The customer sees a page, not JSON, when something goes wrong here. */
    errorPage(err: unknown, req: Request, res: Response, next: NextFunction) {
      if (res.headersSent) return next(err);
      // A malformed link or token is one we do not recognise, like a well-formed unknown one.
      if (err instanceof ValidationError) return notFound(res);
      if (isDatabaseUnavailable(err)) {
        res.setHeader('Retry-After', String(DB_RETRY_AFTER_SECONDS));
        return send(res, 503, view.brieflyUnavailable());
      }
      if (err instanceof AppError && err.status < 500) return send(res, err.status, view.paymentNotAvailable(err.message));
      req.log.error(`payment page error: ${describeError(err)}`);
      send(res, 502, view.cardServiceUnreachable());
    },
  };
}
