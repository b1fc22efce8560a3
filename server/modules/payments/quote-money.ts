import type { Quote } from '../../db/models/quote';
import { priceQuote } from '../quotes/quote-dto';
import { linesOf } from '../quotes/quotes.service';

/** The quote's total as the quote itself prices it (its own tax rates, on its issue date). */
export async function quoteGrossMinor(quote: Quote): Promise<number> {
  return priceQuote(quote, await linesOf(quote)).totals.grossMinor;
}

/** The quote's lines priced exactly as the quote shows them. */
export async function pricedQuoteLines(quote: Quote) {
  return priceQuote(quote, await linesOf(quote)).totals;
}
