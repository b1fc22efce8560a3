// The estimate-against-actual report as the office sees it on the demo data, at 1280 px and 390 px;
// screenshots in test-output/screenshots/report-*.png. Checks that recharts stays out of the entry chunk.
import fs from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { REPO_ROOT } from '../../server/config';
import { Job, JobActual, User } from '../../server/db/models';
import { DEMO_PASSWORD } from '../../server/db/seeders/demo';
import { screenshot, signInThroughUi, startDemoBrowserSuite } from '../helpers/browser';

let suite: Awaited<ReturnType<typeof startDemoBrowserSuite>>;
let app: typeof suite.app;
let browser: typeof suite.browser;

beforeAll(async () => {
  suite = await startDemoBrowserSuite({ width: 1280, height: 900 });
  ({ app, browser } = suite);
  // Signed in once as the office: the session stays in the browser's profile for every test here.
  const page = await browser.newPage();
  await signInThroughUi(page, app.url, 'office@demo.example.com', DEMO_PASSWORD);
  await page.close();
}, 120_000);

afterAll(async () => {
  await suite?.close();
});

describe('estimate against actual report', () => {
  it('shows the demo jobs with charts, tables and suggestions at desktop and phone width', { timeout: 120_000 }, async () => {
    const page = await browser.newPage();
    page.setDefaultTimeout(20_000);
    await page.goto(app.url);
    await page.getByRole('link', { name: 'Report' }).first().click();
    await page.getByRole('heading', { name: 'Estimate against actual' }).waitFor();
    await page.getByRole('button', { name: 'All' }).click();
    await page.getByText('Waste incurred against the allowance').waitFor();
    await page.locator('.recharts-bar-rectangle').first().waitFor();
    await page.getByText(/Waste allowance: 10% →/).waitFor();
    expect(await page.getByText('Jobs furthest off').count()).toBe(1);
    await screenshot(page, 'report-1280');
    expect(await page.getByRole('list', { name: 'Jobs furthest off' }).isVisible()).toBe(false);
    // A phone opens the page at its own width (a resized desktop page is not what a phone sees).
    await page.setViewportSize({ width: 390, height: 844 });
    await page.reload();
    await page.getByRole('button', { name: 'All' }).click();
    await page.locator('.recharts-bar-rectangle').first().waitFor();
    await screenshot(page, 'report-390');
    // On the phone each job is a block of labelled figures, so the cost is on screen, not scrolled off.
    const furthest = page.getByRole('list', { name: 'Jobs furthest off' });
    expect(await furthest.isVisible()).toBe(true);
    expect(await furthest.locator('li').first().innerText()).toMatch(/Cost over the estimate\s+[+-]?£/);
    expect(await page.getByRole('region', { name: 'Table' }).filter({ hasText: 'Margin made' }).isVisible()).toBe(false);
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

  it('lets the office correct what was used on a job card, saying who did, and the report shows the new count', { timeout: 120_000 }, async () => {
    const page = await browser.newPage();
    page.setDefaultTimeout(20_000);
    // The demo company's job: other files' companies may share this database.
    const office = (await User.findOne({ where: { email: 'office@demo.example.com' } }))!;
    const job = (await Job.findOne({ where: { organisationId: office.organisationId, stage: 'installed' }, order: [['reference', 'ASC']] }))!;
    const stored = (await JobActual.findByPk(job.id))!;
    const first = stored.rolls[0];
    await page.goto(`${app.url}/jobs/${job.id}`);
    const card = page.getByTestId('job-actuals-card');
    await card.getByText('What was used, as recorded').click();
    await card.getByRole('button', { name: 'Correct what was used' }).click();
    const used = card.getByLabel(/: rolls used$/).first();
    expect(await used.inputValue()).toBe(String(first.used));
    await used.fill(String(first.used + 3));
    await card.getByRole('button', { name: 'Save correction' }).click();
    await card.getByText(/Corrected by Olivia Marsh/).waitFor();
    await screenshot(page, 'job-actuals-corrected-1280');
    await expect.poll(async () => (await JobActual.findByPk(job.id))!.rolls[0].used).toBe(first.used + 3);
    expect((await JobActual.findByPk(job.id))!.version).toBe(stored.version + 1);

    // The correction form on a phone: nothing wider than the screen.
    await page.setViewportSize({ width: 390, height: 844 });
    await page.reload();
    await card.getByText('What was used, as recorded').click();
    await card.getByRole('button', { name: 'Correct what was used' }).click();
    await card.getByRole('button', { name: 'Save correction' }).waitFor();
    await card.scrollIntoViewIfNeeded();
    await screenshot(page, 'job-actuals-correct-390');
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    expect(await card.getByRole('list', { name: 'Rolls per product' }).innerText()).toContain(`used ${first.used + 3}`);
    await card.getByRole('button', { name: 'Cancel' }).click();
    await page.setViewportSize({ width: 1280, height: 900 });

    const report = await page.evaluate(async () => (await fetch('/api/reports/estimate-vs-actual?from=2000-01-01&to=2100-01-01')).json());
    const row = report.rows.find((r: { jobId: string }) => r.jobId === job.id);
    expect(row.usedRolls).toBe(stored.rolls.reduce((a, r) => a + r.used, 0) + 3);
    await page.close();
  });

  it('lets the office choose what installers must record, kept when the settings are saved for something else', { timeout: 120_000 }, async () => {
    const page = await browser.newPage();
    page.setDefaultTimeout(20_000);
    const openPricing = async () => {
      await page.goto(`${app.url}/settings`);
      await page.getByRole('tab', { name: 'Labour, waste, eaves, savings' }).click();
    };
    const hours = () => page.getByRole('checkbox', { name: 'Hours on site, per installer' });
    await openPricing();
    expect(await hours().isChecked()).toBe(false);
    await hours().check();
    await page.getByRole('checkbox', { name: 'Rolls used and brought back' }).check();
    await page.getByRole('button', { name: 'Save settings' }).click();
    await page.getByText('Settings saved.').waitFor();
    await screenshot(page, 'settings-actuals-required-1280');
    // A change on the other tab sends the choice back as stored.
    await page.reload();
    await page.getByLabel('Phone').fill('01632 960777');
    await page.getByRole('button', { name: 'Save settings' }).click();
    await page.getByText('Settings saved.').waitFor();
    await openPricing();
    expect(await hours().isChecked()).toBe(true);
    const settings = await page.evaluate(async () => (await (await fetch('/api/settings')).json()).settings);
    expect(settings).toMatchObject({ phone: '01632 960777', actualsRequired: ['rolls', 'hours'] });
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
