/**
 * The invoice and credit note PDF: Quiltline's own layout on A4, Inter from
 * @expo-google-fonts/inter (full TTFs: pdfkit cannot embed WOFF2, and the @fontsource files are
 * subset per script). Figures use Inter's tabular numerals ('tnum'); JetBrains Mono is not used
 * here because fontkit fails on its ligature glyphs ("//", "->", "==") in URLs and notes. Every amount printed is the integer minor units of the invoice formatted
 * once, so the PDF, the API and the payment service agree to the penny.
 */
import type PDFKit from 'pdfkit';
import type { Invoice } from '../../../shared/api/invoices';
import { formatMoney } from '../../../shared/quote/money';
import { formatRateBp } from '../../../shared/quote/tax';
import { letterhead, MARGIN, newDocument } from '../../lib/pdf/document';
import { PALETTE } from '../../../shared/palette';
import { formatDate } from '../../../shared/dates';

export interface CompanyDetails {
  name: string;
  addressLines: string[];
  email: string;
  phone?: string;
  taxNumber?: string;
}

/** 1.5 → "1.5"; 2 → "2" (quantities have at most three decimals). */
export function formatQuantity(quantity: number): string {
  return quantity.toLocaleString('en-GB', { maximumFractionDigits: 3 });
}

/** Render the invoice (or credit note) to a PDF buffer. */
/** Height of what follows the lines (totals, the pay link, notes), so it can be kept with the last line. */
function tailHeightOf(doc: PDFKit.PDFDocument, invoice: Invoice, width: number): number {
  const isCredit = invoice.kind === 'credit_note';
  const totalRows = 1 + invoice.taxByRate.length + (isCredit ? 0 : (invoice.depositMinor ? 1 : 0) + (invoice.creditedMinor ? 1 : 0));
  let h = 8 + totalRows * 14 + (isCredit ? 18 : 36);
  if (!isCredit && invoice.status !== 'paid' && invoice.balanceMinor > 0 && invoice.payUrl) h += 12 + 40;
  else if (!isCredit && invoice.status === 'paid') h += 26;
  if (invoice.notes) h += 14 + doc.font('ui').fontSize(9).heightOfString(invoice.notes, { width });
  return h;
}

