// A day's work end to end in headless chromium, through the screens alone (no API shortcuts): the
// estimator records a new customer and job and draws the loft; the office prices and sends the
// quote; the customer accepts it from the e-mailed link; the office books the installer; the
// installer works the job sheet on a phone and marks it installed; the office invoices it.
// Desktop 1440 px, tablet 1024 px and phone 390 px; screenshots in test-output/screenshots/day-*.png.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Invoice, Job, PlanRevision, Quote, Space } from '../../server/db/models';
import { DEMO_PASSWORD, seedDemo } from '../../server/db/seeders/demo';
import { seedQuotesDemo } from '../../server/db/seeders/quotes-demo';
import { launchBrowser, screenshot, signInThroughUi, startAppServer } from '../helpers/browser';
import { rotatedJpeg } from '../server/job-sheet-fixtures';

const DESKTOP = { width: 1440, height: 900 };
const TABLET = { width: 1024, height: 768 };
const PHONE = { width: 390, height: 844 };

let app: Awaited<ReturnType<typeof startAppServer>>;
let desktop: Awaited<ReturnType<typeof launchBrowser>>;
let tablet: Awaited<ReturnType<typeof launchBrowser>>;
let phone: Awaited<ReturnType<typeof launchBrowser>>;

beforeAll(async () => {
  app = await startAppServer();
  await seedDemo(app.ctx.deps);
  await seedQuotesDemo();
  desktop = await launchBrowser({ viewport: DESKTOP });
  tablet = await launchBrowser({ viewport: TABLET });
  phone = await launchBrowser({ viewport: PHONE });
}, 120_000);

afterAll(async () => {
  for (const b of [desktop, tablet, phone]) await b?.close();
  await app?.close();
});

/** Full-page shot from the top, named for the step and the width. */
async function shot(page: Page, name: string) {
  await page.evaluate(() => window.scrollTo(0, 0));
  await screenshot(page, `day-${name}-${page.viewportSize()!.width}`);
}

const CUSTOMER = { name: 'Maren Oakes', email: `maren.oakes.${Date.now()}@example.com`, line1: '9 Linden Row', town: 'Ashcombe', postcode: 'AB1 7LR' };

