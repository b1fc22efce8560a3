import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const root = join(__dirname, '../..');
const tsx = join(root, 'node_modules/.bin/tsx');

function run(...args: string[]) {
  const r = spawnSync(tsx, ['scripts/takeoff-cli.ts', ...args], { cwd: root, encoding: 'utf8', timeout: 60_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

describe('takeoff CLI', () => {
  it('prints a readable summary of an example', () => {
    const r = run('examples/tank-hatch-downlights.json');
    expect(r.code).toBe(0);
    expect(r.stderr).toBe('');
    for (const word of ['Areas', 'Layer', 'strips', 'rolls', 'U-value', 'Saving', 'Site checks', '[downlight.covers]']) expect(r.stdout).toContain(word);
  });

  it('prints the quiltline-takeoff/4 JSON contract', () => {
    const r = run('examples/l-shape.json', '--format', 'json');
    expect(r.code).toBe(0);
    const t = JSON.parse(r.stdout);
    expect(t.format).toBe('quiltline-takeoff/4');
    expect(t.layers[0]).toEqual(expect.objectContaining({ role: 'base', rollsByPacking: expect.any(Number), rollsByArea: expect.any(Number) }));
  });

  it('takes another product file', () => {
    const dir = mkdtempSync(join(tmpdir(), 'ql-cli-'));
    const file = join(dir, 'products.json');
    writeFileSync(
      file,
      JSON.stringify([
        {
          id: 'only',
          name: 'Only roll',
          thicknessMm: 200,
          rollWidthMm: 1200,
          lanesPerRoll: 1,
          rollLengthMm: 4000,
          coverageM2PerRoll: 4.8,
          lambda: 0.04,
          priceMinor: 3000,
        },
      ]),
    );
    const r = run('examples/rectangle.json', '--products', file, '--format', 'json');
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout).layers.map((l: { productId: string }) => l.productId)).toEqual(['only']);
  });

  it.each([
    ['a missing file', ['examples/nope.json'], /^takeoff: cannot read plan file examples\/nope\.json: no such file\n$/],
    [
      'the deliberately invalid example',
      ['examples/invalid-crossed-outline.json'],
      /^takeoff: examples\/invalid-crossed-outline\.json is not a valid plan: .*edge 4 has no length.*\(and 3 more problems\)\n$/,
    ],
    ['a file that is not a plan', ['package.json'], /^takeoff: package\.json is not a valid plan: the file has no "format"/],
    [
      'a bad product file',
      ['examples/rectangle.json', '--products', 'examples/rectangle.json'],
      /^takeoff: product file examples\/rectangle\.json is not a product catalogue/,
    ],
    ['an unknown format option', ['examples/rectangle.json', '--format', 'xml'], /^takeoff: --format must be text or json, not "xml"\n$/],
    ['no plan at all', [], /^takeoff: usage: /],
  ])('exits 2 with one clear line for %s', (_n, args, pattern) => {
    const r = run(...args);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(pattern);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
  });

  it('exits 2 for a file that is not JSON', () => {
    const dir = mkdtempSync(join(tmpdir(), 'ql-cli-'));
    const file = join(dir, 'broken.json');
    writeFileSync(file, '{ "format": ');
    const r = run(file);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/is not valid JSON/);
    expect(r.stderr).not.toMatch(/at .*\.ts:\d+/);
  });
});
