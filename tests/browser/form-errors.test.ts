// A form's field errors in a real browser: the client's own check (the API's zod schema, through
// react-hook-form) names each empty field beside it, and a value only the server can refuse (an
// e-mail address already in use) comes back as a 409 naming the field and is shown in place.
import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../server/db/seeders/demo';
import { screenshot, signInThroughUi, startDemoBrowserSuite } from '../helpers/browser';

let suite: Awaited<ReturnType<typeof startDemoBrowserSuite>>;
let app: typeof suite.app;
let browser: typeof suite.browser;

beforeAll(async () => {
  suite = await startDemoBrowserSuite({ width: 1280, height: 860 });
  ({ app, browser } = suite);
}, 120_000);
afterAll(async () => {
  await suite?.close();
});

/** The text of the message the control points at with aria-describedby, once it is marked invalid. */
async function messageOf(page: Page, control: Locator): Promise<string> {
  await expect.poll(() => control.getAttribute('aria-invalid'), { timeout: 10_000 }).toBe('true');
  const id = (await control.getAttribute('aria-describedby'))!.split(' ')[0];
  return (await page.locator(`[id="${id}"]`).textContent()) ?? '';
}

describe('form field errors in a real browser', () => {
  it('names the empty fields of the invitation form, then shows the server’s refusal on the e-mail field', async () => {
    await browser.context.clearCookies();
    const page = await browser.newPage();
    page.setDefaultTimeout(10_000);
    await signInThroughUi(page, app.url, 'office@demo.example.com', DEMO_PASSWORD);
    await page.goto(`${app.url}/users`);
    await page.getByRole('button', { name: 'Invite a colleague' }).click();
    const form = page.getByRole('form', { name: 'Invite a colleague' });
    const name = form.getByLabel('Name');
    const email = form.getByLabel('E-mail');

    await form.getByRole('button', { name: 'Send invitation' }).click();
    expect(await messageOf(page, name)).toBe('enter a name');
    expect(await messageOf(page, email)).toBe('enter a valid e-mail address');
    // The message sits beside its field, under it in the same column.
    const [nameBox, messageBox] = await Promise.all([name.boundingBox(), form.getByText('enter a name').boundingBox()]);
    expect(Math.abs(messageBox!.x - nameBox!.x)).toBeLessThan(2);
    expect(messageBox!.y).toBeGreaterThan(nameBox!.y);
    await screenshot(page, 'form-errors-invite-empty-1280');

    // Typing a name clears its message; an address the company already uses passes the client's check and the server refuses it.
    await name.fill('Second Estimator');
    await expect.poll(() => name.getAttribute('aria-invalid')).toBeNull();
    await email.fill('estimator@demo.example.com');
    await form.getByRole('button', { name: 'Send invitation' }).click();
    expect(await messageOf(page, email)).toBe('this e-mail is already in use');
    expect(await name.getAttribute('aria-invalid')).toBeNull();
    await screenshot(page, 'form-errors-invite-taken-1280');
    await page.close();
  }, 60_000);
});
