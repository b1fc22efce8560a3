// The editor's screen in headless chromium at 1440, 1024 and 390 px: the canvas fills the space
// beside the panel, the toolbar stays one row from 1024 px whatever the save status says (the canvas must not
// move under the pointer), a blank plan opens at a sensible zoom, and the scale bar and cursor
// read-out are there. Screenshots in test-output/screenshots/editor-layout-*.png.
import fs from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fitCamera, world, worldToScreen } from '../../src/editor/geometry/coords';
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
  await seedDemoCatalogue(org.id); // so the layers step has strips to number
}, 120_000);
afterAll(async () => server?.close());

async function withPage<T>(viewport: { width: number; height: number }, fn: (page: Page) => Promise<T>): Promise<T> {
  const browser = await launchBrowser({ viewport });
  try {
    const page = await browser.newPage();
    await signInThroughUi(page, server.url, org.estimator.email, org.estimator.password);
    return await fn(page);
  } finally {
    await browser.close();
  }
}

async function open(page: Page, spaceId: string) {
  await page.goto(`${server.url}/spaces/${spaceId}/edit`);
  await page.getByTestId('plan-canvas').waitFor();
  await page.getByTestId('net-area').waitFor();
}

const box = async (page: Page, testId: string) => (await page.getByTestId(testId).boundingBox())!;
const status = (page: Page) => page.getByTestId('save-status').textContent();

