// Saving without loss in a real browser: two tabs save the same plan (409 → the estimator keeps
// theirs or loads the other, and neither version is lost), and an underlay image is uploaded,
// calibrated by two points and locked. Screenshots in test-output/screenshots/editor-*.png.
import fs from 'node:fs';
import path from 'node:path';
import { pngImage } from '../helpers/images';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PlanRevision } from '../../server/db/models';
import { fitCamera } from '../../src/editor/geometry/coords';
import { planSchema, type Plan } from '../../shared/plan/plan-schema';
import { screenshot, startBrowserSuite, type BrowserSuite } from '../helpers/browser';
import { createJob, type TestOrg } from '../helpers/test-app';

const rect = (): Plan => planSchema.parse(JSON.parse(fs.readFileSync(path.join(__dirname, '..', '..', 'examples', 'rectangle.json'), 'utf8')));

let suite: BrowserSuite;
let server: BrowserSuite['server'];
let browser: BrowserSuite['browser'];
let org: TestOrg;

beforeAll(async () => {
  suite = await startBrowserSuite({ viewport: { width: 1366, height: 900 }, signIn: true });
  ({ server, browser, org } = suite);
}, 120_000);
afterAll(async () => suite?.close());

async function open(spaceId: string): Promise<Page> {
  const page = await browser.newPage();
  await page.goto(`${server.url}/spaces/${spaceId}/edit`);
  await page.getByTestId('net-area').waitFor();
  await page.getByRole('checkbox', { name: 'Autosave' }).uncheck();
  return page;
}

async function setField(page: Page, step: string, testId: string, value: string) {
  await page.getByTestId(`step-${step}`).click();
  await page.getByTestId(testId).fill(value);
  await page.getByTestId(testId).press('Enter');
}

async function saved(page: Page, rev: number) {
  await expect.poll(() => page.getByTestId('save-status').textContent(), { timeout: 10_000 }).toBe(`Saved · rev ${rev}`);
}

const revisionPlan = async (spaceId: string, revision: number) => planSchema.parse((await PlanRevision.findOne({ where: { spaceId, revision } }))!.plan);

describe('saving the plan from two tabs', () => {
  it('shows the conflict, keeps mine as a new revision, and loads theirs with mine one undo away', { timeout: 90_000 }, async () => {
    const { space } = await createJob(org, { plan: rect(), spaceName: 'Shared loft' });
    const a = await open(space.id);
    const b = await open(space.id);

    await setField(a, 'eaves', 'eaves-gap', '25');
    await a.getByTestId('save').click();
    await saved(a, 2);

    await setField(b, 'joists', 'joist-centres', '600');
    await b.getByTestId('save').click();
    await b.getByTestId('conflict-dialog').waitFor();
    // Same estimator in two tabs: the dialog says so, with the time and what differs.
    await expect.poll(() => b.getByTestId('conflict-dialog').locator('h2').textContent()).toBe('You saved this plan in another tab or window');
    expect(await b.getByTestId('conflict-when').textContent()).toMatch(/Revision 2 was saved at \d{1,2} \w{3} \d{4}/);
    expect(await b.getByTestId('conflict-differences').textContent()).toContain('joist centres: yours 600 mm, theirs 400 mm');
    await screenshot(b, 'editor-conflict-dialog');
    await b.getByTestId('keep-mine').click();
    await saved(b, 3);
    // Both versions are in the history: A's as revision 2, B's as revision 3.
    expect((await revisionPlan(space.id, 2)).eavesGapMm).toBe(25);
    expect((await revisionPlan(space.id, 2)).joists.centresMm).toBe(400);
    expect((await revisionPlan(space.id, 3)).joists.centresMm).toBe(600);
    expect((await revisionPlan(space.id, 3)).eavesGapMm).toBe(50);

    // A edits on top of revision 2, meets revision 3, and chooses theirs.
    await setField(a, 'layers', 'target-depth', '300');
    await a.getByTestId('save').click();
    await a.getByTestId('conflict-dialog').waitFor();
    await a.getByTestId('load-theirs').click();
    await a.getByTestId('conflict-dialog').waitFor({ state: 'detached' });
    await a.getByTestId('step-joists').click();
    await expect.poll(() => a.getByTestId('joist-centres').inputValue()).toBe('600');
    await a.keyboard.press('Control+z');
    await expect.poll(() => a.getByTestId('joist-centres').inputValue()).toBe('400');
    await a.getByTestId('step-layers').click();
    await expect.poll(() => a.getByTestId('target-depth').inputValue()).toBe('300');
    expect(await PlanRevision.count({ where: { spaceId: space.id } })).toBe(3);

    // The revision list names the author of each save.
    await a.getByTestId('revisions-button').click();
    await expect.poll(() => a.getByTestId('revisions-list').textContent()).toContain(org.estimator.name);
    await screenshot(a, 'editor-revisions');
    await a.close();
    await b.close();
  });
});

