// Browser tests: Debian's chromium driven by playwright-core, against the real app serving dist/.
import fs from 'node:fs';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { REPO_ROOT } from '../../server/config';
import { seedDemo } from '../../server/db/seeders/demo';
import { createOrgWithUsers, createTestContext, type TestContext, type TestOrg } from './test-app';

export const SCREENSHOT_DIR = path.join(REPO_ROOT, 'test-output', 'screenshots');
const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

/** Headless chromium in a fresh profile. Flags: no network chatter, no sandbox (the tests may run as root). */
export async function launchBrowser(opts: { viewport?: { width: number; height: number } } = {}) {
  if (!fs.existsSync(CHROMIUM)) throw new Error(`${CHROMIUM} is missing: apt-get install -y chromium (npm test does it when root)`);
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'quiltline-chromium-'));
  const context: BrowserContext = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    viewport: opts.viewport ?? { width: 1280, height: 800 },
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--disable-dev-shm-usage',
    ],
  });
  return {
    context,
    async newPage(): Promise<Page> {
      return context.newPage();
    },
    async close() {
      await context.close();
      fs.rmSync(profile, { recursive: true, force: true });
    },
  };
}

/**
 * The real app (createApp on the test database) listening on an ephemeral 127.0.0.1 port and
 * serving the built client from dist/. E-mailed links point at this port.
 */
export async function startAppServer(env: Record<string, string> = {}): Promise<{ url: string; ctx: TestContext; close(): Promise<void> }> {
  if (!fs.existsSync(path.join(REPO_ROOT, 'dist', 'index.html'))) {
    throw new Error('dist/ is missing: run `npm run build` first (npm test builds it)');
  }
  const ctx = await createTestContext(env);
  const server = ctx.app.listen(0, '127.0.0.1');
  await new Promise<void>((resolve, reject) => {
    server.once('listening', () => resolve());
    server.once('error', reject);
  });
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  ctx.config.appUrl = url;
  return {
    url,
    ctx,
    async close() {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await ctx.close();
    },
  };
}

/** Saves a full-page PNG under test-output/screenshots/<name>.png and returns its path. */
export async function screenshot(page: Page, name: string): Promise<string> {
  fs.mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const file = path.join(SCREENSHOT_DIR, `${name.replace(/[^a-z0-9._-]+/gi, '-')}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/** Signs in through the real sign-in form, waiting until the app leaves the sign-in page. */
export async function signInThroughUi(page: Page, baseUrl: string, email: string, password: string) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel(/e-?mail/i).fill(email);
  await page.getByLabel(/password/i).fill(password);
  await page.getByRole('button', { name: /sign in/i }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'), { timeout: 15_000 });
}

/** One file's app server, company and browser (closed together); `signIn` keeps the estimator's session in the profile. */
export interface BrowserSuite {
  server: Awaited<ReturnType<typeof startAppServer>>;
  browser: Awaited<ReturnType<typeof launchBrowser>>;
  org: TestOrg;
  close(): Promise<void>;
}

export async function startBrowserSuite(opts: { viewport: { width: number; height: number }; signIn?: boolean }): Promise<BrowserSuite> {
  const server = await startAppServer();
  const org = await createOrgWithUsers(server.ctx);
  const browser = await launchBrowser({ viewport: opts.viewport });
  if (opts.signIn) {
    const page = await browser.newPage();
    await signInThroughUi(page, server.url, org.estimator.email, org.estimator.password);
    await page.close();
  }
  return {
    server,
    browser,
    org,
    async close() {
      await browser.close();
      await server.close();
    },
  };
}

/** The real app with the demo company loaded (seedDemo) and one browser, for tests that walk the demo data. */
export async function startDemoBrowserSuite(viewport: { width: number; height: number }) {
  const app = await startAppServer();
  await seedDemo(app.ctx.deps);
  const browser = await launchBrowser({ viewport });
  return {
    app,
    browser,
    async close() {
      await browser.close();
      await app.close();
    },
  };
}