describe('editor layout', () => {
  it('at 1440 × 900 the canvas fills the space beside the panel and stays put while the save status changes', { timeout: 90_000 }, async () => {
    const { space } = await createJob(org, { plan: example('l-shape.json'), spaceName: 'Steady loft' });
    await withPage({ width: 1440, height: 900 }, async (page) => {
      await open(page, space.id);
      await page.getByRole('checkbox', { name: 'Autosave' }).uncheck();
      await page.getByTestId('step-eaves').click();
      const canvas = await box(page, 'plan-canvas');
      const toolbar = await box(page, 'editor-toolbar');
      // Full width less the 320 px panel, and most of the height (was 800 × 529 in a boxed page).
      expect(canvas.width).toBeGreaterThanOrEqual(1440 - 320 - 1);
      expect(canvas.height).toBeGreaterThanOrEqual(600);
      expect(toolbar.height).toBeLessThanOrEqual(49); // one row

      const steady = async (why: string) => {
        expect(await box(page, 'plan-canvas'), why).toEqual(canvas);
        expect(await box(page, 'editor-toolbar'), why).toEqual(toolbar);
      };
      await page.getByTestId('eaves-gap').fill('40');
      await page.getByTestId('eaves-gap').press('Enter');
      await expect.poll(() => status(page)).toBe('Unsaved changes');
      await steady('unsaved');

      // The server refuses the save: "Not saved" and the reason over the canvas, nothing moves.
      await page.route('**/api/spaces/*/plan', (route) =>
        route.request().method() === 'PUT'
          ? route.fulfill({
              status: 422,
              contentType: 'application/json',
              body: JSON.stringify({ error: { code: 'invalid', message: 'the plan was refused for a test' } }),
            })
          : route.continue(),
      );
      await page.getByTestId('save').click();
      await expect.poll(() => status(page)).toBe('Not saved');
      await expect.poll(() => page.getByTestId('save-error').textContent()).toContain('refused for a test');
      await steady('not saved');
      await screenshot(page, 'editor-layout-1440-save-refused');
      await page.unroute('**/api/spaces/*/plan');

      // Changing the plan (the fix) clears the refusal; the next save goes through.
      await page.getByTestId('eaves-gap').fill('45');
      await page.getByTestId('eaves-gap').press('Enter');
      await expect.poll(() => page.getByTestId('save-error').count()).toBe(0);
      await expect.poll(() => status(page)).toBe('Unsaved changes');
      await page.getByTestId('save').click();
      await expect.poll(() => status(page), { timeout: 10_000 }).toBe('Saved · rev 2');
      await steady('saved');
    });
  });

  it("a refused number goes back to the plan's value and says why beside the field it was typed in", async () => {
    const { space } = await createJob(org, { plan: example('l-shape.json'), spaceName: 'Centres loft' });
    await withPage({ width: 1440, height: 900 }, async (page) => {
      await open(page, space.id);
      await page.getByTestId('step-joists').click();
      const before = await page.getByTestId('joist-centres').inputValue();
      await page.getByTestId('joist-centres').fill('40');
      await page.getByTestId('joist-centres').press('Enter');
      await expect
        .poll(() => page.getByTestId('joist-centres-error').textContent())
        .toMatch(/^Other centres: joist centres of 40 mm must be more than the joist width/);
      expect(await page.getByTestId('joist-centres').inputValue()).toBe(before);
      expect(await page.getByTestId('undo').isDisabled()).toBe(true); // the plan did not change
      await screenshot(page, 'editor-layout-refused-number');
    });
  });

  it('at 1024 × 768 with an exclusion selected the canvas keeps most of the screen', async () => {
    const { space } = await createJob(org, { plan: example('l-shape.json'), spaceName: 'Tablet loft' });
    await withPage({ width: 1024, height: 768 }, async (page) => {
      await open(page, space.id);
      await page.getByTestId('step-exclusions').click();
      // Select the hatch: press on it (the example's only rectangle exclusion).
      const plan = example('l-shape.json');
      const ex = plan.exclusions.find((e) => e.polygon)!;
      const cx = ex.polygon!.reduce((a, p) => a + p[0], 0) / ex.polygon!.length;
      const cy = ex.polygon!.reduce((a, p) => a + p[1], 0) / ex.polygon!.length;
      const c = await box(page, 'plan-canvas');
      const cam = fitCamera(plan.outline, Math.floor(c.width), Math.floor(c.height));
      const s = worldToScreen(cam, world(cx, cy));
      await page.mouse.click(c.x + s.x, c.y + s.y);
      await page.getByTestId('exclusion-label').waitFor();
      const canvas = await box(page, 'plan-canvas');
      expect(canvas.width).toBeGreaterThanOrEqual(1024 - 320 - 1); // was 672
      expect(canvas.height).toBeGreaterThanOrEqual(420); // was 317
      await screenshot(page, 'editor-layout-1024-exclusion-selected');

      // Dragging empty paper pans: nothing is drawn, nothing to undo.
      await page.mouse.move(c.x + c.width - 40, c.y + 40);
      await page.mouse.down();
      await page.mouse.move(c.x + c.width - 140, c.y + 90, { steps: 5 });
      await page.mouse.up();
      expect(await page.getByTestId('undo').isDisabled()).toBe(true);
      expect(await status(page)).toBe('Saved · rev 1');
    });
  });

  it('a blank plan opens showing a 12 × 9 m sheet, with a scale bar and a cursor read-out in the display units', async () => {
    const { space } = await createJob(org, { spaceName: 'Blank loft' });
    await withPage({ width: 1440, height: 900 }, async (page) => {
      await page.goto(`${server.url}/spaces/${space.id}/edit`);
      await page.getByTestId('plan-canvas').waitFor();
      const c = await box(page, 'plan-canvas');
      await page.mouse.move(c.x + c.width - 2, c.y + c.height - 2);
      const read = async () => (await page.getByTestId('cursor-readout').textContent())!;
      await expect.poll(read).toMatch(/^x \d+ mm {2}y \d+ mm$/);
      const [x, y] = [...(await read()).matchAll(/(\d+) mm/g)].map((m) => Number(m[1]));
      // The far corner of the view is past the sheet but not absurdly far (a sensible zoom).
      expect(x >= 12_000 || y >= 9_000).toBe(true);
      expect(Math.max(x, y)).toBeLessThan(30_000);
      const bar = page.getByTestId('scale-bar');
      expect(Number(await bar.getAttribute('data-mm'))).toBeGreaterThanOrEqual(500);
      await screenshot(page, 'editor-layout-1440-blank');
      await page.getByRole('combobox', { name: 'Units' }).selectOption('imperial');
      await page.mouse.move(c.x + c.width / 2, c.y + c.height / 2);
      await expect.poll(read).toMatch(/^x \d+′ \d+.*″ {2}y \d+′ \d+.*″$/);
      await expect.poll(() => bar.textContent()).toMatch(/^\d+ ft$/);
    });
  });

  it('keeps the save status and Save on the screen at 1024, 820 (an upright tablet) and 390 px', { timeout: 150_000 }, async () => {
    const { space } = await createJob(org, { plan: example('l-shape.json'), spaceName: 'Narrow loft' });
    for (const [w, h] of [
      [1024, 768],
      [820, 1180],
      [390, 844],
    ]) {
      await withPage({ width: w, height: h }, async (page) => {
        await open(page, space.id);
        const why = `at ${w} px`;
        expect(await page.evaluate(() => document.documentElement.scrollWidth), why).toBeLessThanOrEqual(w);
        for (const id of ['save-status', 'save', 'undo', 'fit']) {
          const b = await box(page, id);
          expect(b.x, `${id} ${why}`).toBeGreaterThanOrEqual(0);
          expect(b.x + b.width, `${id} ${why}`).toBeLessThanOrEqual(w);
        }
        await screenshot(page, `editor-layout-${w}-toolbar`);
      });
    }
  });

  it('screenshots at 1440, 1024 and 390 px', { timeout: 150_000 }, async () => {
    const { space } = await createJob(org, { plan: example('l-shape.json'), spaceName: 'Layout loft' });
    // Every kind of exclusion, two of them small, for a person to check they read apart and keep labels.
    const sq = (x: number, y: number, s: number): [number, number][] => [
      [x, y],
      [x + s, y],
      [x + s, y + s],
      [x, y + s],
    ];
    const kinds = planSchema.parse({
      ...example('rectangle.json'),
      exclusions: [
        { kind: 'hatch', polygon: sq(600, 600, 700) },
        { kind: 'tank', label: 'cold water tank', polygon: sq(1800, 600, 1200) },
        { kind: 'chimney', polygon: sq(3600, 600, 900) },
        { kind: 'flue', label: 'boiler flue', polygon: sq(5200, 700, 150) },
        {
          kind: 'boarded',
          label: 'boarded walkway',
          polygon: [
            [600, 2600],
            [4000, 2600],
            [4000, 3200],
            [600, 3200],
          ],
        },
        { kind: 'other', label: 'aerial cable', polygon: sq(5000, 2600, 250) },
        { kind: 'downlight', label: 'landing light', at: [6500, 1500] },
      ],
    });
    const kindsJob = await createJob(org, { plan: kinds, spaceName: 'Kinds loft' });
    await withPage({ width: 1440, height: 900 }, async (page) => {
      await open(page, kindsJob.space.id);
      await page.getByTestId('step-exclusions').click();
      await screenshot(page, 'editor-layout-1440-exclusion-kinds');
    });
    for (const [w, h] of [
      [1440, 900],
      [1024, 768],
      [390, 844],
    ]) {
      await withPage({ width: w, height: h }, async (page) => {
        await open(page, space.id);
        await screenshot(page, `editor-layout-${w}`);
        for (const step of ['joists', 'exclusions', 'layers', 'review']) {
          await page.getByTestId(`step-${step}`).click();
          await screenshot(page, `editor-layout-${w}-${step}`);
        }
      });
    }
  });
});
