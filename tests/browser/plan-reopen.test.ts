// Save, go to the job, open the plan again in the same tab: the plan shown is the revision just
// saved, the job page says so with its time, and the next save raises no conflict against one's
// own save; the same after restoring an old revision. Screenshots in test-output/screenshots/plan-reopen-*.png.
import fs from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PlanRevision } from '../../server/db/models';
import { planSchema, type Plan } from '../../shared/plan/plan-schema';
import { launchBrowser, screenshot, signInThroughUi, startBrowserSuite, type BrowserSuite } from '../helpers/browser';
import { seedDemoCatalogue } from '../../server/modules/settings/settings.service';
import { readStoredTakeoff } from '../../shared/takeoff/takeoff-schema';
import { createJob, type TestOrg } from '../helpers/test-app';

const rect = (): Plan => planSchema.parse(JSON.parse(fs.readFileSync(path.join(__dirname, '..', '..', 'examples', 'rectangle.json'), 'utf8')));

let suite: BrowserSuite;
let server: BrowserSuite['server'];
let browser: BrowserSuite['browser'];
let org: TestOrg;

beforeAll(async () => {
  suite = await startBrowserSuite({ viewport: { width: 1440, height: 900 }, signIn: true });
  ({ server, browser, org } = suite);
}, 120_000);
afterAll(async () => suite?.close());

async function setField(page: Page, step: string, testId: string, value: string) {
  await page.getByTestId(`step-${step}`).click();
  await page.getByTestId(testId).fill(value);
  await page.getByTestId(testId).press('Enter');
}

const status = (page: Page) => page.getByTestId('save-status').textContent();

/** From the job page, through its link, into the editor (client-side navigation: the same tab and query cache). */
async function openPlanFromJob(page: Page) {
  await page.getByRole('link', { name: /open plan/i }).click();
  await page.getByTestId('net-area').waitFor();
}

async function backToJob(page: Page, reference: string) {
  await page.getByRole('link', { name: `Job ${reference}` }).click();
  await page.getByRole('link', { name: /open plan/i }).waitFor();
}

describe('reopening a saved plan in the same tab', () => {
  it('shows the saved revision on the job page and in the editor, and saves on top of it without a conflict', { timeout: 120_000 }, async () => {
    const { job, space } = await createJob(org, { plan: rect(), spaceName: 'Main loft' });
    const page = await browser.newPage();
    await page.goto(`${server.url}/jobs/${job.id}`);
    await openPlanFromJob(page);
    await page.getByRole('checkbox', { name: 'Autosave' }).uncheck();

    // Save revision 2, go to the job, come back.
    await setField(page, 'eaves', 'eaves-gap', '25');
    await page.getByTestId('save').click();
    await expect.poll(() => status(page), { timeout: 10_000 }).toBe('Saved · rev 2');
    await backToJob(page, job.reference);
    const rev2 = (await PlanRevision.findOne({ where: { spaceId: space.id, revision: 2 } }))!;
    const spaceLine = page.getByText(/revision \d+ · saved/);
    const savedAt = rev2.createdAt.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' });
    await expect.poll(() => spaceLine.textContent(), { timeout: 10_000 }).toMatch(new RegExp(`^revision 2 · saved .*${savedAt}`));
    await screenshot(page, 'plan-reopen-job-page');

    await openPlanFromJob(page);
    await page.getByTestId('step-eaves').click();
    await expect.poll(() => page.getByTestId('eaves-gap').inputValue()).toBe('25');
    expect(await status(page)).toBe('Saved · rev 2');

    // The first edit after reopening saves as revision 3: no conflict with one's own revision 2.
    await page.getByRole('checkbox', { name: 'Autosave' }).uncheck();
    await setField(page, 'joists', 'joist-centres', '600');
    await page.getByTestId('save').click();
    await expect.poll(() => status(page), { timeout: 10_000 }).toBe('Saved · rev 3');
    expect(await page.getByTestId('conflict-dialog').count()).toBe(0);

    // Restore revision 1 (a new revision 4), go to the job and back: revision 4 is what opens.
    await page.getByTestId('revisions-button').click();
    await page.getByTestId('revisions-list').getByRole('listitem').filter({ hasText: '#1' }).getByRole('button', { name: 'Restore' }).click();
    await expect.poll(() => status(page), { timeout: 10_000 }).toBe('Saved · rev 4');
    await backToJob(page, job.reference);
    await expect.poll(() => spaceLine.textContent(), { timeout: 10_000 }).toMatch(/^revision 4 · saved /);
    await openPlanFromJob(page);
    await page.getByTestId('step-eaves').click();
    await expect.poll(() => page.getByTestId('eaves-gap').inputValue()).toBe('50');
    await page.getByRole('checkbox', { name: 'Autosave' }).uncheck();
    await setField(page, 'eaves', 'eaves-gap', '30');
    await page.getByTestId('save').click();
    await expect.poll(() => status(page), { timeout: 10_000 }).toBe('Saved · rev 5');
    expect(await page.getByTestId('conflict-dialog').count()).toBe(0);
    await screenshot(page, 'plan-reopen-editor');
    expect(await PlanRevision.count({ where: { spaceId: space.id } })).toBe(5);
    await page.close();
  });

  it('offers Save for a saved plan whose takeoff was never stored, and stores it', { timeout: 60_000 }, async () => {
    const { job, space } = await createJob(org, { plan: rect(), spaceName: 'Old loft' });
    await PlanRevision.update({ takeoff: null }, { where: { spaceId: space.id } });
    const page = await browser.newPage();
    await page.goto(`${server.url}/jobs/${job.id}`);
    await openPlanFromJob(page);
    await page.getByRole('checkbox', { name: 'Autosave' }).uncheck();
    await expect.poll(() => page.getByTestId('save').isEnabled()).toBe(true);
    await page.getByTestId('save').click();
    await expect.poll(() => status(page), { timeout: 10_000 }).toBe('Saved · rev 2');
    expect((await PlanRevision.findOne({ where: { spaceId: space.id, revision: 2 } }))!.takeoff).not.toBeNull();
    await expect.poll(() => page.getByTestId('save').isEnabled()).toBe(false);
    await page.close();
  });

  it("shows an installer the stored takeoff in the read-only editor, the office's product choice and no prices", { timeout: 90_000 }, async () => {
    await seedDemoCatalogue(org.id);
    const { space } = await createJob(org, { plan: rect(), spaceName: 'Assigned loft', stage: 'scheduled', assignedInstallerId: org.installer.id });
    const stored = readStoredTakeoff((await PlanRevision.findOne({ where: { spaceId: space.id } }))!.takeoff)!;
    expect(stored.layers.length).toBeGreaterThan(0);
    const other = await launchBrowser({ viewport: { width: 1440, height: 900 } });
    try {
      const page = await other.newPage();
      await signInThroughUi(page, server.url, org.installer.email, org.installer.password);
      await page.goto(`${server.url}/spaces/${space.id}/edit`);
      await expect.poll(() => page.getByTestId('net-area').textContent(), { timeout: 20_000 }).toBe(`${stored.netAreaM2.toFixed(2)} m²`);
      await page.getByText('Read only', { exact: true }).waitFor();
      await page.getByTestId('step-layers').click();
      for (const l of stored.layers) await page.getByText(l.productName).first().waitFor();
      expect(await page.getByText(/£\s?[1-9]/).count()).toBe(0);
      await screenshot(page, 'plan-reopen-installer-read-only');
    } finally {
      await other.close();
    }
  });
});
