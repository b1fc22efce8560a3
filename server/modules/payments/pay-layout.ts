/** The customer's payment pages (no sign-in): plain server-rendered HTML in Quiltline's notebook look. */
import { formatMoney } from '../../../shared/quote/money';
import { PALETTE } from '../../../shared/palette';

export const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** CSP for these pages: forms may post here and be redirected on to the hosted checkout only. */
export function payPageCsp(checkoutOrigins: string[]): string {
  return [
    "default-src 'self'",
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data:",
    "font-src 'self'",
    `form-action 'self' ${checkoutOrigins.join(' ')}`,
    "frame-ancestors 'none'",
    "base-uri 'self'",
    "object-src 'none'",
  ].join('; ');
}

/** The notebook palette (shared/palette.ts), the same as the app and the PDFs. */
const P = PALETTE;

export function payLayout(title: string, body: string, opts: { company?: string; refreshSeconds?: number } = {}): string {
  return `<!doctype html><html lang="en-GB"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
${opts.refreshSeconds ? `<meta http-equiv="refresh" content="${opts.refreshSeconds}">` : ''}
<title>${escapeHtml(title)}${opts.company ? ` — ${escapeHtml(opts.company)}` : ''}</title>
<style>
  @font-face { font-family: Inter; font-weight: 400; font-display: swap; src: url(/pay/fonts/inter-400.woff2) format('woff2'); }
  @font-face { font-family: Inter; font-weight: 600; font-display: swap; src: url(/pay/fonts/inter-600.woff2) format('woff2'); }
  @font-face { font-family: Inter; font-weight: 700; font-display: swap; src: url(/pay/fonts/inter-700.woff2) format('woff2'); }
  :root { color-scheme: light; }
  body { margin: 0; font: 16px/1.55 Inter, system-ui, sans-serif; color: ${P.graphite}; background: ${P.paper};
    background-image: linear-gradient(${P.paperLine} 1px, transparent 1px), linear-gradient(90deg, ${P.paperLine} 1px, transparent 1px); background-size: 40px 40px; }
  main { max-width: 34rem; margin: 3rem auto; padding: 1.75rem; background: #fffdf8; border: 1px solid ${P.paperLine}; border-radius: 8px; box-shadow: 0 1px 2px rgba(51,54,59,.08); }
  .company { font-size: .85rem; letter-spacing: .04em; text-transform: uppercase; color: ${P.timber}; margin: 0 0 .25rem; }
  h1 { font-size: 1.45rem; margin: 0 0 1rem; }
  .amount { font-size: 2rem; font-weight: 700; font-variant-numeric: tabular-nums; margin: .25rem 0 1rem; }
  dl { display: grid; grid-template-columns: auto 1fr; gap: .3rem 1rem; margin: 0 0 1.25rem; } dt { color: ${P.graphiteLight}; } dd { margin: 0; font-variant-numeric: tabular-nums; }
  .btn { display: inline-block; border: 0; border-radius: 6px; padding: .75rem 1.3rem; font: inherit; font-weight: 600; cursor: pointer; text-decoration: none; }
  .btn-primary { background: ${P.teal}; color: #fff; } .btn-primary:hover { background: ${P.tealDark}; }
  .btn-quiet { background: transparent; color: ${P.graphite}; border: 1px solid ${P.graphiteFaint}; }
  .note { font-size: .9rem; color: ${P.graphiteLight}; }
  .ok { border-left: 4px solid ${P.teal}; padding: .5rem .9rem; background: #eef8f7; }
  .warn { border-left: 4px solid ${P.straw}; padding: .5rem .9rem; background: #fcf5e1; }
  .actions { display: flex; gap: .75rem; flex-wrap: wrap; align-items: center; }
</style></head><body><main>
${opts.company ? `<p class="company">${escapeHtml(opts.company)}</p>` : ''}
<h1>${escapeHtml(title)}</h1>
${body}
</main></body></html>`;
}

export const money = (minor: number, currency: string) => escapeHtml(formatMoney(minor, currency));
