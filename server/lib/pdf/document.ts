import PDFDocument from 'pdfkit';
import { withFontFallback } from './font-fallback';
import { FONTS } from './fonts';
import { PALETTE } from '../../../shared/palette';

/** Page margin of every PDF, points (A4 is 595 × 842 pt). */
export const MARGIN = 48;

/**
 * The base of every PDF (quote, invoice, job sheet, handover pack): A4, the same margins, the
 * app's fonts ('ui' Inter, 'ui-bold' Inter SemiBold, 'ui-heavy' Inter Bold, 'mono' JetBrains
 * Mono; characters they lack from the fallbacks in `font-fallback.ts`), graphite ink, and a "page n of m" footer added by `done()`, which resolves to the bytes.
 */
export function newDocument(title: string, opts: { author?: string } = {}) {
  const doc = new PDFDocument({
    size: 'A4',
    margin: MARGIN,
    bufferPages: true,
    info: { Title: title, Producer: 'Quiltline', Creator: 'Quiltline', ...(opts.author ? { Author: opts.author } : {}) },
  });
  doc.registerFont('ui', FONTS.regular);
  doc.registerFont('ui-bold', FONTS.semibold);
  doc.registerFont('ui-heavy', FONTS.bold);
  doc.registerFont('mono', FONTS.mono);
  noContextualAlternates(doc);
  withFontFallback(doc);
  doc.font('ui').fontSize(10).fillColor(PALETTE.graphite);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const finished = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  return {
    doc,
    /** Adds "page n of m" footers, ends the document and returns its bytes. */
    async done(footer: string): Promise<Buffer> {
      const range = doc.bufferedPageRange();
      for (let i = range.start; i < range.start + range.count; i += 1) {
        doc.switchToPage(i);
        const bottom = doc.page.height - 30;
        const oldBottom = doc.page.margins.bottom;
        doc.page.margins.bottom = 0;
        doc
          .font('ui')
          .fontSize(7.5)
          .fillColor(PALETTE.graphiteLight)
          .text(`${footer} · page ${i - range.start + 1} of ${range.count}`, MARGIN, bottom, {
            width: doc.page.width - 2 * MARGIN,
            align: 'center',
            lineBreak: false,
          });
        doc.page.margins.bottom = oldBottom;
      }
      doc.end();
      return finished;
    },
  };
}

/**
 * JetBrains Mono's contextual alternates (the `calt` ligatures for "://", "->", "==") crash
 * fontkit's layout in pdfkit 0.17–0.20 ("Offset is outside the bounds of the DataView"), so every
 * text call runs with `calt` off; Inter looks the same either way.
 */
function noContextualAlternates(doc: PDFKit.PDFDocument) {
  const withFeatures = (args: unknown[]) => {
    const last = args[args.length - 1];
    if (args.length > 1 && last && typeof last === 'object') {
      const o = last as { features?: unknown };
      if (!o.features) o.features = { calt: false };
      return args;
    }
    const padded = [...args];
    while (padded.length > 1 && padded.length < 3) padded.push(undefined);
    return [...padded, { features: { calt: false } }];
  };
  const text = doc.text.bind(doc) as (...a: unknown[]) => PDFKit.PDFDocument;
  const heightOfString = doc.heightOfString.bind(doc) as (...a: unknown[]) => number;
  const widthOfString = doc.widthOfString.bind(doc) as (...a: unknown[]) => number;
  (doc as unknown as { text: unknown }).text = (...a: unknown[]) => text(...withFeatures(a));
  (doc as unknown as { heightOfString: unknown }).heightOfString = (...a: unknown[]) => heightOfString(...withFeatures(a));
  (doc as unknown as { widthOfString: unknown }).widthOfString = (...a: unknown[]) => widthOfString(...withFeatures(a));
}

export interface Letterhead {
  company: { name: string; lines: Array<string | undefined>; logo?: Buffer | null };
  /** The document's name in large type on the right ("Quote", "Invoice", "Credit note"). */
  title: string;
  titleColor?: string;
  /** Number, dates and references under the title, one a line. */
  facts: string[];
}

/**
 * The header of the documents a customer receives: logo and company on the left, the document's
 * title and facts on the right. Leaves `doc.y` below the taller of the two columns.
 */
