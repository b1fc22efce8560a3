// Data tables in a real browser (TanStack Table in src/components/data-table): the customers and
// the catalogue sorted by a header and filtered on the client; the jobs searched, sorted and paged
// by the server; the users with their actions at desktop and phone widths.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { JOB_PAGE_DEFAULT } from '../../shared/api/jobs';
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

describe('jobs table', () => {
  it("pages through the server's pages, searched and sorted by the server across all jobs", { timeout: 180_000 }, async () => {
    const page = await browser.newPage();
    await page.context().clearCookies();
    await signInThroughUi(page, app.url, 'office@demo.example.com', DEMO_PASSWORD);
    // More jobs than one page of GET /api/jobs (50), made through the API as the office would.
    const { customers } = (await (await page.request.get(`${app.url}/api/customers`)).json()) as { customers: Array<{ id: string }> };
    const made = JOB_PAGE_DEFAULT + 5;
    for (let k = 0; k < made; k++) {
      const res = await page.request.post(`${app.url}/api/jobs`, {
        data: { customerId: customers[k % customers.length].id, propertyAddress: { line1: `${k + 1} Cursor Lane`, town: 'Pagingford', postcode: 'PG1 1AA' } },
      });
      expect(res.status()).toBe(201);
    }
    const jobsAsked: URL[] = [];
    page.on('request', (r) => {
      const u = new URL(r.url());
      if (u.pathname === '/api/jobs') jobsAsked.push(u);
    });
    await page.goto(`${app.url}/jobs`);
    const table = page.getByRole('table', { name: 'Jobs' });
    await table.waitFor();
    const rows = () => table.locator('tbody tr').count();
    await expect.poll(rows).toBe(JOB_PAGE_DEFAULT);
    await expect(table.getByRole('columnheader', { name: /Last changed/ }).getAttribute('aria-sort')).resolves.toBe('descending');

    // The search goes to the server: it finds jobs beyond the first page loaded.
    await page.getByLabel('Search all jobs').fill('Pagingford');
    await page.getByText(`${made} jobs match`).waitFor();
    await expect.poll(rows).toBe(JOB_PAGE_DEFAULT);
    await page.getByText(`Showing ${JOB_PAGE_DEFAULT} of ${made} jobs`).waitFor();
    await screenshot(page, 'tables-jobs-search-1280');
    await page.getByRole('button', { name: 'Load more jobs' }).click();
    await expect.poll(rows).toBe(made);
    const next = jobsAsked.at(-1)!;
    expect(next.searchParams.get('cursor')).toBeTruthy();
    expect(next.searchParams.get('q')).toBe('Pagingford');
    await expect(page.getByRole('button', { name: 'Load more jobs' }).count()).resolves.toBe(0);
    const lines = await table.locator('tbody tr td:nth-child(3)').allInnerTexts();
    expect(new Set(lines).size).toBe(made);
    expect(lines.every((l) => l.includes('Pagingford'))).toBe(true);

    // A header asks the server for its order; the rows are the server's first page in that order.
    await page.getByLabel('Search all jobs').fill('');
    const customer = table.getByRole('columnheader', { name: /Customer/ });
    await customer.getByRole('button').click();
    await expect.poll(() => customer.getAttribute('aria-sort')).toBe('ascending');
    const names = async () => (await table.locator('tbody tr td:nth-child(2) a').allInnerTexts()).map((t) => t.trim());
    const byServer = async (dir: string) => {
      const body = (await (await page.request.get(`${app.url}/api/jobs?sort=customer&dir=${dir}`)).json()) as { jobs: Array<{ customer: { name: string } }> };
      return body.jobs.map((j) => j.customer.name);
    };
    const asc = await byServer('asc');
    await expect.poll(names).toEqual(asc);
    expect(jobsAsked.at(-1)!.searchParams.get('sort')).toBe('customer');
    // Whatever the database's collation, names that start with a capital letter keep their first letters in order.
    const initials = asc.map((n) => n[0]);
    expect(initials).toEqual([...initials].sort());
    await customer.getByRole('button').click();
    await expect.poll(() => customer.getAttribute('aria-sort')).toBe('descending');
    await expect.poll(names).toEqual(await byServer('desc'));
    await expect(page.getByLabel('Sort all jobs by').inputValue()).resolves.toBe('customer');
    await screenshot(page, 'tables-jobs-sorted-1280');
    // On a phone: the customer with the rest folded under it, and the stage (a few jobs, so the page is short).
    await page.setViewportSize({ width: 390, height: 844 });
    await page.getByLabel('Search all jobs').fill('Kelsworth');
    await expect.poll(async () => (await table.locator('tbody tr').allInnerTexts()).every((t) => t.includes('Kelsworth'))).toBe(true);
    await screenshot(page, 'tables-jobs-390');
    await page.close();
  });
});

