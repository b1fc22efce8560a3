// Import and export of plan files in the editor, the engine's messages drawn where they belong,
// imperial display, and the layout on a tablet. Screenshots in test-output/screenshots/.
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { planSchema } from '../../shared/plan/plan-schema';
import { validatePlan } from '../../shared/plan/validate-plan';
import { launchBrowser, screenshot, signInThroughUi, startAppServer } from '../helpers/browser';
import { createJob, createOrgWithUsers, type TestOrg } from '../helpers/test-app';

const examples = path.join(__dirname, '..', '..', 'examples');
const read = (f: string) => fs.readFileSync(path.join(examples, f));

let server: Awaited<ReturnType<typeof startAppServer>>;
let org: TestOrg;

beforeAll(async () => {
  server = await startAppServer();
  org = await createOrgWithUsers(server.ctx);
}, 120_000);
afterAll(async () => server?.close());

describe('plan files in the editor', () => {
  it('imports an invalid plan and shows the engine messages on the plan and in the panel, then exports a valid one', async () => {
    const browser = await launchBrowser({ viewport: { width: 1366, height: 900 } });
    try {
      const { space } = await createJob(org, { spaceName: 'Imported loft' });
      const page = await browser.newPage();
      await signInThroughUi(page, server.url, org.estimator.email, org.estimator.password);
      await page.goto(`${server.url}/spaces/${space.id}/edit`);
      await page.getByTestId('plan-canvas').waitFor();

      await page.getByTestId('import-file').setInputFiles({ name: 'crossed.json', mimeType: 'application/json', buffer: read('invalid-crossed-outline.json') });
      const errors = page.getByTestId('takeoff-errors');
      await errors.waitFor();
      const expected = validatePlan(JSON.parse(read('invalid-crossed-outline.json').toString()));
      expect(expected.ok).toBe(false);
      const shown = await errors.locator('li').allTextContents();
      // Every message of the engine is listed (the panel prefixes each with a warning sign).
      for (const m of expected.ok ? [] : expected.errors) expect(shown.some((s) => s.includes(m.message))).toBe(true);
      await screenshot(page, 'editor-invalid-plan');

      // Not a JSON file: a clear message, and the plan is left as it was.
      await page.getByTestId('import-file').setInputFiles({ name: 'notes.json', mimeType: 'application/json', buffer: Buffer.from('tape: 4200 x 3600') });
      await expect.poll(() => page.getByTestId('editor-error').textContent()).toMatch(/notes\.json is not a JSON file/);

      await page.getByTestId('import-file').setInputFiles({ name: 'l.json', mimeType: 'application/json', buffer: read('l-shape.json') });
      await expect.poll(() => errors.count()).toBe(0);
      await page.getByRole('combobox', { name: 'Units' }).selectOption('imperial');
      await page.getByTestId('step-review').click();
      await expect.poll(() => page.getByTestId('net-area').textContent()).toMatch(/ft²$/);
      await screenshot(page, 'editor-imperial-review');

      const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('export').click()]);
      const file = await download.path();
      const exported = JSON.parse(fs.readFileSync(file!, 'utf8'));
      expect(planSchema.parse(exported)).toEqual(planSchema.parse(JSON.parse(read('l-shape.json').toString())));
      expect(download.suggestedFilename()).toMatch(/\.quiltline\.json$/);
    } finally {
      await browser.close();
    }
  });

  it('opens read only for the installer assigned to the job, without prices or editing tools', async () => {
    const browser = await launchBrowser({ viewport: { width: 1024, height: 768 } });
    try {
      const plan = planSchema.parse(JSON.parse(read('l-shape.json').toString()));
      const { space } = await createJob(org, { spaceName: 'Installer loft', plan, assignedInstallerId: org.installer.id });
      const page = await browser.newPage();
      await signInThroughUi(page, server.url, org.installer.email, org.installer.password);
      await page.goto(`${server.url}/spaces/${space.id}/edit`);
      await page.getByTestId('net-area').waitFor();
      await page.getByText('Read only', { exact: true }).waitFor();
      expect(await page.getByTestId('save').count()).toBe(0);
      expect(await page.getByTestId('wall-run').count()).toBe(0);
      expect(await page.getByTestId('undo').count()).toBe(0);
      await screenshot(page, 'editor-installer-read-only');
    } finally {
      await browser.close();
    }
  });

  it('fits a tablet screen in landscape', async () => {
    const browser = await launchBrowser({ viewport: { width: 1024, height: 768 } });
    try {
      const { space } = await createJob(org, { spaceName: 'Tablet loft', plan: planSchema.parse(JSON.parse(read('tank-hatch-downlights.json').toString())) });
      const page = await browser.newPage();
      await signInThroughUi(page, server.url, org.estimator.email, org.estimator.password);
      await page.goto(`${server.url}/spaces/${space.id}/edit`);
      await page.getByTestId('net-area').waitFor();
      await page.getByTestId('step-exclusions').click();
      await screenshot(page, 'editor-tablet-exclusions');
      const canvas = (await page.getByTestId('plan-canvas').boundingBox())!;
      expect(canvas.width).toBeGreaterThan(500);
      expect(canvas.height).toBeGreaterThan(300);
      // The steps bar is on screen without scrolling.
      const steps = (await page.getByTestId('step-review').boundingBox())!;
      expect(steps.y + steps.height).toBeLessThanOrEqual(768);
    } finally {
      await browser.close();
    }
  });
});
