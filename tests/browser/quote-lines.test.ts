// The quote lines editor in a real browser, as the office: a price the money parser cannot read is
// named on its row's price field and holds the totals; a date only the server can refuse comes back
// as a 422 shown on that field; the saved lines are what was typed; axe finds nothing serious on
// the editable lines. At 1280 and 390 px; an accepted quote shows its lines as text. Screenshots go
// to test-output/screenshots/.
import { AxeBuilder } from '@axe-core/playwright';
import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Organisation, Quote, QuoteLine } from '../../server/db/models';
import { DEMO_COMPANY, DEMO_PASSWORD } from '../../server/db/seeders/demo';
import { screenshot, signInThroughUi, startDemoBrowserSuite } from '../helpers/browser';
import { createJob } from '../helpers/test-app';
import { examplePlan } from '../server/quotes-fixtures';

let suite: Awaited<ReturnType<typeof startDemoBrowserSuite>>;
let jobId = '';
let acceptedPath = '';

beforeAll(async () => {
  suite = await startDemoBrowserSuite({ width: 1280, height: 900 });
  const org = (await Organisation.findOne({ where: { name: DEMO_COMPANY } }))!;
  // A job of its own, so the demo company's quotes (which other browser tests read) stay as seeded.
  const made = await createJob({ id: org.id }, { stage: 'surveyed', plan: examplePlan(), customerName: 'Tamsin Oakes', spaceName: 'Main loft' });
  jobId = made.job.id;
  const accepted = (await Quote.findOne({ where: { organisationId: org.id, status: 'accepted' }, order: [['createdAt', 'ASC']] }))!;
  acceptedPath = `/jobs/${accepted.jobId}/quotes/${accepted.id}`;
}, 120_000);
afterAll(async () => {
  await suite?.close();
});

/** The text of the message the control points at with aria-describedby, once it is marked invalid. */
async function messageOf(page: Page, control: Locator): Promise<string> {
  await expect.poll(() => control.getAttribute('aria-invalid'), { timeout: 10_000 }).toBe('true');
  const id = (await control.getAttribute('aria-describedby'))!.split(' ')[0];
  return (await page.locator(`[id="${id}"]`).textContent()) ?? '';
}
async function officePage(): Promise<Page> {
  await suite.browser.context.clearCookies();
  const page = await suite.browser.newPage();
  page.setDefaultTimeout(15_000);
  await signInThroughUi(page, suite.app.url, 'office@demo.example.com', DEMO_PASSWORD);
  return page;
}
/** Serious and critical WCAG 2.2 A/AA violations axe finds on the editable lines as they stand (with a message showing). */
async function axeProblems(page: Page): Promise<string[]> {
  const r = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
  return r.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
}
const pageOverflow = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);

describe('quote lines editor in a real browser', () => {
  it('names a bad price on its row, shows the server’s refusal in place and saves what was typed', async () => {
    const page = await officePage();
    await page.goto(`${suite.app.url}/jobs/${jobId}`);
    await page.getByRole('button', { name: 'Build a quote from the takeoff' }).click();
    await page.waitForURL(/\/jobs\/[^/]+\/quotes\/[0-9a-f-]{36}$/, { timeout: 30_000 });
    const quoteId = page.url().split('/').at(-1)!;
    await page.getByTestId('quote-line').first().waitFor();
    const rows = await page.getByTestId('quote-line').count();
    await screenshot(page, 'quote-lines-01-draft-1280');

    // "26,90" in en-GB is neither £2,690 nor £26.90: refused on line 1's price, and the totals wait.
    const price1 = page.getByLabel('Line 1 unit price');
    await price1.fill('26,90');
    expect(await messageOf(page, price1)).toMatch(/^26,90 cannot be read as an amount here/);
    expect(await page.getByLabel('Line 2 unit price').getAttribute('aria-invalid')).toBeNull();
    await page.getByText('Fix the lines marked in red to see the totals.').waitFor();
    await screenshot(page, 'quote-lines-02-bad-price-1280');
    expect(await axeProblems(page)).toEqual([]);
    await price1.fill('30.00');
    await expect.poll(() => price1.getAttribute('aria-invalid')).toBeNull();
    await page.getByTestId('total-gross').waitFor();

    // A new line with a price but no description is asked for one; described, it counts.
    await page.getByRole('button', { name: 'Add a line' }).click();
    const n = rows + 1;
    await page.getByLabel(`Line ${n} unit price`).fill('18.50');
    expect(await messageOf(page, page.getByLabel(`Line ${n} description`))).toBe('describe the line');
    await page.getByLabel(`Line ${n} description`).fill('Loft hatch draught strip');
    await page.getByLabel(`Line ${n} tax class`).selectOption('standard');

    // A valid-until before the issue date passes the form's check; the server refuses it on that field.
    const validUntil = page.getByLabel('Valid until');
    const kept = await validUntil.inputValue();
    await validUntil.fill('2000-01-01');
    await page.getByRole('button', { name: 'Save changes' }).click();
    expect(await messageOf(page, validUntil)).toBe('valid-until cannot be before the issue date');
    await page.getByText('Some fields need attention.').waitFor();
    await screenshot(page, 'quote-lines-03-server-refusal-1280');
    await validUntil.fill(kept);
    await page.getByRole('button', { name: 'Save changes' }).click();
    await page.getByText('Saved.').waitFor();

    const saved = await QuoteLine.findAll({ where: { quoteId }, order: [['position', 'ASC']] });
    expect(saved).toHaveLength(n);
    expect(saved[0].unitPriceMinor).toBe(3000);
    expect([saved[n - 1].description, saved[n - 1].unitPriceMinor, saved[n - 1].taxClass, saved[n - 1].quantity]).toEqual([
      'Loft hatch draught strip',
      1850,
      'standard',
      1,
    ]);

    // On a phone the lines scroll inside their own box; the page itself does not widen.
    await page.setViewportSize({ width: 390, height: 844 });
    await page.reload();
    await page.getByTestId('quote-line').first().waitFor();
    expect(await page.getByLabel(`Line ${n} description`).inputValue()).toBe('Loft hatch draught strip');
    expect(await pageOverflow(page)).toBeLessThanOrEqual(0);
    await screenshot(page, 'quote-lines-04-draft-390');
    await page.getByLabel('Line 2 quantity').fill('-1');
    expect(await messageOf(page, page.getByLabel('Line 2 quantity'))).toBe('quantity cannot be negative');
    await screenshot(page, 'quote-lines-05-bad-quantity-390');
    expect(await axeProblems(page)).toEqual([]);
    await page.close();
  }, 120_000);

  it('shows an accepted quote’s lines as text, with nothing to change', async () => {
    const page = await officePage();
    for (const width of [1280, 390]) {
      await page.setViewportSize({ width, height: 900 });
      await page.goto(`${suite.app.url}${acceptedPath}`);
      await page.getByTestId('quote-line').first().waitFor();
      const table = page.getByRole('region', { name: 'Quote lines' });
      expect(await table.getByRole('textbox').count()).toBe(0);
      expect(await table.getByRole('combobox').count()).toBe(0);
      expect(await page.getByRole('button', { name: 'Add a line' }).count()).toBe(0);
      expect(await page.getByRole('button', { name: /^Save/ }).count()).toBe(0);
      expect(await pageOverflow(page)).toBeLessThanOrEqual(0);
      await screenshot(page, `quote-lines-06-accepted-${width}`);
    }
    await page.close();
  }, 60_000);
});
