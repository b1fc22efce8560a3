import { linkSecret } from '../quotes/quote-send.service';
import express, { Router, type Response } from 'express';
import { rateLimit } from 'express-rate-limit';
import { createRequire } from 'node:module';
import type { AppDeps } from '../../deps';
import { CompanySetting } from '../../db/models/company-setting';
import { Invoice } from '../../db/models/invoice';
import { Quote } from '../../db/models/quote';
import { formatDate } from '../../../shared/dates';
import { DB_RETRY_AFTER_SECONDS, isDatabaseUnavailable } from '../../lib/db-unavailable';
import { AppError, NotFoundError } from '../../lib/errors';
import { describeError } from '../../lib/log-redact';
import type { InvoicesService } from '../invoices/invoices.service';
import { escapeHtml, money, payLayout, payPageCsp } from './pay-pages';
import { paymentsContext } from './payments-context';
import type { PaymentsService } from './payments.service';
import { quoteFromLink } from './quote-link-resolver';

/**
 * /pay — the customer's pages around the hosted checkout (no sign-in; private random links):
 *   GET/POST /pay/deposit/:quoteLink    deposit of an accepted quote (POST → 303 to the checkout)
 *   GET/POST /pay/invoice/:payToken     an invoice's balance; GET …/pdf for the PDF
 *   GET /pay/done/:token                our success page (waits for the signed webhook; never marks paid itself)
 *   GET /pay/cancelled/:token           our cancel page: nothing paid, try again
 *   POST /pay/retry/:token              a new checkout for the same thing
 */
/** A link that names nothing is a page saying so; any other failure (the database away) is not. */
function onlyNotFound(e: unknown): null {
  if (e instanceof NotFoundError) return null;
  throw e;
}

