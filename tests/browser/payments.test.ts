// The customer pays a deposit in headless chromium: our deposit page → the local checkout stand-in
// (through the real SDK) → cancel and try again → pay → our success page once the signed webhook
// has landed; then the office sees it on the job. Screenshots: test-output/screenshots/payments-*.png.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Customer } from '../../server/db/models/customer';
import { Job } from '../../server/db/models/job';
import { createFakePaymentService, type FakePaymentService } from '../../server/lib/payments/fake-service';
import { launchBrowser, screenshot, signInThroughUi, startAppServer } from '../helpers/browser';
import { createJob, createOrgWithUsers, loginAs, type TestOrg } from '../helpers/test-app';
import { createAcceptedQuote, WEBHOOK_SECRET } from '../server/payments-fixtures';

let server: Awaited<ReturnType<typeof startAppServer>>;
let browser: Awaited<ReturnType<typeof launchBrowser>>;
let fake: FakePaymentService;
let fakeHandle: { url: string; close(): Promise<void> };
let org: TestOrg;

beforeAll(async () => {
  fake = createFakePaymentService({ webhookSecret: WEBHOOK_SECRET });
  fakeHandle = await fake.listen(0);
  // The app reads payments through its checked configuration.
  server = await startAppServer({ STRIPE_SECRET_KEY: 'sk_test_quiltline_browser', STRIPE_WEBHOOK_SECRET: WEBHOOK_SECRET, PAYMENTS_API_URL: fakeHandle.url });
  fake.setWebhookUrl(`${server.url}/api/payments/webhook`);
  org = await createOrgWithUsers(server.ctx);
  const office = await loginAs(server.ctx.app, org.office);
  await office.put('/api/payments/settings').send({ depositMode: 'percent', depositPercentBp: 2500, paymentTermsDays: 14 });
  browser = await launchBrowser({ viewport: { width: 1280, height: 860 } });
}, 120_000);
afterAll(async () => {
  await browser?.close();
  await server?.close();
  await fakeHandle?.close();
});

