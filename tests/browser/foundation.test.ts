// Signs in through the real UI as each demo role, on a desktop and a 360 px phone, and checks the
// navigation each role gets (shared/auth/policies.ts). Screenshots are kept in
// test-output/screenshots/ for a person to look at.
import fs from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '../../shared/auth/roles';
import { REPO_ROOT } from '../../server/config';
import { DEMO_PASSWORD, seedDemo } from '../../server/db/seeders/demo';
import { launchBrowser, screenshot, signInThroughUi, startAppServer } from '../helpers/browser';

// Links each role must see, in this order, and links it must not see. Other features may add
// links of their own (a schedule, say), so extra links are allowed.
const ROLES: Array<{ role: Role; email: string; home: string; nav: string[]; not: string[] }> = [
  { role: 'office', email: 'office@demo.example.com', home: '/jobs', nav: ['Jobs', 'Customers', 'Users', 'Settings', 'Outbox'], not: ['My jobs'] },
  { role: 'estimator', email: 'estimator@demo.example.com', home: '/jobs', nav: ['Jobs', 'Customers'], not: ['Users', 'Settings', 'Outbox', 'My jobs'] },
  { role: 'installer', email: 'installer@demo.example.com', home: '/my-jobs', nav: ['My jobs'], not: ['Jobs', 'Customers', 'Users', 'Settings', 'Outbox'] },
];

function expectNav(labels: string[], nav: string[], not: string[]) {
  expect(labels.filter((l) => nav.includes(l))).toEqual(nav);
  expect(labels.filter((l) => not.includes(l))).toEqual([]);
}

let app: Awaited<ReturnType<typeof startAppServer>>;
let desktop: Awaited<ReturnType<typeof launchBrowser>>;
let phone: Awaited<ReturnType<typeof launchBrowser>>;

beforeAll(async () => {
  app = await startAppServer();
  await seedDemo(app.ctx.deps);
  desktop = await launchBrowser({ viewport: { width: 1280, height: 860 } });
  phone = await launchBrowser({ viewport: { width: 360, height: 740 } });
}, 120_000);

afterAll(async () => {
  await desktop?.close();
  await phone?.close();
  await app?.close();
});

/** A new tab with no session left over from the previous test (the profile's cookies are shared). */
async function freshPage(browser: Awaited<ReturnType<typeof launchBrowser>>): Promise<Page> {
  await browser.context.clearCookies();
  const page = await browser.newPage();
  // Fail on the step that is stuck, well inside the test's own time limit.
  page.setDefaultTimeout(10_000);
  return page;
}

/** Link texts of the visible main navigation. */
async function navLinks(page: Page): Promise<string[]> {
  const nav = page.locator('nav[aria-label="Main"]:visible');
  await nav.first().waitFor();
  return (await nav.first().getByRole('link').allInnerTexts()).map((t) => t.trim());
}

async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Sign out' }).filter({ visible: true }).first().click();
  await page.waitForURL((u) => u.pathname === '/sign-in');
}

