// axe-core on every page of the app, as the role that uses it, at desktop and phone widths: no
// serious or critical violation of WCAG 2.2 A/AA (the rules axe can check; a person still has to
// try the pages with a keyboard and a screen reader).
import { AxeBuilder } from '@axe-core/playwright';
import type { Page } from 'playwright-core';
import { Op } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '../../shared/auth/roles';
import { Invoice, Job, Organisation, Quote, Space } from '../../server/db/models';
import { DEMO_PASSWORD, seedDemo } from '../../server/db/seeders/demo';
import { endOfDayEpochSec, signQuoteLink } from '../../server/modules/quotes/quote-link';
import { launchBrowser, signInThroughUi, startAppServer } from '../helpers/browser';

/** `tabs`: the page's tabs, each chosen in turn and checked as well (their panels are separate screens). */
type Visit = { path: string; role: Role | null; ready?: (page: Page) => Promise<unknown>; tabs?: string[] };

let app: Awaited<ReturnType<typeof startAppServer>>;
let desktop: Awaited<ReturnType<typeof launchBrowser>>;
let phone: Awaited<ReturnType<typeof launchBrowser>>;
let visits: Visit[];

/** A page is ready when its heading (or the visit's own mark) shows and nothing on it is still loading. */
async function settled(page: Page, visit: Visit) {
  await (visit.ready ? visit.ready(page) : page.locator('h1').first().waitFor());
  await expect.poll(() => page.locator('.animate-spin').count(), { timeout: 30_000 }).toBe(0);
}

beforeAll(async () => {
  app = await startAppServer();
  await seedDemo(app.ctx.deps);
  const org = (await Organisation.findOne({ where: { name: { [Op.like]: 'Hearthfold%' } } }))!;
  const jobs = await Job.findAll({ where: { organisationId: org.id } });
  const scheduled = jobs.find((j) => j.stage === 'scheduled')!;
  const space = (await Space.findOne({ where: { jobId: scheduled.id } }))!;
  const quote = (await Quote.findOne({ where: { jobId: jobs.map((j) => j.id), status: 'sent', linkNonce: { [Op.ne]: null } } }))!;
  const anyQuote = (await Quote.findOne({ where: { jobId: scheduled.id } }))!;
  const invoice = (await Invoice.findOne({ where: { jobId: jobs.map((j) => j.id) } }))!;
  const link = signQuoteLink({ quoteId: quote.id, nonce: quote.linkNonce!, exp: endOfDayEpochSec(quote.validUntil) }, app.ctx.config.sessionSecret);
  visits = [
    { path: '/sign-in', role: null },
    { path: '/reset-password', role: null, ready: (p) => p.getByRole('button').first().waitFor() },
    { path: '/set-password?token=not-a-real-token', role: null, ready: (p) => p.getByRole('button').first().waitFor() },
    {
      path: `/q/${encodeURIComponent(link)}`,
      role: null,
      ready: (p) =>
        p
          .getByRole('button', { name: /Accept/ })
          .first()
          .waitFor(),
    },
    { path: '/jobs', role: 'office' },
    { path: '/jobs/new', role: 'office' },
    { path: `/jobs/${scheduled.id}`, role: 'office', ready: (p) => p.getByText('Loft spaces').first().waitFor() },
    { path: `/jobs/${scheduled.id}/edit`, role: 'office', ready: (p) => p.getByRole('button', { name: /Save/ }).first().waitFor() },
    { path: `/jobs/${scheduled.id}/quotes/${anyQuote.id}`, role: 'office', ready: (p) => p.getByText(anyQuote.number).first().waitFor() },
    { path: '/customers', role: 'office' },
    { path: '/users', role: 'office' },
    { path: '/outbox', role: 'office' },
    { path: '/schedule', role: 'office' },
    { path: '/settings', role: 'office', tabs: ['Labour, waste, eaves, savings', 'Products', 'Extras', 'Tax rates'] },
    { path: '/settings/payments', role: 'office' },
    { path: '/invoices', role: 'office', tabs: ['To pay', 'Overdue', 'Paid'] },
    { path: `/invoices/${invoice.id}`, role: 'office', ready: (p) => p.getByText(invoice.number).first().waitFor() },
    { path: `/spaces/${space.id}/edit`, role: 'estimator', ready: (p) => p.getByTestId('plan-canvas').waitFor() },
    { path: '/my-jobs', role: 'installer' },
    {
      path: `/jobs/${scheduled.id}/sheet`,
      role: 'installer',
      ready: (p) =>
        p
          .getByRole('img', { name: /Plan of/ })
          .first()
          .waitFor(),
    },
    { path: '/no-such-page', role: 'office' },
  ];
  desktop = await launchBrowser({ viewport: { width: 1280, height: 860 } });
  phone = await launchBrowser({ viewport: { width: 390, height: 844 } });
}, 180_000);