export function renderInvoicePdf(invoice: Invoice, company: CompanyDetails): Promise<Buffer> {
  const title = `${invoice.kind === 'credit_note' ? 'Credit note' : 'Invoice'} ${invoice.number}`;
  const { doc, done } = newDocument(title, { author: company.name });
  // Amounts in Inter with tabular figures, so columns line up.
  const TNUM = { features: ['tnum' as const] };
  const money = (m: number) => formatMoney(m, invoice.currency);
  const left = MARGIN;
  const right = doc.page.width - MARGIN;
  const width = right - left;
  const isCredit = invoice.kind === 'credit_note';

  letterhead(doc, {
    company: {
      name: company.name,
      lines: [...company.addressLines, company.email, company.phone, company.taxNumber ? `VAT no. ${company.taxNumber}` : undefined],
    },
    title: isCredit ? 'Credit note' : 'Invoice',
    titleColor: isCredit ? PALETTE.brick : PALETTE.timber,
    facts: [
      invoice.number,
      `Issued ${formatDate(invoice.issueDate)}`,
      ...(!isCredit && invoice.dueDate ? [`Due ${formatDate(invoice.dueDate)}`] : []),
      `Job ${invoice.jobReference}`,
      ...(invoice.quoteReference ? [`Quote ${invoice.quoteReference}`] : []),
      ...(invoice.creditedInvoiceNumber ? [`Credits invoice ${invoice.creditedInvoiceNumber}`] : []),
    ],
  });

  // Bill to
  let y = Math.max(doc.y, 150) + 16;
  doc.font('ui-bold').fontSize(9).fillColor(PALETTE.graphiteLight).text('BILL TO', left, y);
  doc
    .font('ui')
    .fontSize(10)
    .fillColor(PALETTE.graphite)
    .text(invoice.customerName, left, doc.y + 2);
  for (const l of invoice.billingAddress) doc.text(l);
  if (isCredit && invoice.reason) {
    doc.moveDown(0.6).font('ui-bold').fontSize(9).fillColor(PALETTE.graphiteLight).text('REASON');
    doc.font('ui').fontSize(10).fillColor(PALETTE.graphite).text(invoice.reason, { width });
  }

  // Lines table
  // Right-aligned numeric columns from the right edge: total 75, net 70, VAT 40, unit 65, qty with its unit 70.
  const cols = { desc: left, qty: right - 335, unit: right - 260, rate: right - 190, net: right - 145, total: right - 75 };
  const descWidth = cols.qty - left - 8;
  y = doc.y + 20;
  const header = () => {
    doc.font('ui-bold').fontSize(8).fillColor(PALETTE.graphiteLight);
    doc.text('DESCRIPTION', cols.desc, y);
    doc.text('QTY', cols.qty, y, { width: 70, align: 'right', ...TNUM });
    doc.text('UNIT', cols.unit, y, { width: 65, align: 'right', ...TNUM });
    doc.text('VAT', cols.rate, y, { width: 40, align: 'right', ...TNUM });
    doc.text('NET', cols.net, y, { width: 65, align: 'right', ...TNUM });
    doc.text('TOTAL', cols.total, y, { width: 75, align: 'right', ...TNUM });
    y += 14;
    doc.moveTo(left, y).lineTo(right, y).lineWidth(0.8).strokeColor(PALETTE.graphite).stroke();
    y += 6;
  };
  header();
  // The totals and what follows them stay on the page of the last line: never a page of its own.
  const bottom = doc.page.height - doc.page.margins.bottom - 24;
  const tailHeight = tailHeightOf(doc, invoice, width);
  invoice.lines.forEach((line, i) => {
    doc.font('ui').fontSize(9.5);
    const isVariation = line.source === 'variation';
    const descHeight = doc.heightOfString(line.description, { width: descWidth }) + (isVariation ? 11 : 0);
    const isLast = i === invoice.lines.length - 1;
    if (y + descHeight + (isLast ? tailHeight : 0) > bottom) {
      doc.addPage();
      y = MARGIN;
      header();
    }
    doc.fillColor(PALETTE.graphite).text(line.description, cols.desc, y, { width: descWidth });
    if (isVariation)
      doc
        .font('ui-bold')
        .fontSize(7.5)
        .fillColor(PALETTE.timber)
        .text('VARIATION · found on site', cols.desc, doc.y + 1, { width: descWidth });
    doc.font('ui').fontSize(9).fillColor(PALETTE.graphite);
    doc.text(`${formatQuantity(line.quantity)} ${line.unit}`, cols.qty, y, { width: 70, align: 'right', ...TNUM });
    doc.text(money(line.unitPriceMinor), cols.unit, y, { width: 65, align: 'right', ...TNUM });
    doc.text(formatRateBp(line.rateBp), cols.rate, y, { width: 40, align: 'right', ...TNUM });
    doc.text(money(line.netMinor), cols.net, y, { width: 65, align: 'right', ...TNUM });
    doc.text(money(line.grossMinor), cols.total, y, { width: 75, align: 'right', ...TNUM });
    y += Math.max(descHeight, 12) + 6;
    doc
      .moveTo(left, y - 3)
      .lineTo(right, y - 3)
      .lineWidth(0.4)
      .strokeColor(PALETTE.paperLine)
      .stroke();
  });

  // Totals
  y += 8;
  const row = (label: string, value: string, bold = false) => {
    doc
      .font(bold ? 'ui-bold' : 'ui')
      .fontSize(bold ? 11 : 9.5)
      .fillColor(PALETTE.graphite)
      .text(label, right - 260, y, { width: 170, align: 'right', ...TNUM });
    doc
      .font(bold ? 'ui-bold' : 'ui')
      .fontSize(bold ? 11 : 9.5)
      .text(value, right - 85, y, { width: 85, align: 'right', ...TNUM });
    y += bold ? 18 : 14;
  };
  row('Net', money(invoice.netMinor));
  for (const t of invoice.taxByRate) row(`VAT at ${formatRateBp(t.rateBp)} on ${money(t.netMinor)}`, money(t.taxMinor));
  row(isCredit ? 'Total credited' : 'Total', money(invoice.grossMinor), true);
  if (!isCredit) {
    if (invoice.depositMinor) row('Less deposit paid', `−${money(invoice.depositMinor)}`);
    if (invoice.creditedMinor) row('Less credit notes', `−${money(invoice.creditedMinor)}`);
    row(invoice.status === 'paid' ? 'Paid' : 'Balance due', money(invoice.status === 'paid' ? 0 : invoice.balanceMinor), true);
  }

  // How to pay
  if (!isCredit && invoice.status !== 'paid' && invoice.balanceMinor > 0 && invoice.payUrl) {
    y += 12;
    doc.font('ui-bold').fontSize(10).fillColor(PALETTE.timber).text('Pay online', left, y);
    doc
      .font('ui')
      .fontSize(9)
      .fillColor(PALETTE.graphite)
      .text('Pay the balance by card at this private link:', left, doc.y + 2, { width });
    doc.font('ui').fontSize(8.5).fillColor(PALETTE.graphite).text(invoice.payUrl, { width, link: invoice.payUrl, underline: false });
  } else if (!isCredit && invoice.status === 'paid' && invoice.paidAt) {
    y += 12;
    doc
      .font('ui-bold')
      .fontSize(10)
      .fillColor(PALETTE.timber)
      .text(`Paid in full on ${formatDate(invoice.paidAt)}. Thank you.`, left, y);
  }
  if (invoice.notes) {
    doc.moveDown(1).font('ui').fontSize(9).fillColor(PALETTE.graphiteLight).text(invoice.notes, left, doc.y, { width });
  }
  return done(`${company.name} · ${title}`);
}
