import type { AppDeps } from '../../deps';
import { depositSentence, depositTerms } from '../../../shared/quote/deposit';
import { sendCompanyMail } from '../mail/mail.service';
import { loadPaymentSettings } from '../settings/payment-settings';
import { ConflictError, ValidationError } from '../../lib/errors';
import type { SessionUser } from '../../types';
import { formatMoney } from '../../../shared/quote/money';
import { loadCompanySettings } from '../settings/settings.service';
import { priceQuote } from './quote-dto';
import { quoteFileName, quotePdf } from './quote-document';
import { endOfDayEpochSec, newLinkNonce, signQuoteLink } from './quote-link';
import { addDaysIso, formatDate, todayIso } from '../../../shared/dates';
import { expireIfDue, findJobInOrg, findQuoteInOrg, linesOf, quoteDto, recordEvent } from './quotes.service';

/** The private link's signing secret: the server secret (a purpose-bound key is derived from it in quote-link.ts). */
export function linkSecret(deps: AppDeps): string {
  return deps.config.sessionSecret;
}

export function quoteLinkUrl(deps: AppDeps, token: string): string {
  return `${deps.config.appUrl}/q/${encodeURIComponent(token)}`;
}

export function createQuoteSendService(deps: AppDeps) {
  return {
    /**
     * Sends a draft (or re-sends a sent quote) to the customer: the PDF attached and a private link
     * that expires at the end of the valid-until day. A re-send makes a new link; older ones stop working.
     * The job moves to `quoted` if it was earlier in its life.
     */
    async send(actor: SessionUser, id: string, body: { message?: string }) {
      const q = await expireIfDue(await findQuoteInOrg(actor, id));
      if (q.status !== 'draft' && q.status !== 'sent') {
        throw new ConflictError(`a quote that is ${q.status} cannot be sent; edit it to make a new version`, 'quote_not_sendable');
      }
      const job = await findJobInOrg(actor, q.jobId);
      const customer = job.customer!;
      if (!customer.email)
        throw new ValidationError([{ path: 'customer.email', message: 'the customer has no e-mail address: add one to the customer first' }]);
      const lines = await linesOf(q);
      if (lines.length === 0) throw new ValidationError([{ path: 'lines', message: 'the quote has no lines' }]);
      const settings = await loadCompanySettings(actor.organisationId);
      const today = todayIso();
      if (q.status === 'draft') {
        const validUntil = q.validUntil > today ? q.validUntil : addDaysIso(today, settings.validityDays);
        await q.update({ issueDate: today, validUntil });
      }
      const nonce = newLinkNonce();
      const token = signQuoteLink({ quoteId: q.id, nonce, exp: endOfDayEpochSec(q.validUntil) }, linkSecret(deps));
      const url = quoteLinkUrl(deps, token);
      const { totals } = priceQuote(q, lines);
      const pdf = await quotePdf(q, lines, job, settings, deps.storage, url);
      const deposit = depositTerms(totals.grossMinor, await loadPaymentSettings(q.organisationId));
      const total = formatMoney(totals.grossMinor, q.currency, q.locale);
      const subject = `Your loft insulation quote ${q.number}${q.version > 1 ? ` (version ${q.version})` : ''} from ${settings.companyName}`;
      const text = [
        `Dear ${customer.name},`,
        '',
        `Thank you for letting us survey your loft at ${job.addressLine1}, ${job.town}. Your quote ${q.number} is attached as a PDF: ${total} in total, valid until ${formatDate(q.validUntil)}.`,
        ...(deposit ? ['', depositSentence(deposit, (m) => formatMoney(m, q.currency, q.locale))] : []),
        ...(body.message ? ['', body.message] : []),
        '',
        'You can read it, accept it or decline it online at your private link:',
        url,
        '',
        "The link is for you only and stops working after the quote's valid-until date.",
        '',
        `${settings.companyName}${settings.phone ? ` · ${settings.phone}` : ''}${settings.email ? ` · ${settings.email}` : ''}`,
      ].join('\n');
      const firstSend = q.status === 'draft';
      // Guarded: the row is locked while the mail goes out and must still be as read above, so a
      // customer accepting the previous link or an edit at the same moment is never overwritten.
      await deps.sequelize.transaction(async (t) => {
        const locked = await findQuoteInOrg(actor, id, t, { lock: true });
        if (locked.status !== q.status || locked.linkNonce !== q.linkNonce)
          throw new ConflictError(`this quote changed meanwhile (it is ${locked.status} now); reload it`, 'quote_changed');
        await sendCompanyMail(
          deps,
          { organisationId: actor.organisationId, jobId: job.id, userId: actor.id, purpose: 'quote', quoteId: q.id, audience: 'customer' },
          {
            to: customer.email,
            subject,
            text,
            attachments: [{ filename: quoteFileName(q, 'pdf'), content: pdf, contentType: 'application/pdf' }],
          },
        );
        await locked.update({ status: 'sent', linkNonce: nonce, sentAt: new Date() }, { transaction: t });
      });
      await recordEvent(actor.organisationId, job.id, actor.id, firstSend ? 'quote_sent' : 'quote_resent', {
        quoteId: q.id,
        number: q.number,
        version: q.version,
        to: customer.email,
        grossMinor: totals.grossMinor,
        text: `Quote ${q.number}${q.version > 1 ? ` v${q.version}` : ''} ${firstSend ? 'sent' : 'sent again'} to the customer`,
      });
      if (['enquiry', 'surveyed'].includes(job.stage)) {
        const from = job.stage;
        await job.update({ stage: 'quoted' });
        await recordEvent(actor.organisationId, job.id, actor.id, 'stage_changed', { from, to: 'quoted', reason: `quote ${q.number} sent` });
      }
      await q.reload();
      return { quote: await quoteDto(q), link: url };
    },
  };
}
export type QuoteSendService = ReturnType<typeof createQuoteSendService>;
