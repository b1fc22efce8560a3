// The installer's job sheet in headless chromium at 360 px: opened with signal, then used offline.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { IdempotencyKey, JobNote, JobPhoto, JobTick } from '../../server/db/models';
import { launchBrowser, screenshot, signInThroughUi, startAppServer } from '../helpers/browser';
import { createOrgWithUsers, type TestOrg } from '../helpers/test-app';
import { Job } from '../../server/db/models';
import { addDaysIso as addDays, mondayOf } from '../../shared/dates';
import { createJob } from '../helpers/test-app';
import { rotatedJpeg, scheduledJobWithTakeoff } from '../server/job-sheet-fixtures';

/** Full-page shot from the top (sticky bars are drawn where the page is scrolled to). */
async function shot(page: Page, name: string) {
  await page.evaluate(() => window.scrollTo(0, 0));
  await screenshot(page, name);
}

function acceptedJobFor(org: TestOrg) {
  return createJob(org, { stage: 'accepted', customerName: 'Robin Hale' });
}

const PHONE = { width: 360, height: 740 };

let server: Awaited<ReturnType<typeof startAppServer>>;
let browser: Awaited<ReturnType<typeof launchBrowser>>;
let org: TestOrg;

beforeAll(async () => {
  server = await startAppServer();
  org = await createOrgWithUsers(server.ctx);
  browser = await launchBrowser({ viewport: PHONE });
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

const waitingCount = (page: Page) => page.getByTestId('waiting-count').first().textContent();

describe('job sheet on a phone', () => {
  it('opens offline after one visit, queues two check ticks, a note and a photo, sends each exactly once when back online, then finishes the job', async () => {
    const { job, space } = await scheduledJobWithTakeoff(org);
    const page = await browser.newPage();
    await signInThroughUi(page, server.url, org.installer.email, org.installer.password);

    await page.goto(`${server.url}/my-jobs`);
    await page.getByRole('heading', { name: 'Today' }).waitFor();
    await shot(page, 'installer-my-jobs-360');

    await page
      .getByRole('link', { name: /Testbury/ })
      .first()
      .click();
    await page.waitForURL(`**/jobs/${job.id}/sheet`);
    await page.getByText('Saved on this device: opens without signal.').waitFor({ timeout: 20_000 });
    await page.getByRole('img', { name: /Plan of Main loft/ }).waitFor();
    await shot(page, 'job-sheet-360');
    // The folded parts: the cut list (roll by roll) and the photos.
    await page.locator('summary', { hasText: 'Cut list' }).click();
    await page.locator('summary', { hasText: 'Photos' }).click();
    await page.locator('summary', { hasText: 'Finish the job' }).click();
    await shot(page, 'job-sheet-open-360');

    // No signal: the page itself cannot reach the server, yet the sheet reloads from the service worker.
    await browser.context.setOffline(true);
    expect(
      await page.evaluate(() =>
        fetch('/api/health').then(
          () => 'reached',
          () => 'unreachable',
        ),
      ),
    ).toBe('unreachable');
    await page.reload();
    await page.getByRole('heading', { name: 'Main loft' }).waitFor();

    await page.getByTestId('tick-downlight.covers').click();
    await page.getByTestId('tick-ppe.dust').click();
    await page.getByLabel('Add a note').fill('Two downlights had no covers; fitted from the van.');
    await page.getByRole('button', { name: 'Save note' }).click();
    // An after photo from the camera, kept in IndexedDB until there is signal.
    await page.locator('summary', { hasText: 'Photos' }).click();
    await page.getByRole('radio', { name: 'After' }).click();
    await page.locator(`#photo-${space.id}`).setInputFiles({ name: 'after.jpg', mimeType: 'image/jpeg', buffer: await rotatedJpeg() });
    await expect.poll(() => waitingCount(page)).toBe('4');
    // The unsent photo is shown from this device (the page's CSP allows data: images, not blob:).
    const thumb = page.locator('figure img[alt="After photo"]').first();
    await expect.poll(() => thumb.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBeGreaterThan(0);
    await expect.poll(() => page.getByTestId('tick-ppe.dust').getAttribute('aria-pressed')).toBe('true');
    await shot(page, 'job-sheet-offline-360');
    expect(await JobTick.count({ where: { jobId: job.id } })).toBe(0);

    // Closing and reopening the app offline loses nothing.
    await page.close();
    const again = await browser.newPage();
    // Chromium 150 never tells a page opened offline that signal came back: make this page deaf to
    // 'online' so the test shows that sending does not hang on that one event.
    await again.addInitScript(() => {
      const add = window.addEventListener.bind(window);
      window.addEventListener = ((type: string, ...rest: [EventListenerOrEventListenerObject, AddEventListenerOptions?]) => {
        if (type !== 'online') add(type, ...rest);
      }) as typeof window.addEventListener;
    });
    await again.goto(`${server.url}/jobs/${job.id}/sheet`);
    await again.getByRole('heading', { name: 'Main loft' }).waitFor();
    await expect.poll(() => waitingCount(again)).toBe('4');
    expect(await again.getByTestId('notes-list').textContent()).toContain('Two downlights had no covers');

    // Signal back: the page may never hear 'online' (opened offline), so the outbox's own back-off
    // (at most 8 s between tries, RETRY_MAX_MS) or focus sends it; wait well past one full step.
    await browser.context.setOffline(false);
    await expect.poll(() => waitingCount(again), { timeout: 45_000 }).toBe('0');

    const ticks = await JobTick.findAll({ where: { jobId: job.id } });
    expect(ticks.map((t) => `${t.kind} ${t.ref} ${t.done} ${t.spaceId === space.id}`).sort()).toEqual([
      'check downlight.covers true true',
      'check ppe.dust true true',
    ]);
    const notes = await JobNote.findAll({ where: { jobId: job.id } });
    expect(notes.map((n) => n.text)).toEqual(['Two downlights had no covers; fitted from the van.']);
    expect(await JobPhoto.count({ where: { jobId: job.id, stage: 'after' } })).toBe(1);
    expect(await IdempotencyKey.count({ where: { userId: org.installer.id } })).toBe(4);

    await again.reload();
    await again.getByRole('heading', { name: 'Main loft' }).waitFor();
    await expect.poll(() => again.getByTestId(`checks-${space.id}`).locator('summary').textContent()).toMatch(/2\/\d+/);
    await shot(again, 'job-sheet-synced-360');

    // Tick the remaining checks and mark the job installed from the phone.
    const unticked = again.locator('[data-testid^="tick-"][aria-pressed="false"]');
    for (let left = await unticked.count(); left > 0; left--) {
      await unticked.first().click();
      await expect.poll(() => unticked.count(), { timeout: 15_000 }).toBe(left - 1);
    }
    await expect.poll(() => waitingCount(again), { timeout: 20_000 }).toBe('0');
    await again.locator('summary', { hasText: 'Finish the job' }).click();
    await again.getByRole('button', { name: 'Mark installed' }).click();
    await again.getByText(/Marked installed by/).waitFor({ timeout: 20_000 });
    expect((await Job.findByPk(job.id))!.stage).toBe('installed');
    await shot(again, 'job-sheet-installed-360');
    await again.close();
  }, 120_000);

  it('shows the office the week with the booked job', async () => {
    const { job } = await scheduledJobWithTakeoff(org);
    await Job.update({ installDate: addDays(mondayOf(new Date().toISOString().slice(0, 10)), 1) }, { where: { id: job.id } });
    await acceptedJobFor(org);
    // A browser of its own: the installer's session lives in the other one.
    const office = await launchBrowser({ viewport: PHONE });
    try {
      const page = await office.newPage();
      await signInThroughUi(page, server.url, org.office.email, org.office.password);
      await page.goto(`${server.url}/schedule`);
      await page.getByRole('heading', { name: 'Schedule' }).waitFor();
      await page.getByText(job.reference).first().waitFor();
      await page.getByRole('button', { name: 'Book' }).first().waitFor();
      await shot(page, 'schedule-360');
      await page.setViewportSize({ width: 1280, height: 800 });
      await page.getByRole('table').waitFor();
      await shot(page, 'schedule-1280');
    } finally {
      await office.close();
    }
  });
});
