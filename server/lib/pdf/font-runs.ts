/** A piece of text drawn in one font: 0 is the font asked for, 1… the fallbacks in their order. */
export interface TextRun {
  face: number;
  text: string;
}

/** What a run splitter needs of a font: whether it has a glyph for a code point. */
export interface GlyphCoverage {
  hasGlyphForCodePoint(codePoint: number): boolean;
}

/**
 * Code points that only modify the one before them (zero-width joiner, variation selectors, emoji
 * skin tones, tags, the keycap, combining marks): they stay in the previous character's run, so an
 * emoji sequence or an accented letter is shaped by one font.
 */
function joinsPrevious(cp: number, ch: string): boolean {
  return (
    cp === 0x200d ||
    (cp >= 0xfe00 && cp <= 0xfe0f) ||
    cp === 0x20e3 ||
    (cp >= 0x1f3fb && cp <= 0x1f3ff) ||
    (cp >= 0xe0020 && cp <= 0xe007f) ||
    /\p{M}/u.test(ch)
  );
}

/** Text every Latin font of the app draws, checked before looking at glyphs one by one. */
const PLAIN = /^[\x20-\x7e\n\r\t\u00a0-\u00ff\u2013\u2014\u2018\u2019\u201c\u201d\u2022\u2026\u00b2\u00b3\u20ac\u00b7]*$/;

/**
 * Splits `text` into runs by the first font (the asked-for font, then each fallback) that has a
 * glyph for each character. A character no font has becomes `replacement` in the asked-for font,
 * so nothing a customer typed vanishes without a trace.
 */
export function splitRuns(text: string, faces: (face: number) => GlyphCoverage | null, faceCount: number, replacement: string): TextRun[] {
  if (PLAIN.test(text)) return [{ face: 0, text }];
  const runs: TextRun[] = [];
  const push = (face: number, s: string) => {
    const last = runs[runs.length - 1];
    if (last && last.face === face) last.text += s;
    else runs.push({ face, text: s });
  };
  for (const ch of text) {
    const cp = ch.codePointAt(0) ?? 0;
    if (runs.length > 0 && joinsPrevious(cp, ch)) {
      runs[runs.length - 1].text += ch;
      continue;
    }
    if (cp < 0x20 || PLAIN.test(ch)) {
      push(0, ch);
      continue;
    }
    let chosen = -1;
    for (let face = 0; face < faceCount && chosen < 0; face += 1) {
      if (faces(face)?.hasGlyphForCodePoint(cp)) chosen = face;
    }
    if (chosen < 0) push(0, replacement);
    else push(chosen, ch);
  }
  return runs;
}
