// Builds and sends a quote from a job of the demo company in a real browser, then accepts it as
// the customer through the e-mailed private link. Screenshots go to test-output/screenshots/.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Customer, Job, Organisation } from '../../server/db/models';
import { DEMO_COMPANY, DEMO_PASSWORD, seedDemo } from '../../server/db/seeders/demo';
import { seedQuotesDemo } from '../../server/db/seeders/quotes-demo';
import { launchBrowser, screenshot, signInThroughUi, startAppServer } from '../helpers/browser';
import { createJob } from '../helpers/test-app';
import { examplePlan } from '../server/quotes-fixtures';

let app: Awaited<ReturnType<typeof startAppServer>>;
let office: Awaited<ReturnType<typeof launchBrowser>>;
let customer: Awaited<ReturnType<typeof launchBrowser>>;
let jobId = '';

beforeAll(async () => {
  app = await startAppServer();
  await seedDemo(app.ctx.deps);
  await seedQuotesDemo();
  const org = (await Organisation.findOne({ where: { name: DEMO_COMPANY } }))!;
  // A fresh job in the demo company, with one of the example plans (tank, hatch, downlights), so
  // accepting it leaves the seeded demo jobs as they are for other tests.
  const made = await createJob({ id: org.id }, { stage: 'surveyed', plan: examplePlan(), customerName: 'Esme Caldwell', spaceName: 'Main loft' });
  await Customer.update({ email: 'esme.caldwell@example.com' }, { where: { id: made.customer.id } });
  jobId = made.job.id;
  office = await launchBrowser({ viewport: { width: 1366, height: 900 } });
  customer = await launchBrowser({ viewport: { width: 390, height: 844 } });
}, 120_000);

afterAll(async () => {
  await office?.close();
  await customer?.close();
  await app?.close();
});

async function moneyText(page: Page, testId: string) {
  return (await page.getByTestId(testId).first().innerText()).trim();
}