afterAll(async () => {
  await desktop?.close();
  await phone?.close();
  await app?.close();
});

/** Serious and critical violations on the page as it stands, one line each. */
async function violations(page: Page): Promise<string[]> {
  const result = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map(
      (v) =>
        `${v.id} (${v.impact}): ${v.nodes
          .map((n) => n.target.join(' '))
          .slice(0, 4)
          .join(', ')} — ${v.help}`,
    );
}

describe.each([
  ['desktop 1280', () => desktop],
  ['phone 390', () => phone],
])('accessibility at %s', (_label, browserOf) => {
  it('has no serious or critical axe violation on any page', { timeout: 600_000 }, async () => {
    const found: string[] = [];
    let signedInAs: Role | null | undefined;
    const page = await browserOf().newPage();
    for (const visit of visits) {
      if (visit.role !== signedInAs) {
        await page.context().clearCookies();
        if (visit.role) await signInThroughUi(page, app.url, `${visit.role}@demo.example.com`, DEMO_PASSWORD);
        signedInAs = visit.role;
      }
      await page.goto(`${app.url}${visit.path}`);
      await settled(page, visit);
      for (const v of await violations(page)) found.push(`${visit.path} — ${v}`);
      for (const tab of visit.tabs ?? []) {
        await page.getByRole('tab', { name: tab }).click();
        await expect.poll(() => page.getByRole('tab', { name: tab }).getAttribute('aria-selected')).toBe('true');
        await page.getByRole('tabpanel', { name: tab }).waitFor();
        await settled(page, { ...visit, ready: undefined });
        for (const v of await violations(page)) found.push(`${visit.path} (${tab}) — ${v}`);
      }
    }
    await page.close();
    expect(found, found.join('\n')).toEqual([]);
  });
});

describe('tabs by keyboard', () => {
  it('moves between the settings tabs with the arrow keys and opens one with Enter, its panel labelled by it', { timeout: 90_000 }, async () => {
    const page = await desktop.newPage();
    // The pages above share this browser's cookies: start signed out.
    await page.context().clearCookies();
    await signInThroughUi(page, app.url, 'office@demo.example.com', DEMO_PASSWORD);
    await page.goto(`${app.url}/settings`);
    const first = page.getByRole('tab', { name: 'Company and quotes' });
    await first.focus();
    await page.keyboard.press('ArrowRight');
    const pricing = page.getByRole('tab', { name: 'Labour, waste, eaves, savings' });
    await expect.poll(() => pricing.evaluate((el) => el === document.activeElement)).toBe(true);
    // Manual activation: focus alone does not swap the panel (a half-typed form stays).
    await expect(first.getAttribute('aria-selected')).resolves.toBe('true');
    await page.keyboard.press('Enter');
    await page.getByRole('tabpanel', { name: 'Labour, waste, eaves, savings' }).waitFor();
    await page.keyboard.press('End');
    await expect.poll(() => page.getByRole('tab', { name: 'Tax rates' }).evaluate((el) => el === document.activeElement)).toBe(true);
    // Only the chosen tab is in the Tab order.
    expect(await page.locator('[role="tab"][tabindex="0"]').count()).toBe(1);
    await page.close();
  });
});
