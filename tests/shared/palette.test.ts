// One palette: the Tailwind theme, the editor's canvas and the PDFs read the same tokens
// (shared/palette.ts), so a colour cannot drift between the screen and the printed page.
import { describe, expect, it } from 'vitest';
import { PALETTE, PALETTE_TOKENS } from '../../shared/palette';
import { PALETTE as CANVAS } from '../../src/editor/canvas/palette';
import tailwind from '../../tailwind.config';

describe('palette tokens', () => {
  it('is what the Tailwind theme uses', () => {
    expect(tailwind.theme.extend.colors).toBe(PALETTE_TOKENS);
  });

  it('flattens every token to a camelCase name with the same hex', () => {
    expect(PALETTE.paperLine).toBe(PALETTE_TOKENS.paper.line);
    expect(PALETTE.paperLineStrong).toBe(PALETTE_TOKENS.paper['line-strong']);
    expect(PALETTE.graphiteLight).toBe(PALETTE_TOKENS.graphite.light);
    expect(PALETTE.teal).toBe(PALETTE_TOKENS.teal.DEFAULT);
    const count = Object.values(PALETTE_TOKENS).reduce((n, shades) => n + Object.keys(shades).length, 0);
    expect(Object.keys(PALETTE)).toHaveLength(count);
    for (const hex of Object.values(PALETTE)) expect(hex).toMatch(/^#[0-9a-f]{6}$/);
  });

  it('is the one the plan editor draws with', () => {
    expect(CANVAS).toBe(PALETTE);
  });
});
