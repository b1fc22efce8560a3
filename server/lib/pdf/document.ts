import PDFDocument from 'pdfkit';
import { FONTS, INK } from './fonts';

/** A new A4 document with the app's fonts registered; `done()` resolves to the finished bytes. */
export function newDocument(title: string) {
  const doc = new PDFDocument({ size: 'A4', margin: 48, bufferPages: true, info: { Title: title, Producer: 'Quiltline', Creator: 'Quiltline' } });
  doc.registerFont('ui', FONTS.regular);
  doc.registerFont('ui-bold', FONTS.semibold);
  doc.registerFont('mono', FONTS.mono);
  noContextualAlternates(doc);
  doc.font('ui').fontSize(10).fillColor(INK.graphite);
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
          .fillColor(INK.graphiteLight)
          .text(`${footer} · page ${i - range.start + 1} of ${range.count}`, 48, bottom, { width: doc.page.width - 96, align: 'center', lineBreak: false });
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

/** Starts a new page when fewer than `needed` points remain above the bottom margin. */
export function ensureSpace(doc: PDFKit.PDFDocument, needed: number) {
  if (doc.y + needed > doc.page.height - doc.page.margins.bottom - 20) doc.addPage();
}

export function heading(doc: PDFKit.PDFDocument, text: string) {
  ensureSpace(doc, 40);
  doc.moveDown(0.6);
  doc.font('ui-bold').fontSize(12).fillColor(INK.graphite).text(text, doc.page.margins.left);
  const y = doc.y + 2;
  doc
    .moveTo(doc.page.margins.left, y)
    .lineTo(doc.page.width - doc.page.margins.right, y)
    .lineWidth(0.6)
    .strokeColor(INK.paperLine)
    .stroke();
  doc.moveDown(0.5);
  doc.font('ui').fontSize(9.5).fillColor(INK.graphite);
}

export function bullets(doc: PDFKit.PDFDocument, items: string[]) {
  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;
  for (const item of items) {
    ensureSpace(doc, 24);
    doc.font('ui').fontSize(9.5).fillColor(INK.graphite).text(`•  ${item}`, left, doc.y, { width, indent: 0 });
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
export function table(doc: PDFKit.PDFDocument, columns: Column[], rows: string[][], opts: { boldLastRows?: number } = {}) {
  const left = doc.page.margins.left;
  const drawHeader = () => {
    let x = left;
    doc.font('ui-bold').fontSize(8.5).fillColor(INK.graphiteLight);
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
      .strokeColor(INK.graphiteLight)
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
    if (doc.y + h > doc.page.height - doc.page.margins.bottom - 20) {
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
        .fillColor(INK.graphite)
        .text(cell, x + 2, y + 2, { width: c.width - 4, align: c.align ?? 'left' });
      x += c.width;
    });
    doc.y = y + h;
    doc.moveTo(left, doc.y).lineTo(x, doc.y).lineWidth(0.3).strokeColor(INK.paperLine).stroke();
  });
  doc.x = left;
}