export function payRouter(deps: AppDeps, payments: PaymentsService, invoices: InvoicesService) {
  const ctx = paymentsContext(deps);
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
  r.use((_req, res, next) => {
    res.setHeader('Content-Security-Policy', payPageCsp(ctx.checkoutOrigins));
    res.setHeader('Cache-Control', 'no-store');
    res.setHeader('Referrer-Policy', 'no-referrer');
    next();
  });

  // The pages' own font (Inter, shipped with the app as @fontsource files; no CDN).
  const require = createRequire(import.meta.url);
  for (const weight of ['400', '600', '700']) {
    const file = require.resolve(`@fontsource/inter/files/inter-latin-${weight}-normal.woff2`);
    r.get(`/fonts/inter-${weight}.woff2`, (_req, res) => {
      res.setHeader('Cache-Control', 'public, max-age=86400');
      res.type('font/woff2').sendFile(file);
    });
  }

  const companyName = async (organisationId: string) => (await CompanySetting.findByPk(organisationId))?.companyName ?? '';
  const send = (res: Response, status: number, html: string) => res.status(status).type('html').send(html);
  const notFound = (res: Response) =>
    send(res, 404, payLayout('Link not recognised', '<p>This payment link is not valid. Please use the latest link from your e-mail, or contact us.</p>'));

  r.get('/deposit/:link', async (req, res) => {
    const quote = await quoteFromLink(String(req.params.link), linkSecret(deps));
    if (!quote) return notFound(res);
    const company = await companyName(quote.organisationId);
    const status = await payments.depositStatusOf(quote);
    if (quote.status !== 'accepted') {
      return send(
        res,
        409,
        payLayout(
          `Quote ${quote.number}`,
          `<p class="warn">A deposit is taken once the quote is accepted.</p><p><a href="/q/${encodeURIComponent(String(req.params.link))}">Back to the quote</a></p>`,
          { company },
        ),
      );
    }
    if (status.state === 'paid') {
      return send(
        res,
        200,
        payLayout(
          'Deposit received',
          `<p class="ok">We received your deposit of <strong>${money(status.amountMinor, status.currency)}</strong> for quote ${escapeHtml(quote.number)}. Thank you.</p>`,
          { company },
        ),
      );
    }
    if (status.state === 'none')
      return send(
        res,
        200,
        payLayout('No deposit needed', `<p>No deposit is needed for quote ${escapeHtml(quote.number)}. We will be in touch to arrange the work.</p>`, {
          company,
        }),
      );
    send(
      res,
      200,
      payLayout(
        `Deposit for quote ${quote.number}`,
        `
      <p>Thank you for accepting quote ${escapeHtml(quote.number)}. To book the work, please pay the deposit by card.</p>
      <div class="amount" data-testid="deposit-amount">${money(status.amountMinor, status.currency)}</div>
      ${
        ctx.gateway
          ? '<form method="post" class="actions"><button class="btn btn-primary" type="submit">Pay deposit by card</button></form><p class="note">You will be taken to our card payment page. The remaining balance is invoiced after the work is done.</p>'
          : '<p class="warn">Card payment is not available here at the moment: we will contact you about paying the deposit.</p>'
      }`,
        { company },
      ),
    );
  });

  r.post('/deposit/:link', async (req, res) => {
    const quote = await quoteFromLink(String(req.params.link), linkSecret(deps));
    if (!quote) return notFound(res);
    const url = await payments.startDeposit(quote);
    res.redirect(303, url ?? `/pay/deposit/${encodeURIComponent(String(req.params.link))}`);
  });

  // An unknown or malformed pay token is a page saying so, not an error.
  const invoiceFromToken = (token: string) => invoices.byPayToken(token).catch(onlyNotFound);
  const paymentFromToken = (token: string) => payments.paymentByToken(token).catch(onlyNotFound);

  r.get('/invoice/:token', async (req, res) => {
    const inv = await invoiceFromToken(String(req.params.token));
    if (!inv) return notFound(res);
    const d = await invoices.dto(inv);
    const company = await companyName(inv.organisationId);
    const day = (iso: string) => escapeHtml(formatDate(iso));
    const rows = `<dl><dt>Invoice</dt><dd>${escapeHtml(d.number)}</dd><dt>Issued</dt><dd>${day(d.issueDate)}</dd>${d.dueDate ? `<dt>Due</dt><dd>${day(d.dueDate)}</dd>` : ''}
      <dt>Total</dt><dd>${money(d.grossMinor, d.currency)}</dd>${d.depositMinor ? `<dt>Deposit paid</dt><dd>−${money(d.depositMinor, d.currency)}</dd>` : ''}${d.creditedMinor ? `<dt>Credited</dt><dd>−${money(d.creditedMinor, d.currency)}</dd>` : ''}</dl>`;
    const pdf = `<a class="btn btn-quiet" href="/pay/invoice/${encodeURIComponent(String(req.params.token))}/pdf">Download the PDF</a>`;
    if (d.balanceMinor <= 0) {
      return send(
        res,
        200,
        payLayout(
          `Invoice ${d.number}`,
          `<p class="ok">${d.status === 'paid' ? 'This invoice is paid. Thank you.' : 'Nothing is left to pay on this invoice.'}</p>${rows}<div class="actions">${pdf}</div>`,
          { company },
        ),
      );
    }
    send(
      res,
      200,
      payLayout(
        `Invoice ${d.number}`,
        `
      ${d.overdue ? '<p class="warn">This invoice is overdue.</p>' : ''}
      <p>Balance to pay</p><div class="amount" data-testid="balance">${money(d.balanceMinor, d.currency)}</div>${rows}
      ${ctx.gateway ? `<form method="post" class="actions"><button class="btn btn-primary" type="submit">Pay by card</button>${pdf}</form>` : `<p class="warn">Card payment is not available here at the moment: please pay as agreed with us.</p><div class="actions">${pdf}</div>`}`,
        { company },
      ),
    );
  });

  r.post('/invoice/:token', async (req, res) => {
    let url: string | null;
    try {
      url = await invoices.startPayByToken(String(req.params.token));
    } catch (e) {
      if (e instanceof AppError && e.status === 404) return notFound(res);
      throw e;
    }
    res.redirect(303, url ?? `/pay/invoice/${encodeURIComponent(String(req.params.token))}`);
  });

  r.get('/invoice/:token/pdf', async (req, res) => {
    const inv = await invoiceFromToken(String(req.params.token));
    if (!inv) return notFound(res);
    const { filename, pdf } = await invoices.pdfOf(inv);
    res.type('application/pdf').setHeader('Content-Disposition', `inline; filename="${filename}"`);
    res.send(pdf);
  });

  r.get('/done/:token', async (req, res) => {
    const p = await paymentFromToken(String(req.params.token));
    if (!p) return notFound(res);
    const company = await companyName(p.organisationId);
    const what = p.purpose === 'deposit' ? 'deposit' : 'payment';
    if (p.status === 'paid') {
      return send(
        res,
        200,
        payLayout(
          'Payment received',
          `<p class="ok" data-testid="paid">We received your ${what} of <strong>${money(p.amountMinor, p.currency)}</strong>. Thank you. A receipt is on its way from the card payment service.</p>`,
          { company },
        ),
      );
    }
    send(
      res,
      200,
      payLayout(
        'Confirming your payment…',
        `<p class="warn" data-testid="confirming">We are waiting for the card payment service to confirm your ${what} of ${money(p.amountMinor, p.currency)}. This page refreshes by itself.</p>`,
        { company, refreshSeconds: 2 },
      ),
    );
  });

  r.get('/cancelled/:token', async (req, res) => {
    const p = await paymentFromToken(String(req.params.token));
    if (!p) return notFound(res);
    const company = await companyName(p.organisationId);
    send(
      res,
      200,
      payLayout(
        'Payment not taken',
        `
      <p data-testid="cancelled">You left the card payment page, so nothing was paid.</p>
      <form method="post" action="/pay/retry/${encodeURIComponent(p.token)}" class="actions"><button class="btn btn-primary" type="submit">Try again: pay ${money(p.amountMinor, p.currency)}</button></form>`,
        { company },
      ),
    );
  });

  r.post('/retry/:token', async (req, res) => {
    const p = await paymentFromToken(String(req.params.token));
    if (!p) return notFound(res);
    let url: string | null = null;
    if (p.purpose === 'deposit' && p.quoteId) {
      const quote = await Quote.findByPk(p.quoteId);
      if (quote) url = await payments.startDeposit(quote);
    } else if (p.invoiceId) {
      const inv = await Invoice.findByPk(p.invoiceId);
      if (inv?.payToken) url = await invoices.startPayByToken(inv.payToken);
    }
    res.redirect(303, url ?? `/pay/done/${encodeURIComponent(p.token)}`);
  });

  // The customer sees a page, not JSON, when something goes wrong here.
  r.use((err: unknown, _req: express.Request, res: Response, next: express.NextFunction) => {
    if (res.headersSent) return next(err);
    if (isDatabaseUnavailable(err)) {
      res.setHeader('Retry-After', String(DB_RETRY_AFTER_SECONDS));
      return send(
        res,
        503,
        payLayout(
          'Briefly unavailable',
          '<p class="warn" data-testid="unavailable">Our service is briefly unavailable, so nothing was paid or changed. Please try again in a minute: your link still works.</p>',
          { refreshSeconds: 30 },
        ),
      );
    }
    if (err instanceof AppError && err.status < 500) {
      return send(res, err.status, payLayout('Payment not available', `<p class="warn">${escapeHtml(err.message)}</p>`));
    }
    console.error(`[pay] error: ${describeError(err)}`);
    send(
      res,
      502,
      payLayout(
        'Card payment unavailable',
        '<p class="warn">The card payment service could not be reached, so nothing was paid. Please try again in a few minutes.</p>',
      ),
    );
  });

  return r;
}
