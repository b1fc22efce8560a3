import { formatMoney } from '../../../shared/quote/money';
import { formatRateBp } from '../../../shared/quote/tax';
import { depositSentence, type DepositTerms } from '../../../shared/quote/deposit';
import { bullets, ensureSpace, heading, letterhead, newDocument, table } from './document';
import { formatDate } from '../../../shared/dates';
import { PALETTE } from '../../../shared/palette';
import { drawPlan, type PlanForDrawing } from './plan-drawing';

/** Everything the customer's quote PDF prints. Money in minor units. */
export interface QuotePdfData {
  company: { name: string; addressLines: string[]; email: string; phone: string; taxNumber: string; logo?: Buffer | null };
  customer: { name: string; email: string; phone: string };
  propertyAddressLines: string[];
  quote: { number: string; version: number; issueDate: string; validUntil: string; currency: string; locale: string; jobReference: string };
  lines: Array<{ description: string; quantity: number; unit: string; unitPriceMinor: number; netMinor: number; rateBp: number; note?: string | null }>;
  /** The deposit asked on acceptance, said before the customer accepts; null when none. */
  deposit: DepositTerms | null;
  totals: { netMinor: number; taxByRate: Array<{ rateBp: number; netMinor: number; taxMinor: number }>; taxMinor: number; grossMinor: number };
  saving: { kwhPerYear: number; minorPerYear: number; paybackYears: number | null } | null;
  spaces: Array<{
    name: string;
    plan: unknown;
    netAreaM2: number | null;
    uBefore: number | null;
    uAfter: number | null;
    thermalText?: string;
    layers: string[];
  }>;
  siteHours: number;
  crewSize: number;
  cautions: string[];
  customerBeforeInstall: string[];
  terms: string;
  /** The private link for accepting online; absent on an office copy made before sending. */
  acceptUrl?: string | null;
  notes?: string;
}

function qty(n: number) {
  return Number.isInteger(n) ? String(n) : n.toFixed(3).replace(/0+$/, '');
}

