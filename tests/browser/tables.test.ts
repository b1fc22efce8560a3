// A data table in a real browser: the office's customers, sorted by a header and filtered by the
// search box (TanStack Table in src/components/data-table).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../server/db/seeders/demo';
import { screenshot, signInThroughUi, startDemoBrowserSuite } from '../helpers/browser';

let suite: Awaited<ReturnType<typeof startDemoBrowserSuite>>;
let app: typeof suite.app;
let browser: typeof suite.browser;

beforeAll(async () => {
  suite = await startDemoBrowserSuite({ width: 1280, height: 860 });
  ({ app, browser } = suite);
}, 120_000);
afterAll(async () => {
  await suite?.close();
});

describe('customers table', () => {
  it('sorts by name both ways from its header and filters by every word typed', async () => {
    const page = await browser.newPage();
    await signInThroughUi(page, app.url, 'office@demo.example.com', DEMO_PASSWORD);
    await page.goto(`${app.url}/customers`);
    const table = page.getByRole('table', { name: 'Customers' });
    await table.waitFor();
    // The first line of each name cell (the phone shows under it on narrow screens only).
    const names = async () => (await table.locator('tbody tr td:first-child').allInnerTexts()).map((t) => t.split('\n')[0].trim());
    const collator = new Intl.Collator('en-GB');

    const first = await names();
    expect(first.length).toBeGreaterThan(2);
    expect(first).toEqual([...first].sort(collator.compare));
    const header = table.getByRole('columnheader', { name: /Name/ });
    await expect(header.getAttribute('aria-sort')).resolves.toBe('ascending');

    await header.getByRole('button').click();
    await expect.poll(() => header.getAttribute('aria-sort')).toBe('descending');
    expect(await names()).toEqual([...first].sort(collator.compare).reverse());
    await screenshot(page, 'customers-sorted-desc-1280');

    // Filter by two words of one customer's name: only the rows holding both remain.
    const target = first[0];
    const words = target.split(/\s+/);
    await page.getByLabel('Find a customer').fill(`${words[words.length - 1].toLowerCase()} ${words[0]}`);
    await expect.poll(names).toEqual(first.filter((n) => words.every((w) => n.toLowerCase().includes(w.toLowerCase()))).reverse());
    await page.getByLabel('Find a customer').fill('no such customer anywhere');
    await page.getByText('No customer matches').waitFor();
    await page.close();
  });
});
