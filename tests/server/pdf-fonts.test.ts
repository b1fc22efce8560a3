// Names customers type in any script reach the PDF: characters Inter lacks are drawn from Noto
// Sans SC / KR and Noto Emoji per run of text, and the big fallback fonts are embedded (as subsets)
// only in a document that needs them.
import fs from 'node:fs';
import path from 'node:path';
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { splitRuns } from '../../server/lib/pdf/font-runs';
import { createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';
import { binary, quoteCompany, quoteJob } from './quotes-fixtures';

let ctx: TestContext;
let org: TestOrg;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await quoteCompany();
});
afterAll(async () => {
  await ctx?.close();
});

async function quotePdf(customerName: string) {
  const { job } = await quoteJob(org, { customerName });
  const office = await loginAs(ctx.app, org.office);
  const q = (await office.post(`/api/jobs/${job.id}/quotes`).send({})).body.quote;
  const res = await office.get(`/api/quotes/${q.id}/pdf`).buffer(true).parse(binary);
  expect(res.status).toBe(200);
  const body = res.body as Buffer;
  const text = (await new PDFParse({ data: new Uint8Array(body) }).getText()).text;
  return { body, text };
}

describe('PDF fonts', () => {
  it('prints a CJK name with an emoji, Hangul and an unknown character visibly, and embeds the fallbacks only then', async () => {
    const latin = await quotePdf('Winifred Ashdown');
    const cjk = await quotePdf('陳美玲 🏠 김서연 א');
    fs.mkdirSync(path.join(process.cwd(), 'test-output', 'pdf'), { recursive: true });
    fs.writeFileSync(path.join(process.cwd(), 'test-output', 'pdf', 'quote-cjk.pdf'), cjk.body);
    const flat = cjk.text.replace(/\s+/g, ' ');
    expect(flat).toContain('陳美玲');
    expect(flat).toContain('🏠');
    expect(flat).toContain('김서연');
    // Hebrew, which no font of the app has, is a visible white square, not nothing.
    expect(flat).toContain('김서연 □');
    const fontNames = (b: Buffer) => [...b.toString('latin1').matchAll(/\/BaseFont \/[A-Z]{6}\+([\w-]+)/g)].map((m) => m[1]);
    expect(fontNames(latin.body).some((n) => /Noto/.test(n))).toBe(false);
    expect(fontNames(cjk.body)).toEqual(expect.arrayContaining(['NotoSansSC-Regular', 'NotoSansKR-Regular', 'NotoEmoji-Regular']));
    // Subset: three fallback fonts of 0.9–10 MB each add only the glyphs drawn.
    expect(cjk.body.length - latin.body.length).toBeLessThan(200_000);
  });
});

describe('splitRuns', () => {
  const has = (set: string) => ({ hasGlyphForCodePoint: (cp: number) => set.includes(String.fromCodePoint(cp)) });
  const faces = [has('ab '), has('陳美'), has('👩🔧')];
  const split = (s: string) => splitRuns(s, (i) => faces[i] ?? null, faces.length, '?');

  it('picks the first font that has each character and keeps joiners and selectors with the emoji', () => {
    expect(split('ab 陳美 👩\u200d🔧\ufe0f')).toEqual([
      { face: 0, text: 'ab ' },
      { face: 1, text: '陳美' },
      { face: 0, text: ' ' },
      { face: 2, text: '👩\u200d🔧\ufe0f' },
    ]);
  });

  it('draws a replacement in the first font for a character no font has', () => {
    expect(split('a\u{10ffff}b')).toEqual([{ face: 0, text: 'a?b' }]);
  });

  it('keeps plain Latin text in one run without looking at glyphs', () => {
    expect(splitRuns('Café: "quotes" – £5 · 2×', () => null, 3, '?')).toEqual([{ face: 0, text: 'Café: "quotes" – £5 · 2×' }]);
  });
});