/** The quote as a customer-facing PDF (A4, Inter and JetBrains Mono embedded). */
export async function renderQuotePdf(d: QuotePdfData): Promise<Buffer> {
  const { doc, done } = newDocument(`Quote ${d.quote.number}`);
  const money = (m: number) => formatMoney(m, d.quote.currency, d.quote.locale);
  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;

  letterhead(doc, {
    company: {
      name: d.company.name,
      lines: [...d.company.addressLines, d.company.email, d.company.phone, d.company.taxNumber ? `VAT/tax no. ${d.company.taxNumber}` : ''],
      logo: d.company.logo,
    },
    title: 'Quote',
    facts: [
      `${d.quote.number}${d.quote.version > 1 ? ` v${d.quote.version}` : ''}`,
      `Job ${d.quote.jobReference}`,
      `Issued ${formatDate(d.quote.issueDate)}`,
      `Valid until ${formatDate(d.quote.validUntil)}`,
    ],
  });

  // Customer and property.
  const y0 = doc.y;
  doc.font('ui-bold').fontSize(9).fillColor(PALETTE.graphiteLight).text('FOR', left, y0);
  doc
    .font('ui')
    .fontSize(10)
    .fillColor(PALETTE.graphite)
    .text(d.customer.name, left, doc.y, { width: width / 2 - 10 });
  for (const l of [d.customer.email, d.customer.phone].filter(Boolean)) doc.fontSize(9).text(l, left, doc.y, { width: width / 2 - 10 });
  const yl = doc.y;
  doc
    .font('ui-bold')
    .fontSize(9)
    .fillColor(PALETTE.graphiteLight)
    .text('PROPERTY', left + width / 2, y0);
  doc.font('ui').fontSize(10).fillColor(PALETTE.graphite);
  for (const l of d.propertyAddressLines) doc.text(l, left + width / 2, doc.y, { width: width / 2 });
  doc.y = Math.max(yl, doc.y) + 6;
  doc.x = left;

  // Plans.
  if (d.spaces.length) {
    heading(doc, 'The loft');
    const boxW = (width - 12) / 2,
      boxH = 150;
    for (let i = 0; i < d.spaces.length; i += 2) {
      ensureSpace(doc, boxH + 60);
      const rowY = doc.y;
      let maxY = rowY;
      for (let k = 0; k < 2 && i + k < d.spaces.length; k += 1) {
        const s = d.spaces[i + k];
        const bx = left + k * (boxW + 12);
        doc.rect(bx, rowY, boxW, boxH).lineWidth(0.5).strokeColor(PALETTE.paperLine).stroke();
        drawPlan(doc, s.plan as PlanForDrawing, { x: bx, y: rowY, width: boxW, height: boxH });
        doc
          .font('ui-bold')
          .fontSize(9.5)
          .fillColor(PALETTE.graphite)
          .text(s.name, bx, rowY + boxH + 4, { width: boxW });
        const facts = [
          s.netAreaM2 !== null ? `${s.netAreaM2.toFixed(1)} m² to insulate` : '',
          s.thermalText ?? (s.uBefore !== null && s.uAfter !== null ? `U-value ${s.uBefore.toFixed(2)} → ${s.uAfter.toFixed(2)} W/m²K` : ''),
          ...s.layers,
        ].filter(Boolean);
        doc.font('ui').fontSize(8.5).fillColor(PALETTE.graphiteLight).text(facts.join(' · '), bx, doc.y, { width: boxW });
        maxY = Math.max(maxY, doc.y);
      }
      doc.y = maxY + 8;
      doc.x = left;
    }
    doc
      .font('ui')
      .fontSize(7.5)
      .fillColor(PALETTE.graphiteLight)
      .text(
        'Timber lines: joists. Red hatching: areas not covered (tank, hatch, boarded, clearances). Blue: the eaves, where the ventilation gap is kept.',
        left,
        doc.y,
        { width },
      );
  }

  // Lines.
  heading(doc, 'What we will do and supply');
  const cols = [
    { header: 'Item', width: width - 250 },
    { header: 'Qty', width: 55, align: 'right' as const, mono: true },
    { header: 'Unit price', width: 70, align: 'right' as const, mono: true },
    { header: 'VAT', width: 45, align: 'right' as const, mono: true },
    { header: 'Amount', width: 80, align: 'right' as const, mono: true },
  ];
  // Totals (header, net, a row per rate, total), the VAT note and the deposit sentence stay with the last line.
  const totalsHeightPt = 14 + (2 + d.totals.taxByRate.length) * 16 + 14 + (d.deposit ? 30 : 0);
  table(
    doc,
    cols,
    d.lines.map((l) => [l.description, `${qty(l.quantity)} ${l.unit}`, money(l.unitPriceMinor), formatRateBp(l.rateBp), money(l.netMinor)]),
    { keepLastRowWithPt: totalsHeightPt },
  );
  doc.moveDown(0.4);
  const totalRows: string[][] = [['Total before VAT', '', '', '', money(d.totals.netMinor)]];
  for (const b of d.totals.taxByRate) totalRows.push([`VAT at ${formatRateBp(b.rateBp)} on ${money(b.netMinor)}`, '', '', '', money(b.taxMinor)]);
  totalRows.push(['Total to pay', '', '', '', money(d.totals.grossMinor)]);
  table(
    doc,
    cols.map((c) => ({ ...c, header: '' })),
    totalRows,
    { boldLastRows: 1 },
  );
  // How the pennies are rounded is the office's concern (it is on the quote builder), not the customer's.
  doc
    .font('ui')
    .fontSize(7.5)
    .fillColor(PALETTE.graphiteLight)
    .text(`VAT at the rates in force on ${formatDate(d.quote.issueDate)}.`, left, doc.y + 2, { width });
  if (d.deposit) {
    doc
      .font('ui-bold')
      .fontSize(9.5)
      .fillColor(PALETTE.graphite)
      .text(depositSentence(d.deposit, money), left, doc.y + 6, { width });
    doc.font('ui');
  }
  if (d.siteHours > 0) {
    doc
      .fontSize(9)
      .fillColor(PALETTE.graphite)
      .text(`About ${d.siteHours} hours on site for a crew of ${d.crewSize}.`, left, doc.y + 4, { width });
  }
  if (d.notes) doc.fontSize(9).text(d.notes, left, doc.y + 4, { width });

  if (d.saving && d.saving.minorPerYear > 0) {
    heading(doc, 'Estimated saving');
    doc.text(
      `About ${Math.round(d.saving.kwhPerYear).toLocaleString(d.quote.locale)} kWh of heating fuel a year, worth about ${money(d.saving.minorPerYear)} a year at today's prices` +
        (d.saving.paybackYears !== null ? `: the work pays for itself in about ${d.saving.paybackYears} years.` : '.'),
      left,
      doc.y,
      { width },
    );
    doc
      .fontSize(7.5)
      .fillColor(PALETTE.graphiteLight)
      .text(
        "An estimate from the change in U-value, the area, a standard year's heating degree days and your heating system's efficiency; real savings depend on how the home is heated and used.",
        left,
        doc.y + 2,
        { width },
      );
    doc.fillColor(PALETTE.graphite);
  }

  heading(doc, 'Safety and cautions');
  bullets(doc, d.cautions);
  heading(doc, 'Before we come: please');
  bullets(doc, d.customerBeforeInstall);
  if (d.terms.trim()) {
    heading(doc, 'Terms');
    bullets(
      doc,
      d.terms
        .split(/\n+/)
        .map((t) => t.trim())
        .filter(Boolean),
    );
  }

  heading(doc, 'How to accept');
  ensureSpace(doc, 60);
  if (d.acceptUrl) {
    doc.text('Open your private link, check the quote, type your name and press Accept. You can also decline there and tell us why.', left, doc.y, { width });
    doc
      .font('mono')
      .fontSize(8)
      .fillColor(PALETTE.teal)
      .text(d.acceptUrl, left, doc.y + 4, { width, link: d.acceptUrl, underline: true });
  } else {
    doc.text('We will e-mail you a private link to accept or decline this quote online.', left, doc.y, { width });
  }
  doc
    .font('ui')
    .fontSize(9)
    .fillColor(PALETTE.graphite)
    .text(
      `Or reply to ${d.company.email || 'us'}${d.company.phone ? `, or call ${d.company.phone}` : ''}, quoting ${d.quote.number}. This quote is valid until ${formatDate(d.quote.validUntil)}.`,
      left,
      doc.y + 6,
      { width },
    );

  return done(`${d.company.name} · Quote ${d.quote.number}${d.quote.version > 1 ? ` v${d.quote.version}` : ''}`);
}