describe('leaving the editor', () => {
  it('asks before leaving with unsaved changes, and not once they are saved', { timeout: 60_000 }, async () => {
    const { space } = await createJob(org, { plan: rect(), spaceName: 'Leaving loft' });
    const page = await open(space.id);
    const asked: string[] = [];
    page.on('dialog', (d) => {
      asked.push(d.type());
      void d.dismiss(); // stay on the page
    });
    await setField(page, 'eaves', 'eaves-gap', '30');
    await expect.poll(() => page.getByTestId('save-status').textContent()).toBe('Unsaved changes');
    // A user gesture happened (typing), which Chromium requires before it shows the prompt.
    await page.close({ runBeforeUnload: true });
    await expect.poll(() => asked).toEqual(['beforeunload']);
    expect(page.isClosed()).toBe(false);

    await page.getByTestId('save').click();
    await saved(page, 2);
    await page.close({ runBeforeUnload: true });
    await expect.poll(() => page.isClosed()).toBe(true);
    expect(asked).toEqual(['beforeunload']);
  });
});

describe('background underlay', () => {
  it('uploads an image, calibrates it by two points and a typed distance, and locks it', async () => {
    const { space } = await createJob(org, { plan: rect(), spaceName: 'Traced loft' });
    const page = await open(space.id);
    // The camera was fitted to the plan at this canvas size when the page opened.
    const first = (await page.getByTestId('plan-canvas').boundingBox())!;
    const zoom = fitCamera(rect().outline, Math.floor(first.width), Math.floor(first.height)).zoom;
    await page.getByTestId('background-file').setInputFiles({ name: 'drawing.png', mimeType: 'image/png', buffer: await pngImage(400, 200) });
    await page.getByRole('button', { name: 'Calibrate' }).waitFor();
    await page.getByRole('button', { name: 'Calibrate' }).click();
    const box = (await page.getByTestId('plan-canvas').boundingBox())!;
    await page.mouse.click(box.x + 100, box.y + 100);
    await page.mouse.click(box.x + 300, box.y + 100);
    await page.getByPlaceholder('real mm').fill('2000');
    await page.getByRole('button', { name: 'Set scale' }).click();
    await page.getByRole('checkbox', { name: 'Lock' }).check();
    await screenshot(page, 'editor-underlay');
    await page.getByTestId('save').click();
    await saved(page, 2);

    const plan = await revisionPlan(space.id, 2);
    expect(plan.background?.url).toMatch(new RegExp(`^/api/spaces/${space.id}/background/[0-9a-f-]{36}\\.png$`));
    expect(plan.background?.locked).toBe(true);
    // 200 px apart on screen is 200 / zoom mm on the plan; after calibration that span is 2000 mm,
    // so mm per image pixel scales by 2000 / (200 / zoom) from the starting 10.
    expect(plan.background!.mmPerPx).toBeCloseTo(10 * (2000 / (200 / zoom)), 6);
    const img = await page.request.get(`${server.url}${plan.background!.url}`);
    expect(img.status()).toBe(200);
    await page.close();
  });
});
