// The invoice PDF's text, read back with pdf-parse: every amount as the API gives it.
import { describe, expect, it } from 'vitest';
import { PDFParse } from 'pdf-parse';
import { renderInvoicePdf } from '../../server/modules/invoices/invoice-pdf';
import { lineAmounts, sumLines, balanceDue } from '../../server/modules/invoices/invoice-totals';
import type { Invoice } from '../../shared/api/invoices';

async function pdfText(buf: Buffer): Promise<string> {
  const parser = new PDFParse({ data: new Uint8Array(buf) });
  try {
    return (await parser.getText()).text;
  } finally {
    await parser.destroy();
  }
}

function sampleInvoice(over: Partial<Invoice> = {}): Invoice {
  const raw = [
    ['Mineral-wool roll 200 mm, 12 rolls', 12, 2350, 0, 'quote'],
    ['Labour, cross layer', 6.5, 3800, 2000, 'quote'],
    ['Walkway boards (variation on site)', 3, 1299, 2000, 'variation'],
    ['Łódź-pattern hatch seal kit', 1, 1850, 2000, 'variation'],
  ] as const;
  const lines = raw.map(([description, q, u, r, source], i) => ({
    id: `l${i}`,
    position: i,
    description,
    quantity: q,
    unit: 'each',
    unitPriceMinor: u,
    taxClass: r ? 'standard' : 'energy_saving',
    rateBp: r,
    source,
    ...lineAmounts({ quantity: q, unitPriceMinor: u, rateBp: r }),
  }));
  const t = sumLines(lines);
  const deposit = 10000;
  return {
    id: 'i1',
    kind: 'invoice',
    number: 'INV-000017',
    jobId: 'j1',
    jobReference: 'J-0031',
    customerName: 'Mrs Ada Fenwick',
    status: 'issued',
    overdue: false,
    issueDate: '2027-01-20',
    dueDate: '2027-02-03',
    currency: 'GBP',
    grossMinor: t.grossMinor,
    balanceMinor: balanceDue(t.grossMinor, deposit, 0),
    paidAt: null,
    quoteId: 'q1',
    quoteReference: 'Q-0042',
    creditedInvoiceId: null,
    creditedInvoiceNumber: null,
    customerEmail: 'ada@example.com',
    billingAddress: ['14 Wren Close', 'Harrowby', 'HB4 7QL'],
    lines,
    netMinor: t.netMinor,
    taxMinor: t.taxMinor,
    taxByRate: t.taxByRate,
    depositMinor: deposit,
    creditedMinor: 0,
    notes: 'Thank you for your business.',
    reason: '',
    creditNotes: [],
    sentAt: null,
    payUrl: 'http://127.0.0.1:3000/q/invoice/abc123',
    ...over,
  };
}

const company = {
  name: 'Fenbank Loft Insulation Ltd',
  addressLines: ['Unit 3, Mill Yard', 'Harrowby HB1 2AA'],
  email: 'office@fenbank.example.com',
  taxNumber: 'GB 123 4567 89',
};

describe('invoice PDF', () => {
  it('prints number, dates, every line, VAT by rate, deposit and balance to the penny, and the pay link', async () => {
    const inv = sampleInvoice();
    // Hand-worked: net 28200 + 24700 + 3897 + 1850 = 58647; VAT 0 + 4940 + 779 + 370 = 6089;
    // total 64736; less deposit 10000 → balance 54736.
    expect([inv.netMinor, inv.taxMinor, inv.grossMinor, inv.balanceMinor]).toEqual([58647, 6089, 64736, 54736]);
    const buf = await renderInvoicePdf(inv, company);
    expect(buf.subarray(0, 5).toString()).toBe('%PDF-');
    const text = await pdfText(buf);
    for (const s of [
      'Invoice',
      'INV-000017',
      'Fenbank Loft Insulation Ltd',
      'Mrs Ada Fenwick',
      '14 Wren Close',
      'Issued 20 Jan 2027',
      'Due 3 Feb 2027',
      'Quote Q-0042',
      'Job J-0031',
      'Walkway boards (variation on site)',
      'Łódź-pattern hatch seal kit',
      '£282.00',
      '£247.00',
      '£38.97',
      '£46.76', // line totals: 282.00 + 0; 247.00 + 49.40 = 296.40 shown as gross below
      '£296.40',
      '£586.47',
      'VAT at 20% on £304.47',
      '£60.89',
      '£647.36',
      '−£100.00',
      '£547.36',
      'Balance due',
      'http://127.0.0.1:3000/q/invoice/abc123',
    ]) {
      expect(text, s).toContain(s);
    }
  });

  it('a paid invoice shows nothing to pay and no pay link', async () => {
    const text = await pdfText(await renderInvoicePdf(sampleInvoice({ status: 'paid', paidAt: '2027-01-25T10:00:00Z', balanceMinor: 0 }), company));
    expect(text).toContain('Paid in full on 25 Jan 2027');
    expect(text).not.toContain('/q/invoice/abc123');
  });

  it('a credit note is titled as such, names the invoice it credits and the reason', async () => {
    const text = await pdfText(
      await renderInvoicePdf(
        sampleInvoice({ kind: 'credit_note', number: 'CN-000002', creditedInvoiceNumber: 'INV-000017', reason: 'Walkway boards not fitted' }),
        company,
      ),
    );
    expect(text).toContain('Credit note');
    expect(text).toContain('CN-000002');
    expect(text).toContain('Credits invoice INV-000017');
    expect(text).toContain('Walkway boards not fitted');
    expect(text).toContain('Total credited');
  });

  it('prints each quantity with its unit and marks the variations found on site', async () => {
    const inv = sampleInvoice();
    inv.lines[0] = { ...inv.lines[0], unit: 'roll' };
    const text = (await pdfText(await renderInvoicePdf(inv, company))).replace(/\s+/g, ' ');
    expect(text).toContain('12 roll');
    expect(text).toContain('6.5 each');
    expect(text.match(/VARIATION · found on site/g)).toHaveLength(2);
  });

  it.each([14, 18, 22, 26, 40])('keeps the totals on the page of the last of %i lines, never on a page of their own', async (n) => {
    const base = sampleInvoice();
    const lines = Array.from({ length: n }, (_, i) => ({ ...base.lines[i % 4], id: `x${i}`, description: `${base.lines[i % 4].description} no. ${i + 1}` }));
    const parser = new PDFParse({ data: new Uint8Array(await renderInvoicePdf({ ...base, lines }, company)) });
    try {
      const pages = (await parser.getText()).pages.map((p) => p.text);
      const last = pages[pages.length - 1];
      expect(last).toContain('Balance due');
      expect(last).toContain(`no. ${n}`);
      expect(pages.filter((p) => p.includes('Balance due'))).toHaveLength(1);
    } finally {
      await parser.destroy();
    }
  });
});
