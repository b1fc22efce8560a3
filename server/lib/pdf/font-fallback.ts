import fs from 'node:fs';
import { BOLD_FONTS, FALLBACK_FONTS } from './fonts';
import { splitRuns, type GlyphCoverage, type TextRun } from './font-runs';

type Args = unknown[];
interface OpenFont {
  font?: GlyphCoverage;
}
interface DocInternals {
  _font: OpenFont | null;
}

/** Each fallback file is read once per process; pdfkit parses it per document that draws from it. */
const fileCache = new Map<string, Buffer>();
const fileOf = (path: string) => {
  let buf = fileCache.get(path);
  if (!buf) {
    buf = fs.readFileSync(path);
    fileCache.set(path, buf);
  }
  return buf;
};

/** Drawn for a character no font of the app has: a white square, as browsers show it. */
const REPLACEMENT = '\u25a1';

/**
 * Font fallback per run of text: every `text`, `widthOfString` and `heightOfString` call is split
 * into runs by the first font that has each character (the one set with `font()`, then Noto Sans
 * SC, Noto Sans KR, Noto Emoji), and each run is drawn in its font as one continued line. Names such
 * as "陳美玲 🏠" are printed instead of dropped. A fallback is registered from a cached buffer and
 * opened only when a run needs it; pdfkit embeds only the glyphs drawn.
 */
export function withFontFallback(doc: PDFKit.PDFDocument) {
  const d = doc as unknown as Record<string, (...a: Args) => unknown> & DocInternals;
  const font = d.font.bind(doc);
  const text = d.text.bind(doc);
  const widthOfString = d.widthOfString.bind(doc) as (...a: Args) => number;
  const heightOfString = d.heightOfString.bind(doc) as (...a: Args) => number;
  let current = 'ui';
  d.font = (...a: Args) => {
    if (typeof a[0] === 'string') current = a[0];
    return font(...a);
  };
  const registered = new Set<string>();
  const nameOf = (face: number, base: string) => {
    if (face === 0) return base;
    const f = FALLBACK_FONTS[face - 1];
    const bold = BOLD_FONTS.has(base);
    const name = `${f.name}${bold ? '-bold' : ''}`;
    if (!registered.has(name)) {
      doc.registerFont(name, fileOf(bold ? f.bold : f.regular));
      registered.add(name);
    }
    return name;
  };
  const coverage = new Map<string, GlyphCoverage | null>();
  const runsOf = (s: string): TextRun[] => {
    const base = current;
    const faceOf = (face: number) => {
      const name = nameOf(face, base);
      if (!coverage.has(name)) {
        font(name);
        coverage.set(name, d._font?.font ?? null);
        font(base);
      }
      return coverage.get(name) ?? null;
    };
    return splitRuns(s, faceOf, FALLBACK_FONTS.length + 1, REPLACEMENT);
  };
  // While a run is drawn, pdfkit's line wrapper measures its words with widthOfString in the run's
  // font: those calls must not split again (that would switch back to the asked-for font).
  let drawing = false;
  const mixed = (s: unknown): TextRun[] | null => {
    if (drawing || typeof s !== 'string') return null;
    const runs = runsOf(s);
    return runs.length === 1 && runs[0].face === 0 && runs[0].text === s ? null : runs;
  };

  d.text = (...a: Args) => {
    const runs = mixed(a[0]);
    if (!runs) return text(...a);
    const base = current;
    const rest = a.slice(1);
    const optsAt = rest.findIndex((v) => v !== null && typeof v === 'object');
    const opts = (optsAt >= 0 ? rest[optsAt] : {}) as { continued?: boolean; features?: unknown };
    const position = optsAt >= 0 ? rest.slice(0, optsAt) : rest;
    drawing = true;
    try {
      runs.forEach((run, i) => {
        font(nameOf(run.face, base));
        const last = i === runs.length - 1;
        const continued = last ? opts.continued : true;
        // Later runs carry on where the previous one ended (pdfkit keeps the first run's options).
        if (i === 0) text(run.text, ...position, { ...opts, continued });
        else text(run.text, { continued, features: opts.features });
      });
    } finally {
      drawing = false;
      font(base);
    }
    return doc;
  };
  d.widthOfString = (...a: Args) => {
    const runs = mixed(a[0]);
    if (!runs) return widthOfString(...a);
    const base = current;
    const width = runs.reduce((sum, run) => {
      font(nameOf(run.face, base));
      return sum + widthOfString(run.text, ...a.slice(1));
    }, 0);
    font(base);
    return width;
  };
  // Wrapping is measured in the asked-for font with each fallback character as a wide Latin stand-in
  // ("M" is about as wide as a CJK ideograph or an emoji), so a cell grows as the drawn text does.
  d.heightOfString = (...a: Args) => {
    const runs = mixed(a[0]);
    if (!runs) return heightOfString(...a);
    const standIn = runs.map((r) => (r.face === 0 ? r.text : [...r.text].map((c) => (/\s/.test(c) ? c : 'M')).join(''))).join('');
    return heightOfString(standIn, ...a.slice(1));
  };
}
