// The editor's heat-loss panel at 1440 px with the company's catalogue (the demo products): the
// existing layer's condition, the whole-ceiling U beside the insulated-area U and the RdSAP default,
// each named, and which figure the target is judged on. Screenshot: test-output/screenshots/editor-thermal-1440.png.
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { planSchema, type Plan } from '../../shared/plan/plan-schema';
import { launchBrowser, screenshot, signInThroughUi, startAppServer } from '../helpers/browser';
import { seedDemoCatalogue } from '../../server/modules/settings/settings.service';
import { createJob, createOrgWithUsers, type TestOrg } from '../helpers/test-app';

const example = (f: string): Plan => planSchema.parse(JSON.parse(fs.readFileSync(path.join(__dirname, '..', '..', 'examples', f), 'utf8')));

let server: Awaited<ReturnType<typeof startAppServer>>;
let org: TestOrg;

beforeAll(async () => {
  server = await startAppServer();
  org = await createOrgWithUsers(server.ctx);
  await seedDemoCatalogue(org.id);
}, 120_000);
afterAll(async () => server?.close());

describe('editor heat-loss panel', () => {
  it('gives a typed existing depth a condition and shows the whole-ceiling U beside the insulated area and RdSAP', { timeout: 90_000 }, async () => {
    // Hatch, tank and downlights, an empty loft to start with, a U-value target.
    const plan: Plan = { ...example('tank-hatch-downlights.json'), existing: { depthMm: 0, condition: 'none' }, target: { uValue: 0.16 } };
    const { space } = await createJob(org, { plan, spaceName: 'Heat-loss loft' });
    const browser = await launchBrowser({ viewport: { width: 1440, height: 900 } });
    try {
      const page = await browser.newPage();
      await signInThroughUi(page, server.url, org.estimator.email, org.estimator.password);
      await page.goto(`${server.url}/spaces/${space.id}/edit`);
      await page.getByTestId('plan-canvas').waitFor();
      await page.getByRole('checkbox', { name: 'Autosave' }).uncheck();
      await page.getByTestId('step-layers').click();
      expect(await page.getByTestId('existing-condition').inputValue()).toBe('none');

      // Typing a depth never leaves it at "none" (which would count it as nothing): it becomes "good".
      await page.getByTestId('existing-depth').fill('100');
      await page.getByTestId('existing-depth').press('Enter');
      await expect.poll(() => page.getByTestId('existing-condition').inputValue()).toBe('good');
      await expect.poll(() => page.getByTestId('existing-condition-row').textContent()).toBe('100 mm good');
      // 100 mm good: RdSAP 2012 Table S9 gives 0.40 before.
      await expect.poll(() => page.getByTestId('u-rdsap').textContent()).toMatch(/^0\.40 → /);

      const pair = async (id: string) => (await page.getByTestId(id).textContent())!.split(' → ').map(Number);
      const [insBefore, insAfter] = await pair('u-insulated');
      const [wholeBefore, wholeAfter] = await pair('u-whole');
      // The hatch, tank and downlight footprints stay worse than the insulated area, before and after.
      expect(wholeBefore).toBeGreaterThan(insBefore);
      expect(wholeAfter).toBeGreaterThan(insAfter);
      expect(await page.getByTestId('target-row').textContent()).toMatch(/^U 0\.16 (met|not met), judged on the whole ceiling$/);
      // The panel scrolled to the heat-loss rows, for the screenshot a person looks at.
      await page.getByTestId('u-whole').scrollIntoViewIfNeeded();
      await screenshot(page, 'editor-thermal-1440');
    } finally {
      await browser.close();
    }
  });

  it('takes the eaves mode the office sets on the settings page for a plan that does not choose, and names it in the editor', { timeout: 90_000 }, async () => {
    // examples/eaves-two-sides.json: two 10,200 mm eaves edges, joists (and so rafters) at 600 mm, no eaves mode of its own.
    const { space } = await createJob(org, { plan: example('eaves-two-sides.json'), spaceName: 'Eaves loft' });
    const browser = await launchBrowser({ viewport: { width: 1440, height: 900 } });
    try {
      const page = await browser.newPage();
      await signInThroughUi(page, server.url, org.office.email, org.office.password);
      await page.goto(`${server.url}/settings`);
      await page.getByRole('tab', { name: 'Labour, waste, eaves, savings' }).click();
      await page.getByLabel('Eaves, on plans that do not choose').selectOption('ventilators');
      await page.getByRole('button', { name: 'Save settings' }).click();
      await page.getByText('Settings saved.').waitFor();
      await page.getByText('Eaves and hatch').scrollIntoViewIfNeeded();
      await screenshot(page, 'settings-eaves-hatch-1440');

      await page.goto(`${server.url}/spaces/${space.id}/edit`);
      await page.getByTestId('plan-canvas').waitFor();
      await page.getByRole('checkbox', { name: 'Autosave' }).uncheck();
      await page.getByTestId('step-eaves').click();
      expect(await page.getByTestId('eaves-mode').inputValue()).toBe('');
      expect(await page.getByTestId('eaves-mode').locator('option[value=""]').textContent()).toBe('company default (eaves ventilators)');
      // No gap to set with ventilators; ⌈10,200 / 600⌉ = 17 per edge × 2 edges = 34 ventilators.
      expect(await page.getByTestId('eaves-gap').count()).toBe(0);
      await expect.poll(() => page.getByTestId('eaves-ventilators').textContent()).toBe('34');
    } finally {
      await browser.close();
    }
  });
});
