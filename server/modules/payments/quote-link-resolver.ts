import { Quote } from '../../db/models/quote';
import { verifyQuoteLink } from '../quotes/quote-link';

/**
 * The quote a customer's private link names, for the deposit page. The signature must be good;
 * an expired link still opens the deposit of a quote already accepted through it (the customer
 * accepted in time). The nonce must be the quote's current one, so a replaced link is refused.
 */
export async function quoteFromLink(token: string, secret: string): Promise<Quote | null> {
  const check = verifyQuoteLink(token, secret);
  const claims = check.ok ? check.claims : check.problem === 'expired' ? check.claims : undefined;
  if (!claims) return null;
  const quote = await Quote.findByPk(claims.quoteId);
  if (!quote || !quote.linkNonce || quote.linkNonce !== claims.nonce) return null;
  if (!check.ok && quote.status !== 'accepted') return null;
  return quote;
}