describe('catalogue and users tables', () => {
  it('sorts the roll products by price both ways and filters them by every word', { timeout: 120_000 }, async () => {
    const page = await browser.newPage();
    await page.context().clearCookies();
    await signInThroughUi(page, app.url, 'office@demo.example.com', DEMO_PASSWORD);
    await page.goto(`${app.url}/settings`);
    await page.getByRole('tab', { name: 'Products' }).click();
    const table = page.getByRole('table', { name: 'Roll products' });
    await table.waitFor();
    const column = async (header: string) => {
      const i = (await table.locator('thead th').allInnerTexts()).findIndex((t) => t.trim().toLowerCase().startsWith(header.toLowerCase()));
      return (await table.locator(`tbody tr td:nth-child(${i + 1})`).allInnerTexts()).map((t) => t.trim());
    };
    const amount = (t: string) => Number(t.replace(/[^0-9.]/g, ''));
    const price = table.getByRole('columnheader', { name: /^Price/ });
    await price.getByRole('button').click();
    await expect.poll(() => price.getAttribute('aria-sort')).toBe('ascending');
    const up = (await column('Price')).map(amount);
    expect(up.length).toBeGreaterThan(2);
    expect(up).toEqual([...up].sort((a, b) => a - b));
    await price.getByRole('button').click();
    await expect.poll(() => price.getAttribute('aria-sort')).toBe('descending');
    expect((await column('Price')).map(amount)).toEqual([...up].sort((a, b) => b - a));

    const all = await column('Name');
    await page.getByLabel('Filter Roll products').fill('WOOL glass');
    await expect.poll(() => column('Name')).toEqual(all.filter((n) => /wool/i.test(n) && /glass/i.test(n)));
    expect((await column('Name')).length).toBeGreaterThan(0);
    await expect(table.getByRole('button', { name: /^Edit / }).count()).resolves.toBe((await column('Name')).length);
    await page.getByLabel('Filter Roll products').fill('');
    await screenshot(page, 'tables-products-1280');
    await page.setViewportSize({ width: 390, height: 844 });
    await screenshot(page, 'tables-products-390');
    await page.getByRole('tab', { name: 'Extras' }).click();
    await page.getByRole('table', { name: 'Extras' }).waitFor();
    await screenshot(page, 'tables-extras-390');
    await page.close();
  });

  it('lists the users with their actions at desktop and phone widths', { timeout: 120_000 }, async () => {
    const page = await browser.newPage();
    await page.context().clearCookies();
    await signInThroughUi(page, app.url, 'office@demo.example.com', DEMO_PASSWORD);
    await page.goto(`${app.url}/users`);
    const table = page.getByRole('table', { name: 'Users' });
    await table.getByText('Ian Calder').waitFor();
    const name = table.getByRole('columnheader', { name: /Name/ });
    await name.getByRole('button').click();
    await expect.poll(() => name.getAttribute('aria-sort')).toBe('ascending');
    await page.getByLabel('Find a user').fill('installer');
    await expect.poll(() => table.getByRole('combobox').evaluateAll((s) => s.every((e) => (e as HTMLSelectElement).value === 'installer'))).toBe(true);
    await page.getByLabel('Find a user').fill('');
    await screenshot(page, 'tables-users-1280');
    await page.setViewportSize({ width: 390, height: 844 });
    await table
      .getByRole('button', { name: /^Deactivate/ })
      .first()
      .waitFor();
    await screenshot(page, 'tables-users-390');
    await page.close();
  });
});
