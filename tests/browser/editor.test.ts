// The plan editor in headless chromium: an L-shaped loft typed by measurements, a tank, joists;
// the panel's net area against the engine's own result; undo/redo; unsaved edits after a reload.
// Screenshots go to test-output/screenshots/editor-*.png for a person to look at.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fitCamera, world, worldToScreen } from '../../src/editor/geometry/coords';
import { planSchema, type Plan } from '../../shared/plan/plan-schema';
import { computeTakeoff } from '../../shared/takeoff/compute-takeoff';
import { parseProductCatalogue } from '../../shared/takeoff/products';
import { screenshot, signInThroughUi, startBrowserSuite, type BrowserSuite } from '../helpers/browser';
import { createJob, type TestOrg } from '../helpers/test-app';

const L_WALLS = '6000 right, 3000 down, 2500 left, 2000 down, 3500 left, 5000 up';

let suite: BrowserSuite;
let server: BrowserSuite['server'];
let browser: BrowserSuite['browser'];
let org: TestOrg;

beforeAll(async () => {
  suite = await startBrowserSuite({ viewport: { width: 1366, height: 900 } });
  ({ server, browser, org } = suite);
}, 120_000);
afterAll(async () => suite?.close());

async function openEditor(spaceId: string): Promise<Page> {
  const page = await browser.newPage();
  await browser.context.clearCookies();
  await signInThroughUi(page, server.url, org.estimator.email, org.estimator.password);
  await page.goto(`${server.url}/spaces/${spaceId}/edit`);
  await page.getByTestId('plan-canvas').waitFor();
  return page;
}

/** Screen position (page px) of a plan point, from the canvas box and the editor's fit rule. */
async function toPage(page: Page, outline: [number, number][], p: [number, number]) {
  const box = (await page.getByTestId('plan-canvas').boundingBox())!;
  const cam = fitCamera(outline, Math.floor(box.width), Math.floor(box.height));
  const s = worldToScreen(cam, world(p[0], p[1]));
  return { x: box.x + s.x, y: box.y + s.y };
}

async function typeLoft(page: Page) {
  await page.getByTestId('wall-run').fill(L_WALLS);
  await expect.poll(() => page.getByTestId('wall-run-preview').textContent()).toMatch(/6 corners; closes with 0 mm closing error/);
  await page.getByTestId('wall-run-apply').click();
  // A tank in the top-left arm of the L, drawn as a rectangle by clicking two opposite corners.
  await page.getByTestId('step-exclusions').click();
  await page.getByTestId('kind-tank').click();
  await page.keyboard.press('f'); // fit to this step's canvas size, which toPage assumes
  const outline: [number, number][] = [
    [0, 0],
    [6000, 0],
    [6000, 3000],
    [3500, 3000],
    [3500, 5000],
    [0, 5000],
  ];
  const a = await toPage(page, outline, [1000, 1000]);
  const b = await toPage(page, outline, [2200, 1900]);
  await page.mouse.click(a.x, a.y);
  await page.mouse.move(b.x, b.y, { steps: 4 });
  await page.mouse.click(b.x, b.y);
  // Joists at 600 mm centres, running along the x axis.
  await page.getByTestId('step-joists').click();
  await page.getByTestId('centres-600').click();
  await page.getByTestId('joist-angle').fill('0');
  await page.getByTestId('joist-angle').press('Enter');
}

/** The unsaved draft the editor keeps in localStorage (written 200 ms after the last change). */
async function draftPlan(page: Page, spaceId: string): Promise<Plan | null> {
  const raw = await page.evaluate((k) => localStorage.getItem(k), `quiltline.plan-draft.${spaceId}`);
  return raw ? (JSON.parse(raw).plan as Plan) : null;
}

/** The draft once it holds every edit typeLoft made (the tank, 600 mm centres, joists at 0°). */
async function typedDraft(page: Page, spaceId: string): Promise<Plan> {
  await expect
    .poll(async () => {
      const d = await draftPlan(page, spaceId);
      return d ? { exclusions: d.exclusions.length, centresMm: d.joists.centresMm, angleDeg: d.joists.angleDeg } : null;
    })
    .toEqual({ exclusions: 1, centresMm: 600, angleDeg: 0 });
  return (await draftPlan(page, spaceId))!;
}

