// The estimate-against-actual report as the office sees it on the demo data, at 1280 px and 390 px;
// screenshots in test-output/screenshots/report-*.png. Checks that recharts stays out of the entry chunk.
import fs from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { REPO_ROOT } from '../../server/config';
import { DEMO_PASSWORD, seedDemo } from '../../server/db/seeders/demo';
import { launchBrowser, screenshot, signInThroughUi, startAppServer } from '../helpers/browser';

let app: Awaited<ReturnType<typeof startAppServer>>;
let browser: Awaited<ReturnType<typeof launchBrowser>>;

beforeAll(async () => {
  app = await startAppServer();
  await seedDemo(app.ctx.deps);
  browser = await launchBrowser({ viewport: { width: 1280, height: 900 } });
}, 120_000);

afterAll(async () => {
  await browser?.close();
  await app?.close();
});

describe('estimate against actual report', () => {
  it('shows the demo jobs with charts, tables and suggestions at desktop and phone width', { timeout: 120_000 }, async () => {
    const page = await browser.newPage();
    page.setDefaultTimeout(20_000);
    await signInThroughUi(page, app.url, 'office@demo.example.com', DEMO_PASSWORD);
    await page.getByRole('link', { name: 'Report' }).first().click();
    await page.getByRole('heading', { name: 'Estimate against actual' }).waitFor();
    await page.getByRole('button', { name: 'All' }).click();
    await page.getByText('Waste incurred against the allowance').waitFor();
    await page.locator('.recharts-bar-rectangle').first().waitFor();
    await page.getByText(/Waste allowance: 10% →/).waitFor();
    expect(await page.getByText('Jobs furthest off').count()).toBe(1);
    await screenshot(page, 'report-1280');
    // A phone opens the page at its own width (a resized desktop page is not what a phone sees).
    await page.setViewportSize({ width: 390, height: 844 });
    await page.reload();
    await page.getByRole('button', { name: 'All' }).click();
    await page.locator('.recharts-bar-rectangle').first().waitFor();
    await screenshot(page, 'report-390');
    // Nothing wider than the phone: the page itself must not scroll sideways.
    const wide = await page.evaluate(() =>
      [...document.querySelectorAll('main *')]
        .filter((e) => e.getBoundingClientRect().right > 391 && !e.closest('.overflow-x-auto'))
        .slice(0, 3)
        .map((e) => `${e.tagName}.${e.className}`),
    );
    expect(wide).toEqual([]);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await page.close();
  });

  it('keeps recharts out of the entry chunk and in the report chunk only', () => {
    const html = fs.readFileSync(path.join(REPO_ROOT, 'dist', 'index.html'), 'utf8');
    const entry = html.match(/<script type="module"[^>]*src="\/([^"]+)"/)![1];
    const assets = fs.readdirSync(path.join(REPO_ROOT, 'dist', 'assets'));
    const charts = assets.find((f) => /^report-charts-.*\.js$/.test(f));
    expect(charts).toBeTruthy();
    const entryCode = fs.readFileSync(path.join(REPO_ROOT, 'dist', entry));
    expect(entryCode.toString('utf8')).not.toMatch(/recharts/);
    const chartsGzip = gzipSync(fs.readFileSync(path.join(REPO_ROOT, 'dist', 'assets', charts!))).length;
    console.log(`[client] entry ${(gzipSync(entryCode).length / 1000).toFixed(1)} kB gzip; report charts chunk ${(chartsGzip / 1000).toFixed(1)} kB gzip`);
    expect(gzipSync(entryCode).length).toBeLessThan(150_000);
  });
});
