import type { Quote as QuoteDto } from '../../../shared/api/quotes';
import { formatDate } from '../../../shared/dates';
import { currencyDigits, minorToDecimalString } from '../../../shared/quote/money';
import { formatRateBp } from '../../../shared/quote/tax';
import type { QuoteSnapshot } from './quote-dto';

export interface QuoteExportInput {
  quote: QuoteDto;
  jobReference: string;
  customerName: string;
  spaces: QuoteSnapshot['spaces'];
}

/** A CSV cell: quoted when needed (RFC 4180); text that a spreadsheet would run as a formula is defused. */
function cell(v: string | number | null | undefined, isText = typeof v === 'string'): string {
  if (v === null || v === undefined) return '';
  let s = String(v);
  if (isText && /^[=+\-@\t\r]/.test(s)) s = `'${s}`;
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/**
 * The quote lines, the totals and the takeoff per space as one CSV (UTF-8 with BOM, CRLF), money
 * as plain decimals in the quote's currency so a spreadsheet or bookkeeping import reads them exactly.
 */
export function quoteCsv({ quote: q, jobReference, customerName, spaces }: QuoteExportInput): string {
  const m = (minor: number) => minorToDecimalString(minor, q.currency);
  const rows: Array<Array<string | number | null>> = [];
  rows.push([
    'section',
    'quote',
    'version',
    'job',
    'customer',
    'issue_date',
    'position',
    'kind',
    'description',
    'quantity',
    'unit',
    `unit_price_${q.currency}`,
    `net_${q.currency}`,
    'vat_rate',
    `vat_${q.currency}`,
    `gross_${q.currency}`,
    `cost_${q.currency}`,
    'tax_class',
    'rule_of_thumb_quantity',
  ]);
  for (const l of q.lines) {
    rows.push([
      'line',
      q.number,
      q.version,
      jobReference,
      customerName,
      q.issueDate,
      l.position,
      l.kind,
      l.description,
      l.quantity,
      l.unit,
      m(l.unitPriceMinor),
      m(l.netMinor),
      formatRateBp(l.rateBp),
      m(l.taxMinor),
      m(l.netMinor + l.taxMinor),
      m(l.costMinor),
      l.taxClass,
      l.altQuantity ?? null,
    ]);
  }
  const t = q.totals;
  const total = (label: string, net: number | null, vat: number | null, gross: number | null, rate = '') =>
    rows.push([
      'total',
      q.number,
      q.version,
      jobReference,
      customerName,
      q.issueDate,
      null,
      null,
      label,
      null,
      null,
      null,
      net === null ? null : m(net),
      rate,
      vat === null ? null : m(vat),
      gross === null ? null : m(gross),
      null,
      null,
      null,
    ]);
  for (const b of t.taxByRate) total(`VAT at ${formatRateBp(b.rateBp)}`, b.netMinor, b.taxMinor, b.netMinor + b.taxMinor, formatRateBp(b.rateBp));
  total('Total', t.netMinor, t.taxMinor, t.grossMinor);
  rows.push([]);
  rows.push(['section', 'space', 'layer', 'product', 'area_m2', 'rolls_by_packing', 'rolls_by_rule_of_thumb', 'net_area_m2', 'u_before', 'u_after']);
  for (const s of spaces) {
    for (const l of s.takeoffLayers ?? []) {
      rows.push(['takeoff', s.name, l.role, l.productName, l.areaM2, l.rollsByPacking, l.rollsByArea, s.netAreaM2, s.uBefore, s.uAfter]);
    }
  }
  return `\uFEFF${rows.map((r) => r.map((v, i) => cell(v, typeof v === 'string' && !(i >= 11 && i <= 16 && /^-?\d/.test(v)))).join(',')).join('\r\n')}\r\n`;
}

/**
 * The same as an XLSX workbook (exceljs): "Quote" with numeric money cells in major units and the
 * currency's format, "Takeoff" per space and layer. Numbers are written as numbers, not text.
 */
export async function quoteXlsx({ quote: q, jobReference, customerName, spaces }: QuoteExportInput): Promise<Buffer> {
  // Loaded on the first export, not at start: exceljs is ~8 MB of heap every instance would carry.
  const { default: ExcelJS } = await import('exceljs');
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Quiltline';
  wb.created = new Date(`${q.issueDate}T12:00:00Z`);
  const digits = currencyDigits(q.currency);
  const major = (minor: number) => minor / 10 ** digits;
  const fmt = digits === 0 ? '#,##0' : `#,##0.${'0'.repeat(digits)}`;

  const ws = wb.addWorksheet('Quote');
  ws.addRow([
    `Quote ${q.number}`,
    `version ${q.version}`,
    `job ${jobReference}`,
    customerName,
    `issued ${formatDate(q.issueDate)}`,
    `valid until ${formatDate(q.validUntil)}`,
    q.currency,
  ]);
  ws.addRow([]);
  const header = ws.addRow([
    '#',
    'Kind',
    'Description',
    'Quantity',
    'Unit',
    'Unit price',
    'Net',
    'VAT rate',
    'VAT',
    'Gross',
    'Cost',
    'Tax class',
    'Rule of thumb',
  ]);
  header.font = { bold: true };
  for (const l of q.lines) {
    ws.addRow([
      l.position,
      l.kind,
      l.description,
      l.quantity,
      l.unit,
      major(l.unitPriceMinor),
      major(l.netMinor),
      l.rateBp / 10_000,
      major(l.taxMinor),
      major(l.netMinor + l.taxMinor),
      major(l.costMinor),
      l.taxClass,
      l.altQuantity ?? null,
    ]);
  }
  ws.addRow([]);
  for (const b of q.totals.taxByRate)
    ws.addRow([
      null,
      'vat',
      `VAT at ${formatRateBp(b.rateBp)}`,
      null,
      null,
      null,
      major(b.netMinor),
      b.rateBp / 10_000,
      major(b.taxMinor),
      major(b.netMinor + b.taxMinor),
    ]);
  const totalRow = ws.addRow([
    null,
    'total',
    'Total',
    null,
    null,
    null,
    major(q.totals.netMinor),
    null,
    major(q.totals.taxMinor),
    major(q.totals.grossMinor),
    major(q.totals.costMinor),
  ]);
  totalRow.font = { bold: true };
  ws.addRow([null, 'margin', 'Margin against cost', null, null, null, major(q.totals.marginMinor), q.totals.marginBp / 10_000]);
  for (const c of [6, 7, 9, 10, 11]) ws.getColumn(c).numFmt = fmt;
  ws.getColumn(8).numFmt = '0.0%';
  ws.getColumn(3).width = 60;
  for (const c of [1, 2, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13]) ws.getColumn(c).width = c === 1 ? 5 : 13;

  const tk = wb.addWorksheet('Takeoff');
  const th = tk.addRow(['Space', 'Layer', 'Product', 'Area m²', 'Rolls (roll plan)', 'Rolls (rule of thumb)', 'Net area m²', 'U before', 'U after']);
  th.font = { bold: true };
  for (const s of spaces) {
    for (const l of s.takeoffLayers ?? [])
      tk.addRow([s.name, l.role, l.productName, l.areaM2, l.rollsByPacking, l.rollsByArea, s.netAreaM2, s.uBefore, s.uAfter]);
  }
  tk.getColumn(3).width = 50;
  const buf = await wb.xlsx.writeBuffer();
  return Buffer.from(buf as ArrayBuffer);
}
