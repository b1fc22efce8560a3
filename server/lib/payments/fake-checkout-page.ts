// The page of the local payments stand-in (fake-service.ts) that takes the place of the hosted
// checkout: plain HTML with a banner saying that no money moves.

/** `s` with the five HTML-special characters escaped, for text and attribute values. */
export const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** A whole page: `title` (escaped) over `body` (HTML, escaped by the caller). */
export function page(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)} — local test checkout</title>
<style>
  body { font: 16px/1.5 system-ui, sans-serif; background: #eef1f4; color: #1d2329; margin: 0; }
  .banner { background: #ffe27a; color: #3b2f00; padding: .6rem 1rem; text-align: center; font-weight: 600; }
  main { max-width: 26rem; margin: 2rem auto; background: #fff; border: 1px solid #cfd6dd; border-radius: 6px; padding: 1.5rem; }
  h1 { font-size: 1.2rem; margin: 0 0 1rem; }
  table { width: 100%; border-collapse: collapse; margin-bottom: 1rem; }
  td { padding: .35rem 0; border-bottom: 1px solid #e3e7eb; } .num { text-align: right; font-variant-numeric: tabular-nums; }
  .total td { font-weight: 700; border-bottom: 0; }
  .ref { font-size: .9rem; color: #52606d; }
  button { width: 100%; padding: .7rem; font: inherit; border-radius: 4px; cursor: pointer; margin-top: .5rem; }
  .pay { background: #1d4ed8; color: #fff; border: 0; font-weight: 600; } .cancel { background: #fff; border: 1px solid #9aa5b1; }
</style></head><body>
<div class="banner" role="note">Local test checkout — a stand-in for the payment service. No card is charged and no money moves.</div>
<main><h1>${escapeHtml(title)}</h1>${body}</main></body></html>`;
}
