import type { AcceptQuoteBody, LinkProblem, PublicQuote } from '../../../shared/api/quotes';
import type { AppDeps } from '../../deps';
import { Quote } from '../../db/models/quote';
import { AppError } from '../../lib/errors';
import { formatMoney } from '../../../shared/quote/money';
import { loadCompanySettings } from '../settings/settings.service';
import { addressLines, quoteFileName, quotePdf } from '../quotes/quote-document';
import { priceQuote } from '../quotes/quote-dto';
import { verifyQuoteLink } from '../quotes/quote-link';
import { depositTerms } from '../../../shared/quote/deposit';
import { mailOffice } from '../mail/mail.service';
import { loadPaymentSettings } from '../settings/payment-settings';
import { linkSecret, quoteLinkUrl } from '../quotes/quote-send.service';
import { expireIfDue, findJobInOrg, linesOf, recordEvent, withDerivedStatus } from '../quotes/quotes.service';

const PROBLEM: Record<LinkProblem, { status: number; message: string }> = {
  invalid: { status: 404, message: 'This link is not valid. Check that you copied the whole link from the e-mail, or ask us to send it again.' },
  expired: { status: 410, message: 'This quote has expired. Get in touch and we will gladly send you an up-to-date one.' },
  used: { status: 409, message: 'This quote has already been answered; nothing was changed.' },
  replaced: { status: 410, message: 'This quote has been replaced by a newer version. Please use the link in our latest e-mail.' },
  withdrawn: { status: 410, message: 'This quote is no longer available. Please get in touch with us.' },
};

export class LinkError extends AppError {
  constructor(readonly problem: LinkProblem) {
    super(PROBLEM[problem].status, `link_${problem}`, PROBLEM[problem].message);
  }
}

/**
 * The customer's side of a quote, reached only through the signed private link. Every action
 * re-checks the signature, the expiry, the nonce of the latest send and the quote's state, and
 * changes rows only with a guarded UPDATE (status still `sent`, same nonce), so a second use,
 * a race between two tabs, an expired or a tampered link changes nothing.
 */
