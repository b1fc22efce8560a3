// The offline shell in headless chromium: the build's precache, the web app manifest, and a new
// build announced as "ready — Reload", taking over only when the user reloads, with the files the
// new build no longer lists pruned from the device.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { REPO_ROOT } from '../../server/config';
import { launchBrowser, screenshot, startAppServer } from '../helpers/browser';

const PHONE = { width: 390, height: 844 };

let distCopy: string;
let server: Awaited<ReturnType<typeof startAppServer>>;
let browser: Awaited<ReturnType<typeof launchBrowser>>;

beforeAll(async () => {
  // A copy of the build this test can change into "the next deploy" without touching dist/.
  distCopy = fs.mkdtempSync(path.join(os.tmpdir(), 'quiltline-dist-'));
  fs.cpSync(path.join(REPO_ROOT, 'dist'), distCopy, { recursive: true });
  server = await startAppServer({ DIST_DIR: distCopy });
  browser = await launchBrowser({ viewport: PHONE });
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
  if (distCopy) fs.rmSync(distCopy, { recursive: true, force: true });
});

/** The URLs (paths) in the build's precache on this device. */
function precachedPaths(page: Page): Promise<string[]> {
  return page.evaluate(async () => {
    const names = (await caches.keys()).filter((k) => k.startsWith('workbox-precache'));
    const out: string[] = [];
    for (const name of names) for (const req of await (await caches.open(name)).keys()) out.push(new URL(req.url).pathname);
    return out;
  });
}

describe('offline shell', () => {
  it('precaches the build, offers the home-screen manifest, and waits for "Reload" before a new build takes over', { timeout: 240_000 }, async () => {
    const page = await browser.newPage();
    await page.goto(`${server.url}/sign-in`);
    await page.waitForFunction(() => navigator.serviceWorker.controller !== null, undefined, { timeout: 60_000 });

    const manifest = await page.evaluate(() => fetch('/manifest.webmanifest').then((r) => r.json()));
    expect(manifest).toMatchObject({ name: 'Quiltline', display: 'standalone', start_url: '/' });
    const sizes = (manifest.icons as { sizes: string; src: string }[]).map((i) => i.sizes);
    expect(sizes).toEqual(expect.arrayContaining(['192x192', '512x512']));
    for (const icon of manifest.icons as { src: string }[]) {
      expect(await page.evaluate((src) => fetch(src).then((r) => r.headers.get('content-type')), icon.src)).toBe('image/png');
    }

    const before = await precachedPaths(page);
    expect(before).toContain('/index.html');
    expect(before).toContain('/favicon.svg');
    expect(before.some((p) => /^\/assets\/index-.*\.js$/.test(p))).toBe(true);
    expect(before.some((p) => p.endsWith('.woff'))).toBe(false);

    // The next deploy: a service worker whose manifest no longer lists the favicon.
    const swFile = path.join(distCopy, 'sw.js');
    const sw = fs.readFileSync(swFile, 'utf8');
    const next = sw.replace(/\{"revision":"[0-9a-f]+","url":"favicon\.svg"\},?/g, '');
    expect(next).not.toBe(sw);
    fs.writeFileSync(swFile, next);
    await page.evaluate(() => navigator.serviceWorker.getRegistration().then((r) => r?.update()));

    const prompt = page.getByRole('status').filter({ hasText: 'A new version of Quiltline is ready' });
    await prompt.waitFor({ timeout: 60_000 });
    await screenshot(page, 'offline-shell-update-390');
    // Until the user chooses, the old build still serves the page.
    expect(await precachedPaths(page)).toContain('/favicon.svg');

    await Promise.all([page.waitForEvent('load', { timeout: 60_000 }), prompt.getByRole('button', { name: 'Reload' }).click()]);
    await expect.poll(() => precachedPaths(page), { timeout: 60_000 }).not.toContain('/favicon.svg');
    expect(await precachedPaths(page)).toContain('/index.html');
    expect(await page.evaluate(() => navigator.serviceWorker.getRegistration().then((r) => r?.waiting ?? null))).toBeNull();
    await expect(prompt.count()).resolves.toBe(0);
    await page.close();
  });
});
