/**
 * The /pay pages' bodies: plain data in, HTML out (escaped here; the layout is pay-layout.ts).
 * The controller picks the page and its status.
 */
import type { DepositStatus } from '../../../shared/api/payments';
import type { Invoice } from '../../../shared/api/invoices';
import { formatDate } from '../../../shared/dates';
import { escapeHtml, money, payLayout } from './pay-layout';

/** What a payment page needs of one checkout attempt. */
export interface PaymentView {
  purpose: 'deposit' | 'balance';
  status: string;
  amountMinor: number;
  currency: string;
  token: string;
}

export const linkNotRecognised = () =>
  payLayout('Link not recognised', '<p>This payment link is not valid. Please use the latest link from your e-mail, or contact us.</p>');

export const depositNotYet = (quoteNumber: string, link: string, company: string) =>
  payLayout(
    `Quote ${quoteNumber}`,
    `<p class="warn">A deposit is taken once the quote is accepted.</p><p><a href="/q/${encodeURIComponent(link)}">Back to the quote</a></p>`,
    { company },
  );

export const depositPaid = (quoteNumber: string, status: DepositStatus, company: string) =>
  payLayout(
    'Deposit received',
    `<p class="ok">We received your deposit of <strong>${money(status.amountMinor, status.currency)}</strong> for quote ${escapeHtml(quoteNumber)}. Thank you.</p>`,
    { company },
  );

export const noDepositNeeded = (quoteNumber: string, company: string) =>
  payLayout('No deposit needed', `<p>No deposit is needed for quote ${escapeHtml(quoteNumber)}. We will be in touch to arrange the work.</p>`, {
    company,
  });

export const depositDue = (quoteNumber: string, status: DepositStatus, cardPayments: boolean, company: string) =>
  payLayout(
    `Deposit for quote ${quoteNumber}`,
    `
      <p>Thank you for accepting quote ${escapeHtml(quoteNumber)}. To book the work, please pay the deposit by card.</p>
      <div class="amount" data-testid="deposit-amount">${money(status.amountMinor, status.currency)}</div>
      ${
        cardPayments
          ? '<form method="post" class="actions"><button class="btn btn-primary" type="submit">Pay deposit by card</button></form><p class="note">You will be taken to our card payment page. The remaining balance is invoiced after the work is done.</p>'
          : '<p class="warn">Card payment is not available here at the moment: we will contact you about paying the deposit.</p>'
      }`,
    { company },
  );

/** An invoice with its balance: a pay button while something is owed, else paid or settled. */
export function invoicePage(d: Invoice, token: string, cardPayments: boolean, company: string): string {
  const day = (iso: string) => escapeHtml(formatDate(iso));
  const rows = `<dl><dt>Invoice</dt><dd>${escapeHtml(d.number)}</dd><dt>Issued</dt><dd>${day(d.issueDate)}</dd>${d.dueDate ? `<dt>Due</dt><dd>${day(d.dueDate)}</dd>` : ''}
      <dt>Total</dt><dd>${money(d.grossMinor, d.currency)}</dd>${d.depositMinor ? `<dt>Deposit paid</dt><dd>−${money(d.depositMinor, d.currency)}</dd>` : ''}${d.creditedMinor ? `<dt>Credited</dt><dd>−${money(d.creditedMinor, d.currency)}</dd>` : ''}</dl>`;
  const pdf = `<a class="btn btn-quiet" href="/pay/invoice/${encodeURIComponent(token)}/pdf">Download the PDF</a>`;
  if (d.balanceMinor <= 0) {
    return payLayout(
      `Invoice ${d.number}`,
      `<p class="ok">${d.status === 'paid' ? 'This invoice is paid. Thank you.' : 'Nothing is left to pay on this invoice.'}</p>${rows}<div class="actions">${pdf}</div>`,
      { company },
    );
  }
  return payLayout(
    `Invoice ${d.number}`,
    `
      ${d.overdue ? '<p class="warn">This invoice is overdue.</p>' : ''}
      <p>Balance to pay</p><div class="amount" data-testid="balance">${money(d.balanceMinor, d.currency)}</div>${rows}
      ${cardPayments ? `<form method="post" class="actions"><button class="btn btn-primary" type="submit">Pay by card</button>${pdf}</form>` : `<p class="warn">Card payment is not available here at the moment: please pay as agreed with us.</p><div class="actions">${pdf}</div>`}`,
    { company },
  );
}

/** Back from the checkout: paid once the signed webhook said so, else a page that refreshes until it does. */
export function paymentDone(p: PaymentView, company: string): string {
  const what = p.purpose === 'deposit' ? 'deposit' : 'payment';
  if (p.status === 'paid') {
    return payLayout(
      'Payment received',
      `<p class="ok" data-testid="paid">We received your ${what} of <strong>${money(p.amountMinor, p.currency)}</strong>. Thank you. A receipt is on its way from the card payment service.</p>`,
      { company },
    );
  }
  return payLayout(
    'Confirming your payment…',
    `<p class="warn" data-testid="confirming">We are waiting for the card payment service to confirm your ${what} of ${money(p.amountMinor, p.currency)}. This page refreshes by itself.</p>`,
    { company, refreshSeconds: 2 },
  );
}

export const paymentCancelled = (p: PaymentView, company: string) =>
  payLayout(
    'Payment not taken',
    `
      <p data-testid="cancelled">You left the card payment page, so nothing was paid.</p>
      <form method="post" action="/pay/retry/${encodeURIComponent(p.token)}" class="actions"><button class="btn btn-primary" type="submit">Try again: pay ${money(p.amountMinor, p.currency)}</button></form>`,
    { company },
  );

export const brieflyUnavailable = () =>
  payLayout(
    'Briefly unavailable',
    '<p class="warn" data-testid="unavailable">Our service is briefly unavailable, so nothing was paid or changed. Please try again in a minute: your link still works.</p>',
    { refreshSeconds: 30 },
  );

export const paymentNotAvailable = (message: string) => payLayout('Payment not available', `<p class="warn">${escapeHtml(message)}</p>`);

export const cardServiceUnreachable = () =>
  payLayout(
    'Card payment unavailable',
    '<p class="warn">The card payment service could not be reached, so nothing was paid. Please try again in a few minutes.</p>',
  );