export function createPublicQuoteService(deps: AppDeps) {
  async function resolve(token: string, { forAction }: { forAction: boolean }) {
    const check = verifyQuoteLink(token, linkSecret(deps));
    if (!check.ok && check.problem === 'invalid') throw new LinkError('invalid');
    const claims = check.claims!;
    const q = await Quote.findByPk(claims.quoteId);
    if (!q) throw new LinkError('invalid');
    // Viewing derives the status; only an answer (a write) stores it.
    if (forAction) await expireIfDue(q);
    else withDerivedStatus(q);
    if (q.status === 'superseded') throw new LinkError('replaced');
    if (q.status === 'draft') throw new LinkError('withdrawn');
    if (q.linkNonce !== claims.nonce) throw new LinkError(q.status === 'sent' ? 'replaced' : 'invalid');
    if (!check.ok) throw new LinkError('expired');
    if (q.status === 'expired') throw new LinkError('expired');
    if (forAction && q.status !== 'sent') throw new LinkError('used');
    return q;
  }

  async function view(q: Quote): Promise<PublicQuote> {
    const lines = await linesOf(q);
    const { snap, totals, saving } = priceQuote(q, lines);
    const job = await findJobInOrg({ organisationId: q.organisationId }, q.jobId);
    const s = await loadCompanySettings(q.organisationId);
    return {
      status: q.status,
      number: q.number,
      version: q.version,
      company: { name: s.companyName, email: s.email, phone: s.phone, address: addressLines(s.address).join(', ') },
      customerName: job.customer!.name,
      propertyAddress: addressLines({ line1: job.addressLine1, line2: job.addressLine2, town: job.town, postcode: job.postcode }).join(', '),
      currency: q.currency,
      locale: q.locale,
      issueDate: q.issueDate,
      validUntil: q.validUntil,
      lines: totals.lines.map((p) => ({
        description: p.line.description,
        quantity: p.line.quantity,
        unit: p.line.unit,
        unitPriceMinor: p.line.unitPriceMinor,
        netMinor: p.netMinor,
        rateBp: p.rateBp,
      })),
      totals: { netMinor: totals.netMinor, taxByRate: totals.taxByRate, taxMinor: totals.taxMinor, grossMinor: totals.grossMinor },
      saving,
      deposit: depositTerms(totals.grossMinor, await loadPaymentSettings(q.organisationId)),
      cautions: snap.cautions,
      customerBeforeInstall: snap.customerBeforeInstall,
      terms: s.terms,
      acceptedName: q.acceptedName ?? null,
      acceptedAt: q.acceptedAt ? q.acceptedAt.toISOString() : null,
      declinedAt: q.declinedAt ? q.declinedAt.toISOString() : null,
    };
  }

  /**
   * Tells the office. Best effort: the customer's answer is already recorded (and on the job's
   * timeline), so a mail server that is down must not turn it into an error for the customer.
   */
  async function notifyOffice(q: Quote, subject: string, text: string) {
    try {
      await mailOffice(deps, { organisationId: q.organisationId, jobId: q.jobId, userId: null, purpose: 'quote_answer', quoteId: q.id }, subject, text);
    } catch (e) {
      deps.logger.error(`office notice for quote ${q.number} not sent: ${e instanceof Error ? e.message : String(e)}`);
    }
  }

  /** The guarded UPDATE changed nothing: someone else changed the quote meanwhile; say what they did. */
  async function lostRace(token: string): Promise<LinkError> {
    try {
      await resolve(token, { forAction: true });
    } catch (e) {
      if (e instanceof LinkError) return e;
      throw e;
    }
    return new LinkError('used');
  }

  return {
    async get(token: string) {
      return view(await resolve(token, { forAction: false }));
    },

    async pdf(token: string) {
      const q = await resolve(token, { forAction: false });
      const job = await findJobInOrg({ organisationId: q.organisationId }, q.jobId);
      const settings = await loadCompanySettings(q.organisationId);
      return { filename: quoteFileName(q, 'pdf'), data: await quotePdf(q, await linesOf(q), job, settings, deps.storage, quoteLinkUrl(deps, token)) };
    },

    async accept(token: string, body: AcceptQuoteBody, meta: { ip?: string }) {
      const q = await resolve(token, { forAction: true });
      const job = await findJobInOrg({ organisationId: q.organisationId }, q.jobId);
      const accepted = await deps.sequelize.transaction(async (t) => {
        const [n] = await Quote.update(
          { status: 'accepted', acceptedAt: new Date(), acceptedName: body.name },
          { where: { id: q.id, status: 'sent', linkNonce: q.linkNonce }, transaction: t },
        );
        if (n !== 1) return false;
        const from = job.stage;
        await job.update({ stage: 'accepted' }, { transaction: t });
        await recordEvent(
          q.organisationId,
          job.id,
          null,
          'quote_accepted',
          {
            quoteId: q.id,
            number: q.number,
            version: q.version,
            name: body.name,
            ip: meta.ip ?? null,
            text: `Quote ${q.number} accepted by ${body.name} through the private link`,
          },
          t,
        );
        if (from !== 'accepted')
          await recordEvent(q.organisationId, job.id, null, 'stage_changed', { from, to: 'accepted', reason: `quote ${q.number} accepted by the customer` }, t);
        return true;
      });
      if (!accepted) throw await lostRace(token);
      await q.reload();
      const { totals } = priceQuote(q, await linesOf(q));
      await notifyOffice(
        q,
        `Quote ${q.number} accepted by ${body.name}`,
        `${body.name} accepted quote ${q.number}${q.version > 1 ? ` (version ${q.version})` : ''} for job ${job.reference} at ${job.addressLine1}, ${job.town}: ${formatMoney(totals.grossMinor, q.currency, q.locale)}.\nThe job is now "accepted": schedule the install.\n${deps.config.appUrl}/jobs/${job.id}`,
      );
      return view(q);
    },

    async decline(token: string, body: { reason: string }) {
      const q = await resolve(token, { forAction: true });
      const job = await findJobInOrg({ organisationId: q.organisationId }, q.jobId);
      const declined = await deps.sequelize.transaction(async (t) => {
        const [n] = await Quote.update(
          { status: 'declined', declinedAt: new Date(), declineReason: body.reason || null },
          { where: { id: q.id, status: 'sent', linkNonce: q.linkNonce }, transaction: t },
        );
        if (n !== 1) return false;
        const from = job.stage;
        if (['enquiry', 'surveyed', 'quoted'].includes(from)) {
          await job.update({ stage: 'declined' }, { transaction: t });
          await recordEvent(q.organisationId, job.id, null, 'stage_changed', { from, to: 'declined', reason: `quote ${q.number} declined by the customer` }, t);
        }
        await recordEvent(
          q.organisationId,
          job.id,
          null,
          'quote_declined',
          {
            quoteId: q.id,
            number: q.number,
            version: q.version,
            reason: body.reason || null,
            text: `Quote ${q.number} declined by the customer${body.reason ? `: ${body.reason}` : ''}`,
          },
          t,
        );
        return true;
      });
      if (!declined) throw await lostRace(token);
      await q.reload();
      await notifyOffice(
        q,
        `Quote ${q.number} declined`,
        `The customer declined quote ${q.number} for job ${job.reference} at ${job.addressLine1}, ${job.town}.\nReason: ${body.reason || '(none given)'}\n${deps.config.appUrl}/jobs/${job.id}`,
      );
      return view(q);
    },
  };
}

export type PublicQuoteService = ReturnType<typeof createPublicQuoteService>;