describe('customer pays the deposit', () => {
  it('accepts the quote, cancels once, tries again, pays on the stand-in checkout and sees it confirmed; the office sees it on the job and the quote', async () => {
    const { job } = await createJob(org, { stage: 'quoted', customerName: 'Ada Fenwick' });
    const { quote, link } = await createAcceptedQuote(org.id, job.id, server.ctx.config.sessionSecret, { status: 'sent' });
    const page = await browser.newPage();

    // The customer accepts on the quote's public page and is sent straight on to the deposit.
    await page.goto(`${server.url}/q/${link}`);
    await page.getByLabel(/Your full name/).fill('Ada Fenwick');
    await page.getByLabel(/I have read the quote/).check();
    // The deposit is said before accepting (25 % of £575.76 = £143.94), on the button too.
    expect(await page.getByTestId('deposit-before-accept').textContent()).toContain('A deposit of £143.94 (25% of the total) is paid by card when you accept');
    await screenshot(page, 'payments-0-accepting');
    await page.getByRole('button', { name: 'Accept and pay the £143.94 deposit' }).click();
    await page.waitForURL((u) => u.pathname.startsWith('/pay/deposit/'), { timeout: 30_000 });
    await expect.poll(() => page.getByTestId('deposit-amount').textContent()).toBe('£143.94');
    await screenshot(page, 'payments-1-deposit-page');

    await page.getByRole('button', { name: 'Pay deposit by card' }).click();
    await page.waitForURL((u) => u.origin === fakeHandle.url);
    expect(await page.getByTestId('total').textContent()).toBe('£143.94');
    expect(await page.getByRole('note').textContent()).toContain('Local test checkout');
    await screenshot(page, 'payments-2-stand-in-checkout');

    await page.getByRole('button', { name: 'Cancel and go back' }).click();
    await page.waitForURL((u) => u.pathname.startsWith('/pay/cancelled/'));
    expect(await page.getByTestId('cancelled').textContent()).toContain('nothing was paid');
    await screenshot(page, 'payments-3-cancelled');
    expect(fake.deliveries).toHaveLength(0);

    await page.getByRole('button', { name: /Try again: pay £143\.94/ }).click();
    await page.waitForURL((u) => u.origin === fakeHandle.url);
    await page.getByRole('button', { name: 'Pay £143.94' }).click();
    await page.waitForURL((u) => u.pathname.startsWith('/pay/done/'));
    await expect.poll(() => page.getByTestId('paid').textContent(), { timeout: 30_000 }).toContain('£143.94');
    await screenshot(page, 'payments-4-paid');
    expect(fake.deliveries.map((d) => [d.type, d.status])).toEqual([['checkout.session.completed', 200]]);

    // The office: the job's payments card shows the deposit with its amount and time.
    const office = await browser.newPage();
    await signInThroughUi(office, server.url, org.office.email, org.office.password);
    await office.goto(`${server.url}/jobs/${job.id}`);
    await expect
      .poll(() => office.getByTestId('money-timeline').textContent(), { timeout: 30_000 })
      .toContain(`Deposit of £143.94 paid for quote ${quote.number}`);
    await screenshot(office, 'payments-5-office-job');
    await office.goto(`${server.url}/jobs/${job.id}/quotes/${quote.id}`);
    await office.getByTestId('deposit-status').waitFor({ timeout: 45_000 });
    expect(await office.getByTestId('deposit-status').textContent()).toMatch(/^Deposit of £143\.94 paid /);
    await screenshot(office, 'payments-5b-office-quote');
  }, 180_000);

  it('the office invoices the installed job with a variation; the customer pays the balance from the private link', async () => {
    const { job, customer } = await createJob(org, { stage: 'accepted', customerName: 'Basil Orrin', assignedInstallerId: org.installer.id });
    await Customer.update({ email: 'basil.orrin@example.com' }, { where: { id: customer.id } });
    // The installer notes a variation on site (no prices: the office prices it on the invoice).
    await Job.update({ stage: 'scheduled' }, { where: { id: job.id } });
    const installer = await loginAs(server.ctx.app, org.installer);
    const note = await installer
      .post(`/api/jobs/${job.id}/notes`)
      .set('Idempotency-Key', `note-${job.id}`)
      .send({ text: 'Two more walkway boards needed beside the tank' });
    expect(note.status).toBe(201);
    const { link } = await createAcceptedQuote(org.id, job.id, server.ctx.config.sessionSecret);
    const customerPage = await browser.newPage();
    await customerPage.goto(`${server.url}/pay/deposit/${link}`);
    await customerPage.getByRole('button', { name: 'Pay deposit by card' }).click();
    await customerPage.getByRole('button', { name: 'Pay £143.94' }).click();
    await customerPage.waitForURL((u) => u.pathname.startsWith('/pay/done/'));
    await Job.update({ stage: 'installed' }, { where: { id: job.id } });

    const office = await browser.newPage();
    await browser.context.clearCookies(); // the first test left the office signed in
    await signInThroughUi(office, server.url, org.office.email, org.office.password);
    await office.goto(`${server.url}/jobs/${job.id}`);
    await office.getByRole('button', { name: 'Create invoice' }).click();
    await expect.poll(() => office.getByTestId('site-notes').textContent(), { timeout: 30_000 }).toContain('Two more walkway boards needed beside the tank');
    await office.getByRole('button', { name: 'Add a line' }).click();
    await office.getByLabel('Line 1 description').fill('Extra walkway boards');
    await office.getByLabel('Line 1 quantity').fill('2');
    await office.getByLabel('Line 1 unit price').fill('12.99');
    await office.getByLabel('Line 1 tax class').selectOption('standard');
    await screenshot(office, 'payments-6a-create-invoice');
    await office.getByRole('button', { name: 'Create and e-mail invoice' }).click();
    await office.waitForURL((u) => u.pathname.startsWith('/invoices/'), { timeout: 30_000 });
    // Hand-worked: £575.76 + 2 × £12.99 + 20 % VAT (£5.20) = £606.94; less £143.94 deposit = £463.00.
    await expect.poll(() => office.getByTestId('summary-to-pay').textContent(), { timeout: 30_000 }).toBe('£463.00');
    expect(await office.getByTestId('summary-total').textContent()).toBe('£606.94');
    await screenshot(office, 'payments-6-office-invoice');

    const mail = await server.ctx.outbox.waitFor((m) => m.to.includes('basil.orrin@example.com') && m.subject.startsWith('Invoice'));
    const payUrl = /(http:\/\/127\.0\.0\.1:\d+\/pay\/invoice\/[A-Za-z0-9_-]+)/.exec(mail.text)![1];
    await customerPage.goto(payUrl);
    expect(await customerPage.getByTestId('balance').textContent()).toBe('£463.00');
    await screenshot(customerPage, 'payments-7-invoice-pay-page');
    await customerPage.getByRole('button', { name: 'Pay by card' }).click();
    await customerPage.getByRole('button', { name: 'Pay £463.00' }).click();
    await customerPage.waitForURL((u) => u.pathname.startsWith('/pay/done/'));
    await expect.poll(() => customerPage.getByTestId('paid').textContent(), { timeout: 30_000 }).toContain('£463.00');
    await screenshot(customerPage, 'payments-8-balance-paid');

    await office.reload();
    await expect.poll(() => office.getByTestId('summary-paid').count(), { timeout: 30_000 }).toBe(1);
    await screenshot(office, 'payments-9-office-invoice-paid');
  }, 180_000);
});