describe('quotes in a real browser', () => {
  it('builds a quote from the takeoff, edits a price, sends it, and the customer accepts it once', async () => {
    const page = await office.newPage();
    await signInThroughUi(page, app.url, 'office@demo.example.com', DEMO_PASSWORD);
    await page.goto(`${app.url}/jobs/${jobId}`);
    await page.getByRole('button', { name: 'Build a quote from the takeoff' }).click();
    await page.waitForURL(/\/jobs\/[^/]+\/quotes\/[0-9a-f-]{36}$/, { timeout: 20_000 });
    await page.getByTestId('quote-line').first().waitFor();
    const lineCount = await page.getByTestId('quote-line').count();
    expect(lineCount).toBeGreaterThan(4);
    await screenshot(page, 'quotes-01-built-from-takeoff');

    // Change the first line's unit price to £30.00 and check the total moves by the exact difference.
    const before = await moneyText(page, 'total-net');
    const price = page.getByLabel('Line 1 unit price');
    const qty = Number(await page.getByLabel('Line 1 quantity').inputValue());
    const oldPrice = Number(await price.inputValue());
    await price.fill('30.00');
    const after = await moneyText(page, 'total-net');
    const toPence = (s: string) => Math.round(Number(s.replace(/[^0-9.-]/g, '')) * 100);
    expect(toPence(after) - toPence(before)).toBe(Math.round(qty * (3000 - Math.round(oldPrice * 100))));
    await page.getByRole('button', { name: 'Save changes' }).click();
    await page.getByText('Saved.').waitFor();

    await page.getByRole('button', { name: 'Send to the customer' }).click();
    await page.getByText(/Sent to the customer/).waitFor({ timeout: 20_000 });
    await expect.poll(() => page.getByTestId('quote-status').innerText()).toMatch(/sent/i);
    const grossOffice = await moneyText(page, 'total-gross');
    await screenshot(page, 'quotes-02-sent');

    const mail = await app.ctx.outbox.waitFor((m) => m.to.includes('esme.caldwell@example.com'));
    const link = mail.links.find((l) => new URL(l).pathname.startsWith('/q/'))!;
    expect(link.startsWith(app.url)).toBe(true);

    // The customer opens the link on a phone, with no account.
    const cpage = await customer.newPage();
    await cpage.goto(link);
    await cpage.getByRole('heading', { name: 'Hearthfold Insulation Ltd' }).waitFor();
    expect(await moneyText(cpage, 'public-total')).toBe(grossOffice);
    await screenshot(cpage, 'quotes-03-customer-view');
    await cpage.getByRole('button', { name: /Accept the quote/ }).click();
    await cpage.getByText('Type your full name to accept.').waitFor();
    await cpage.getByLabel(/Your full name/).fill('Esme Caldwell');
    await cpage.getByLabel(/I have read the quote/).check();
    await cpage.getByRole('button', { name: /Accept the quote/ }).click();
    await cpage.getByText(/Thank you: Esme Caldwell accepted this quote/).waitFor();
    await screenshot(cpage, 'quotes-04-accepted');
    expect((await Job.findByPk(jobId))!.stage).toBe('accepted');
    await app.ctx.outbox.waitFor((m) => /accepted by Esme Caldwell/.test(m.subject));

    // The same link again shows it was accepted, and offers nothing to press.
    const again = await customer.newPage();
    await again.goto(link);
    await again.getByText(/Thank you: Esme Caldwell accepted this quote/).waitFor();
    expect(await again.getByRole('button', { name: /Accept the quote/ }).count()).toBe(0);

    // A tampered link gets a clear page.
    const bad = await customer.newPage();
    await bad.goto(`${link.slice(0, -3)}xyz`);
    await bad.getByTestId('link-problem').waitFor();
    expect(await bad.getByRole('heading').first().innerText()).toMatch(/does not work/);
    await screenshot(bad, 'quotes-05-tampered-link');

    // The office sees the accepted quote.
    await page.reload();
    await expect.poll(() => page.getByTestId('quote-status').innerText()).toMatch(/accepted/i);
    await page.goto(`${app.url}/jobs/${jobId}`);
    await page.getByRole('heading', { name: 'Quotes' }).waitFor();
    await expect.poll(() => page.getByTestId('quote-status').first().innerText()).toMatch(/accepted/i);
    await page
      .getByText(/accepted by Esme Caldwell through the private link/)
      .first()
      .waitFor();
    await screenshot(page, 'quotes-08-job-page');
  }, 120_000);

  it('shows the catalogue in a sortable, filterable table in settings', async () => {
    const page = await office.newPage();
    await page.goto(`${app.url}/settings`);
    await page.getByRole('tab', { name: 'Products' }).click();
    const table = page.getByRole('table', { name: 'Roll products' });
    await table.waitFor();
    const names = async () => (await table.locator('tbody tr td:first-child').allInnerTexts()).map((t) => t.trim());
    const initial = await names();
    expect(initial.length).toBeGreaterThanOrEqual(5);
    expect(initial).toEqual([...initial].sort((a, b) => a.localeCompare(b)));
    await table.getByRole('button', { name: /^Price/ }).click();
    const prices = (await table.locator('tbody tr td:nth-child(9)').allInnerTexts()).map((t) => Number(t.replace(/[^0-9.]/g, '')));
    expect(prices).toEqual([...prices].sort((a, b) => a - b));
    await page.getByLabel('Filter Roll products').fill('glass');
    expect(await names()).toEqual(['Glass wool roll 170 mm, lower conductivity, 1200 mm wide']);
    await page.getByLabel('Filter Roll products').fill('');
    await screenshot(page, 'quotes-06-settings-products');
    await page.getByRole('tab', { name: 'Tax rates' }).click();
    await page.getByRole('table', { name: 'Tax rates by date' }).waitFor();
    await screenshot(page, 'quotes-07-settings-tax');
  }, 60_000);
});