describe('foundation in a real browser', () => {
  it('refuses a wrong password on the sign-in page and says why', async () => {
    const page = await freshPage(desktop);
    await page.goto(`${app.url}/sign-in`);
    await page.getByLabel('E-mail').fill('office@demo.example.com');
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page.getByRole('alert').textContent()).resolves.toMatch(/do not match/);
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await screenshot(page, 'foundation-sign-in-error-1280');
    await page.close();
  });

  it.each(ROLES)('shows $role the right navigation on a desktop', async ({ role, email, home, nav, not }) => {
    const page = await freshPage(desktop);
    await signInThroughUi(page, app.url, email, DEMO_PASSWORD);
    await page.waitForURL((u) => u.pathname === home);
    await page.getByRole('heading').first().waitFor();
    expectNav(await navLinks(page), nav, not);
    await expect(page.getByTestId('signed-in-user').filter({ visible: true }).first().innerText()).resolves.toContain('Hearthfold Insulation');
    if (role !== 'installer') await page.getByRole('table', { name: 'Jobs' }).waitFor();
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(1280);
    await screenshot(page, `foundation-${role}-1280`);
    await signOut(page);
    await page.close();
  });

  it.each(ROLES)('folds the navigation into a menu for $role at 360 px', async ({ role, email, home, nav, not }) => {
    const page = await freshPage(phone);
    await signInThroughUi(page, app.url, email, DEMO_PASSWORD);
    await page.waitForURL((u) => u.pathname === home);
    await page.getByRole('heading').first().waitFor();
    expect(await page.locator('nav[aria-label="Main"]:visible').count()).toBe(0);
    // Nothing may stick out sideways on a phone.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360);
    await screenshot(page, `foundation-${role}-360`);
    await page.getByRole('button', { name: 'Menu' }).click();
    expectNav(await navLinks(page), nav, not);
    await screenshot(page, `foundation-${role}-360-menu`);
    await signOut(page);
    await page.close();
  });

  it('lets the office open a job, its users and the outbox', async () => {
    const page = await freshPage(desktop);
    await signInThroughUi(page, app.url, 'office@demo.example.com', DEMO_PASSWORD);
    // Other browser files add jobs for the demo customers to the same database: find the demo job
    // by its address through the server's search, as the office would.
    await page.getByLabel('Search all jobs').fill('2 Heron Court');
    const jobs = page.getByRole('table', { name: 'Jobs' });
    await expect.poll(() => jobs.locator('tbody tr').count()).toBe(1);
    await jobs.getByRole('link', { name: 'Samuel Okonjo' }).click();
    await page.getByRole('heading', { name: /Samuel Okonjo/ }).waitFor();
    await page.getByText('Loft spaces').waitFor();
    await screenshot(page, 'foundation-office-job-1280');

    await page.goto(`${app.url}/users`);
    await page.getByRole('table', { name: 'Users' }).getByText('Ian Calder').waitFor();
    await screenshot(page, 'foundation-office-users-1280');

    await page.goto(`${app.url}/outbox`);
    await page.getByRole('heading', { name: 'Outbox' }).waitFor();
    await screenshot(page, 'foundation-office-outbox-1280');
    await page.close();
  });

  it('invites a colleague, who follows the e-mailed link once, sets a password and signs in', async () => {
    const email = `nell.${Date.now().toString(36)}@demo.example.com`;
    const page = await freshPage(desktop);
    await signInThroughUi(page, app.url, 'office@demo.example.com', DEMO_PASSWORD);
    await page.goto(`${app.url}/users`);
    await page.getByRole('button', { name: 'Invite a colleague' }).click();
    const form = page.getByRole('form', { name: 'Invite a colleague' });
    await form.getByLabel('Name').fill('Nell Ashworth');
    await form.getByLabel('E-mail').fill(email);
    await form.getByLabel('Role', { exact: true }).selectOption('estimator');
    await form.getByRole('button', { name: 'Send invitation' }).click();
    await page.getByText(`Invitation sent to ${email}`).waitFor();

    await page.goto(`${app.url}/outbox`);
    // The caught copy, not its line in the sending-status list above it.
    const message = page
      .getByRole('list', { name: 'Caught e-mails' })
      .getByRole('listitem')
      .filter({ hasText: `to ${email}` });
    const link = message.getByRole('link', { name: /\/set-password\?token=/ });
    // The newest message opens by itself; open it if something newer arrived in between.
    await message.waitFor();
    if ((await message.getByRole('button').getAttribute('aria-expanded')) !== 'true') await message.getByRole('button').click();
    const href = await link.getAttribute('href');
    expect(new URL(href!).origin).toBe(app.url);
    await screenshot(page, 'foundation-office-outbox-invite-1280');
    await signOut(page);

    await page.goto(href!);
    await page.getByLabel('New password').fill('a roll of straw for the loft');
    await page.getByLabel('Repeat the password').fill('a roll of straw for the loft');
    await page.getByRole('button', { name: 'Save password' }).click();
    await page.getByText('Your password is set').waitFor();

    // The link works once.
    await page.goto(href!);
    await page.getByLabel('New password').fill('another password entirely');
    await page.getByLabel('Repeat the password').fill('another password entirely');
    await page.getByRole('button', { name: 'Save password' }).click();
    await expect(page.getByRole('alert').textContent()).resolves.toMatch(/already been used|expired|invalid/i);

    await signInThroughUi(page, app.url, email, 'a roll of straw for the loft');
    expectNav(await navLinks(page), ['Jobs', 'Customers'], ['Users', 'Outbox']);
    await page.close();
  });

  it("keeps the first download and the editor's chunk within their budgets, konva out of the first", async () => {
    const html = fs.readFileSync(path.join(REPO_ROOT, 'dist', 'index.html'), 'utf8');
    const entry = html.match(/<script type="module"[^>]*src="\/([^"]+)"/)?.[1];
    expect(entry).toBeTruthy();
    const code = fs.readFileSync(path.join(REPO_ROOT, 'dist', entry!));
    expect(code.toString('utf8')).not.toMatch(/Konva/);
    const editorFile = fs.readdirSync(path.join(REPO_ROOT, 'dist', 'assets')).find((f) => /^space-editor-page-.*\.js$/.test(f));
    expect(editorFile).toBeTruthy();
    const editor = fs.readFileSync(path.join(REPO_ROOT, 'dist', 'assets', editorFile!));
    const entryGzip = gzipSync(code).length;
    const editorGzip = gzipSync(editor).length;
    console.log(
      `[client] entry chunk ${entry}: ${(entryGzip / 1000).toFixed(1)} kB gzip; editor chunk ${editorFile}: ${(editorGzip / 1000).toFixed(1)} kB gzip`,
    );
    // The download budgets: what a phone on a weak signal fetches before the first screen, and before the editor draws.
    expect(entryGzip).toBeLessThan(150_000);
    expect(editorGzip).toBeLessThan(250_000);
  });

  it('keeps an installer out of the office pages', async () => {
    const page = await freshPage(desktop);
    await signInThroughUi(page, app.url, 'installer@demo.example.com', DEMO_PASSWORD);
    await page.goto(`${app.url}/users`);
    await page.getByRole('heading', { name: 'Not available for your role' }).waitFor();
    await page.close();
  });
});