describe('plan editor in a browser', () => {
  it('types an L-shaped loft, adds a tank and joists, and shows the net area the engine computes', async () => {
    const { space } = await createJob(org, { spaceName: 'L loft' });
    const page = await openEditor(space.id);
    await typeLoft(page);
    await page.getByTestId('step-review').click();
    await page.getByTestId('net-area').waitFor();
    await screenshot(page, 'editor-l-shape-review');
    const shown = (await page.getByTestId('net-area').textContent())!;

    await page.getByTestId('save').click();
    await expect.poll(() => page.getByTestId('save-status').textContent(), { timeout: 10_000 }).toMatch(/Saved · rev 1/);
    const res = await page.request.get(`${server.url}/api/spaces/${space.id}/plan`);
    const body = await res.json();
    const plan = planSchema.parse(body.plan);
    expect(plan.outline).toEqual([
      [0, 0],
      [6000, 0],
      [6000, 3000],
      [3500, 3000],
      [3500, 5000],
      [0, 5000],
    ]);
    expect(plan.exclusions).toEqual([
      {
        kind: 'tank',
        polygon: [
          [1000, 1000],
          [2200, 1000],
          [2200, 1900],
          [1000, 1900],
        ],
      },
    ]);
    expect(plan.joists).toMatchObject({ angleDeg: 0, centresMm: 600 });
    // The engine on the saved plan, with the same catalogue and settings the page was given.
    const t = computeTakeoff(plan, { products: parseProductCatalogue(body.takeoffInputs.products), settings: body.takeoffInputs.settings });
    expect(shown).toBe(`${t.netAreaM2.toFixed(2)} m²`);
    // L: 6 × 3 + 3.5 × 2 = 25 m², less the 1.2 × 0.9 m tank and its clearance (if any).
    expect(t.grossAreaM2).toBeCloseTo(25, 6);
    expect(t.netAreaM2).toBeLessThan(25 - 1.08 + 1e-6);

    await page.getByTestId('step-layers').click();
    await screenshot(page, 'editor-l-shape-layers');
    await page.getByTestId('step-exclusions').click();
    await screenshot(page, 'editor-l-shape-exclusions');
    await page.close();
  });

  it('undoes back to the saved plan and redoes to the same edited plan', async () => {
    const { space } = await createJob(org, { spaceName: 'Undo loft' });
    const page = await openEditor(space.id);
    await page.getByRole('checkbox', { name: 'Autosave' }).uncheck();
    await typeLoft(page);
    const edited = await typedDraft(page, space.id);
    expect(edited?.exclusions).toHaveLength(1);
    await page
      .getByTestId('plan-canvas')
      .click({ position: { x: 5, y: 5 } })
      .catch(() => undefined);

    // typed walls, tank, centres, angle: four steps back to the empty starting plan.
    for (let i = 0; i < 4; i++) await page.keyboard.press('Control+z');
    await expect.poll(() => draftPlan(page, space.id)).toBeNull(); // back to the loaded plan: nothing unsaved
    expect(await page.getByTestId('undo').isDisabled()).toBe(true);
    await screenshot(page, 'editor-undo-all');

    await page.keyboard.press('Control+Shift+z');
    await page.keyboard.press('Control+y');
    await page.getByTestId('redo').click();
    await page.getByTestId('redo').click();
    await expect.poll(() => draftPlan(page, space.id)).toEqual(edited);
    expect(await page.getByTestId('redo').isDisabled()).toBe(true);
    await page.close();
  });

  it('offers unsaved edits back after a reload', async () => {
    const { space } = await createJob(org, { spaceName: 'Reload loft' });
    const page = await openEditor(space.id);
    await page.getByRole('checkbox', { name: 'Autosave' }).uncheck();
    await typeLoft(page);
    const before = await typedDraft(page, space.id);
    const area = await page.getByTestId('net-area').textContent();

    await page.reload();
    await page.getByTestId('draft-banner').waitFor();
    await screenshot(page, 'editor-draft-banner');
    await page.getByTestId('recover-draft').click();
    await expect.poll(() => page.getByTestId('net-area').textContent()).toBe(area);
    await expect.poll(() => draftPlan(page, space.id)).toEqual(before);
    // Nothing was saved behind the estimator's back.
    const res = await page.request.get(`${server.url}/api/spaces/${space.id}/plan`);
    expect((await res.json()).revision).toBe(0);
    await page.close();
  });
});