export function letterhead(doc: PDFKit.PDFDocument, h: Letterhead) {
  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;
  let top = doc.page.margins.top;
  if (h.company.logo) {
    try {
      doc.image(h.company.logo, left, top, { fit: [120, 48] });
      top += 54;
    } catch {
      // A logo pdfkit cannot read is left out rather than failing the document.
    }
  }
  doc
    .font('ui-bold')
    .fontSize(15)
    .fillColor(PALETTE.graphite)
    .text(h.company.name, left, top, { width: width * 0.55 });
  doc.font('ui').fontSize(9).fillColor(PALETTE.graphiteLight);
  for (const l of h.company.lines) if (l) doc.text(l, left, doc.y, { width: width * 0.55 });
  const leftBottom = doc.y;
  const rx = left + width * 0.6;
  doc
    .font('ui-bold')
    .fontSize(20)
    .fillColor(h.titleColor ?? PALETTE.timber)
    .text(h.title, rx, doc.page.margins.top, { width: width * 0.4, align: 'right' });
  doc.font('mono').fontSize(9).fillColor(PALETTE.graphite);
  for (const l of h.facts) doc.text(l, rx, doc.y, { width: width * 0.4, align: 'right' });
  doc.y = Math.max(leftBottom, doc.y) + 14;
  doc.x = left;
  doc.font('ui').fontSize(10).fillColor(PALETTE.graphite);
}

/** Starts a new page when fewer than `needed` points remain above the bottom margin. */
export function ensureSpace(doc: PDFKit.PDFDocument, needed: number) {
  if (doc.y + needed > doc.page.height - doc.page.margins.bottom - 20) doc.addPage();
}

export function heading(doc: PDFKit.PDFDocument, text: string) {
  ensureSpace(doc, 40);
  doc.moveDown(0.6);
  doc.font('ui-bold').fontSize(12).fillColor(PALETTE.graphite).text(text, doc.page.margins.left);
  const y = doc.y + 2;
  doc
    .moveTo(doc.page.margins.left, y)
    .lineTo(doc.page.width - doc.page.margins.right, y)
    .lineWidth(0.6)
    .strokeColor(PALETTE.paperLine)
    .stroke();
  doc.moveDown(0.5);
  doc.font('ui').fontSize(9.5).fillColor(PALETTE.graphite);
}

export function bullets(doc: PDFKit.PDFDocument, items: string[]) {
  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;
  for (const item of items) {
    ensureSpace(doc, 24);
    doc.font('ui').fontSize(9.5).fillColor(PALETTE.graphite).text(`•  ${item}`, left, doc.y, { width, indent: 0 });
    doc.moveDown(0.25);
  }
}

export interface Column {
  header: string;
  width: number;
  align?: 'left' | 'right' | 'center';
  mono?: boolean;
}

/** A simple table that breaks across pages and repeats its header. */
export function table(doc: PDFKit.PDFDocument, columns: Column[], rows: string[][], opts: { boldLastRows?: number; keepLastRowWithPt?: number } = {}) {
  const left = doc.page.margins.left;
  const drawHeader = () => {
    let x = left;
    doc.font('ui-bold').fontSize(8.5).fillColor(PALETTE.graphiteLight);
    const y = doc.y;
    for (const c of columns) {
      doc.text(c.header, x + 2, y, { width: c.width - 4, align: c.align ?? 'left', lineBreak: false });
      x += c.width;
    }
    doc.y = y + 14;
    doc
      .moveTo(left, doc.y - 2)
      .lineTo(left + columns.reduce((a, c) => a + c.width, 0), doc.y - 2)
      .lineWidth(0.6)
      .strokeColor(PALETTE.graphiteLight)
      .stroke();
  };
  ensureSpace(doc, 40);
  drawHeader();
  rows.forEach((row, ri) => {
    const bold = opts.boldLastRows !== undefined && ri >= rows.length - opts.boldLastRows;
    const heights = row.map((cell, i) => {
      doc.font(columns[i].mono ? 'mono' : bold ? 'ui-bold' : 'ui').fontSize(9);
      return doc.heightOfString(cell, { width: columns[i].width - 4 });
    });
    const h = Math.max(...heights, 10) + 5;
    // The last row takes what must follow it (a totals block) onto the next page with it.
    const after = ri === rows.length - 1 ? (opts.keepLastRowWithPt ?? 0) : 0;
    if (doc.y + h + after > doc.page.height - doc.page.margins.bottom - 20) {
      doc.addPage();
      drawHeader();
    }
    const y = doc.y;
    let x = left;
    row.forEach((cell, i) => {
      const c = columns[i];
      doc
        .font(c.mono ? 'mono' : bold ? 'ui-bold' : 'ui')
        .fontSize(9)
        .fillColor(PALETTE.graphite)
        .text(cell, x + 2, y + 2, { width: c.width - 4, align: c.align ?? 'left' });
      x += c.width;
    });
    doc.y = y + h;
    doc.moveTo(left, doc.y).lineTo(x, doc.y).lineWidth(0.3).strokeColor(PALETTE.paperLine).stroke();
  });
  doc.x = left;
}