describe("a day's work through the screens", () => {
  it('estimator → office → customer → office → installer → office invoice', { timeout: 300_000 }, async () => {
    // Estimator, desktop: a new customer and job, a space, the loft drawn by typed walls and saved.
    const est = await desktop.newPage();
    await signInThroughUi(est, app.url, 'estimator@demo.example.com', DEMO_PASSWORD);
    await est.goto(`${app.url}/jobs/new`);
    await est.getByRole('radio', { name: 'New customer' }).click();
    await est.getByLabel('Customer name').fill(CUSTOMER.name);
    await est.getByLabel('E-mail').fill(CUSTOMER.email);
    await est.getByLabel('Address line 1').first().fill(CUSTOMER.line1);
    await est.getByLabel('Town').first().fill(CUSTOMER.town);
    await est.getByLabel('Postcode').first().fill(CUSTOMER.postcode);
    await shot(est, '01-new-job');
    await est.getByRole('button', { name: 'Create job' }).click();
    await est.waitForURL(/\/jobs\/[0-9a-f-]{36}$/);
    const jobId = new URL(est.url()).pathname.split('/').pop()!;
    await est.getByRole('button', { name: 'Add space' }).click();
    await est.getByLabel('Name of the space').fill('Main loft');
    await est.getByRole('button', { name: 'Add', exact: true }).click();
    await est.getByRole('link', { name: /Draw plan/ }).click();
    await est.getByTestId('plan-canvas').waitFor();
    await est.getByTestId('wall-run').fill('7200 right, 5400 down, 7200 left, 5400 up');
    await expect.poll(() => est.getByTestId('wall-run-preview').textContent()).toMatch(/4 corners; closes with 0 mm closing error/);
    await est.getByTestId('wall-run-apply').click();
    await est.getByTestId('step-joists').click();
    await est.getByTestId('centres-400').click();
    await est.getByTestId('joist-angle').fill('0');
    await est.getByTestId('joist-angle').press('Enter');
    await est.getByTestId('save').click();
    await expect.poll(() => est.getByTestId('save-status').textContent(), { timeout: 20_000 }).toMatch(/Saved · rev \d/);
    await shot(est, '02-plan-saved');
    const space = (await Space.findOne({ where: { jobId } }))!;
    const revision = await PlanRevision.findOne({ where: { spaceId: space.id }, order: [['revision', 'DESC']] });
    expect(revision?.takeoff, 'the saved revision carries its takeoff').toBeTruthy();

    // Office, tablet: build the quote from the takeoff and send it.
    const office = await tablet.newPage();
    await signInThroughUi(office, app.url, 'office@demo.example.com', DEMO_PASSWORD);
    await office.goto(`${app.url}/jobs/${jobId}`);
    await office.getByRole('button', { name: 'Build a quote from the takeoff' }).click();
    await office.waitForURL(/\/quotes\/[0-9a-f-]{36}$/, { timeout: 30_000 });
    await office.getByTestId('quote-line').first().waitFor();
    await shot(office, '03-quote-built');
    await office.getByRole('button', { name: 'Send to the customer' }).click();
    await office.getByText(/Sent to the customer/).waitFor({ timeout: 30_000 });
    const quote = (await Quote.findOne({ where: { jobId } }))!;

    // The office reads the e-mail in the Outbox and follows its private link, as the customer would.
    await office.goto(`${app.url}/outbox`);
    const message = office.getByRole('button', { name: new RegExp(`quote ${quote.number}`) }).first();
    await message.waitFor();
    if ((await message.getAttribute('aria-expanded')) !== 'true') await message.click(); // the newest opens by itself
    expect(await office.getByTestId('outbox-reply-to').first().textContent()).toMatch(/^replies go to /);
    const href = (await office.getByRole('link', { name: /\/q\// }).first().getAttribute('href'))!;
    await shot(office, '04-outbox');

    // Customer, phone: read and accept.
    const customer = await phone.newPage();
    await customer.goto(href);
    await customer.getByLabel(/Your full name/).fill(CUSTOMER.name);
    await customer.getByLabel(/I have read the quote/).check();
    await shot(customer, '05-customer-quote');
    await customer.getByRole('button', { name: /^Accept/ }).click();
    await customer.getByText(new RegExp(`Thank you: ${CUSTOMER.name} accepted this quote`)).waitFor({ timeout: 30_000 });
    await shot(customer, '06-customer-accepted');
    await customer.close();

    // Office, tablet: book Ian Calder for today on the schedule.
    await office.goto(`${app.url}/schedule`);
    const job = (await Job.findByPk(jobId))!;
    const row = office.getByRole('listitem').filter({ hasText: job.reference });
    await row.getByRole('combobox').selectOption({ label: 'Ian Calder' });
    await row.getByRole('button', { name: 'Book' }).click();
    const anyway = office.getByRole('button', { name: 'Book anyway' });
    const confirmation = office.getByTestId('booking-confirmation');
    await expect.poll(async () => (await confirmation.count()) + (await anyway.count()), { timeout: 20_000 }).toBeGreaterThan(0);
    if ((await confirmation.count()) === 0) await anyway.click();
    await expect.poll(() => confirmation.textContent(), { timeout: 20_000 }).toContain(`${job.reference} (${CUSTOMER.name}) booked for Ian Calder`);
    await shot(office, '07-booked');

    // Installer, phone: the job sheet, every check ticked, an after photo, marked installed.
    const inst = await phone.newPage();
    await signInThroughUi(inst, app.url, 'installer@demo.example.com', DEMO_PASSWORD);
    await inst.goto(`${app.url}/jobs/${jobId}/sheet`);
    await inst.getByRole('heading', { name: 'Main loft' }).waitFor({ timeout: 30_000 });
    await shot(inst, '08-job-sheet');
    const unticked = inst.locator('[data-testid^="tick-"][aria-pressed="false"]');
    for (let left = await unticked.count(); left > 0; left--) {
      await unticked.first().click();
      await expect.poll(() => unticked.count(), { timeout: 15_000 }).toBe(left - 1);
    }
    await inst.locator('summary', { hasText: 'Photos' }).click();
    await inst.getByRole('radio', { name: 'After' }).click();
    await inst
      .locator('input[type="file"][id^="photo-"]')
      .first()
      .setInputFiles({ name: 'after.jpg', mimeType: 'image/jpeg', buffer: await rotatedJpeg() });
    await expect.poll(() => inst.getByTestId('waiting-count').first().textContent(), { timeout: 45_000 }).toBe('0');
    await inst.locator('summary', { hasText: 'Finish the job' }).click();
    await inst.getByRole('button', { name: 'Mark installed' }).click();
    await inst.getByText(/Marked installed by/).waitFor({ timeout: 30_000 });
    await shot(inst, '09-installed');
    expect((await Job.findByPk(jobId))!.stage).toBe('installed');

    // Office, desktop width: the invoice from the accepted quote, e-mailed.
    await office.setViewportSize(DESKTOP);
    await office.goto(`${app.url}/jobs/${jobId}`);
    await office.getByRole('button', { name: 'Create invoice' }).click();
    await office.getByRole('button', { name: 'Create and e-mail invoice' }).click();
    await office.waitForURL(/\/invoices\/[0-9a-f-]{36}$/, { timeout: 30_000 });
    await office
      .getByText(/INV-\d{6}/)
      .first()
      .waitFor();
    await shot(office, '10-invoice');
    const invoice = (await Invoice.findOne({ where: { jobId, kind: 'invoice' } }))!;
    expect(invoice.number).toMatch(/^INV-\d{6}$/);
    expect(await office.getByText(invoice.number).first().isVisible()).toBe(true);
    // Quantities with their units, as on the quote (rolls, hours).
    expect(await office.getByRole('cell', { name: /^\d+(\.\d+)? roll$/ }).count()).toBeGreaterThan(0);
    await app.ctx.outbox.waitFor((m) => m.envelopeTo.includes(CUSTOMER.email) && m.subject.startsWith(`Invoice ${invoice.number}`));

    // The same job page at tablet and phone widths, for the record.
    await office.goto(`${app.url}/jobs/${jobId}`);
    await office.getByRole('heading', { name: new RegExp(CUSTOMER.name) }).waitFor();
    await shot(office, '11-job-page');
    for (const size of [TABLET, PHONE]) {
      await office.setViewportSize(size);
      await shot(office, '11-job-page');
    }
  });
});
