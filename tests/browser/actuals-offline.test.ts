// Actuals recorded on a phone with no signal arrive once: the finish waits in the outbox (IndexedDB),
// and when signal is back its first send reaches the server but the answer is lost, so the outbox
// sends it again under the same Idempotency-Key. The server keeps one set of actuals, one finish.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CompanySetting, Job, JobActual, JobCompletion, JobEvent } from '../../server/db/models';
import { launchBrowser, screenshot, signInThroughUi, startAppServer } from '../helpers/browser';
import { createOrgWithUsers, loginAs, type TestOrg } from '../helpers/test-app';
import { readyToFinish } from '../server/job-sheet-fixtures';

let server: Awaited<ReturnType<typeof startAppServer>>;
let browser: Awaited<ReturnType<typeof launchBrowser>>;
let org: TestOrg;

beforeAll(async () => {
  server = await startAppServer();
  org = await createOrgWithUsers(server.ctx);
  // The company asks for hours: the phone must hold the finish until they are typed.
  await CompanySetting.update({ actualsRequired: ['hours'] }, { where: { organisationId: org.id } });
  browser = await launchBrowser({ viewport: { width: 360, height: 740 } });
}, 60_000);
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

describe('actuals recorded offline', () => {
  it('arrive once when the finish is replayed after a lost answer', { timeout: 120_000 }, async () => {
    const agent = await loginAs(server.ctx.app, org.installer);
    const { job } = await readyToFinish(org, agent);
    const load = (await agent.get(`/api/jobs/${job.id}/job-sheet`)).body.sheet.vanLoad as {
      rolls: { productId: string; productName: string; count: number }[];
    };
    const [roll] = load.rolls;

    const page = await browser.newPage();
    page.setDefaultTimeout(20_000);
    await signInThroughUi(page, server.url, org.installer.email, org.installer.password);
    await page.goto(`${server.url}/jobs/${job.id}/sheet`);
    await page.getByText('Saved on this device: opens without signal.').waitFor();

    await browser.context.setOffline(true);
    await page.locator('summary', { hasText: 'Finish the job' }).click();
    const markInstalled = page.getByRole('button', { name: 'Mark installed' });
    await page.getByText(/Fill in the hours on site/).waitFor();
    expect(await markInstalled.isDisabled()).toBe(true);
    await page.getByLabel(`${roll.productName}: rolls used`).fill(String(roll.count - 1));
    await page.getByLabel(`${roll.productName}: rolls brought back`).fill('1');
    await page.getByLabel(`${org.installer.name}: hours on site`).fill('5,5');
    await markInstalled.click();
    // Shown at once: the finish does not wait for signal to be queued.
    await page.getByText(/No signal: marked installed on this phone/).waitFor();
    await screenshot(page, 'actuals-offline-queued-360');
    expect(await JobActual.count({ where: { jobId: job.id } })).toBe(0);

    // The first send reaches the server, but its answer is lost on the way back (the phone sees a
    // network failure and keeps the finish); later sends go through.
    let lostAnswer = 0;
    const resends: string[] = [];
    await page.route('**/api/jobs/*/finish', async (route) => {
      if (lostAnswer) {
        // Passed through, noting whether the server answered it as a resend of the finish it has.
        const res = await route.fetch();
        resends.push(`${res.status()} ${res.headers()['idempotent-replayed'] ?? 'new'}`);
        return route.fulfill({ response: res });
      }
      try {
        lostAnswer = (await route.fetch()).status();
      } catch {
        // A retry made before the phone was back online: it reached nothing; the next one is the lost one.
      }
      await route.abort('connectionreset');
    });
    await browser.context.setOffline(false);
    // Done when the phone's outbox is empty: nothing left, not even a refused copy. (The sheet may
    // show the job installed sooner: it is fetched again on reconnecting, once the lost send landed.)
    const left = () =>
      page.evaluate(
        () =>
          new Promise<number>((resolve, reject) => {
            const open = indexedDB.open('quiltline-offline');
            open.onerror = () => reject(open.error);
            open.onsuccess = () => {
              const count = open.result.transaction('outbox').objectStore('outbox').count();
              count.onsuccess = () => resolve(count.result);
            };
          }),
      );
    await expect.poll(left, { timeout: 60_000 }).toBe(0);
    expect(lostAnswer).toBe(200);
    expect(resends).toEqual(['200 true']);
    await page.getByText(/Marked installed by/).waitFor();
    await screenshot(page, 'actuals-offline-arrived-360');

    const actuals = await JobActual.findAll({ where: { jobId: job.id } });
    expect(actuals).toHaveLength(1);
    expect(actuals[0].rolls.find((r) => r.productId === roll.productId)).toEqual({ productId: roll.productId, used: roll.count - 1, returned: 1 });
    expect(actuals[0].hours).toEqual([{ userId: org.installer.id, hours: 5.5 }]);
    expect(await JobCompletion.count({ where: { jobId: job.id } })).toBe(1);
    expect(await JobEvent.count({ where: { jobId: job.id, kind: 'installed' } })).toBe(1);
    expect((await Job.findByPk(job.id))!.stage).toBe('installed');
    await page.close();
  });

  it("lets the installer correct the hours on the finished job's sheet the next morning", { timeout: 120_000 }, async () => {
    const agent = await loginAs(server.ctx.app, org.installer);
    const { job } = await readyToFinish(org, agent);
    const finish = await agent.post(`/api/jobs/${job.id}/finish`).send({ actuals: { hours: [{ userId: org.installer.id, hours: 4 }] } });
    expect(finish.status).toBe(200);

    const page = await browser.newPage();
    page.setDefaultTimeout(20_000);
    await page.goto(`${server.url}/jobs/${job.id}/sheet`);
    await page.getByText(/Marked installed by/).waitFor();
    const section = page.locator('details', { has: page.locator('summary', { hasText: 'What was used' }) });
    await section.getByText('4 hours on site').waitFor();
    await section.getByRole('button', { name: 'Correct what was used' }).click();
    const hours = section.getByLabel(`${org.installer.name}: hours on site`);
    expect(await hours.inputValue()).toBe('4');
    await hours.fill('6.5');
    await section.getByRole('button', { name: 'Save correction' }).click();
    await section.getByText('Saved.').waitFor();
    await section.getByText('6.5 hours on site').waitFor();
    await screenshot(page, 'actuals-corrected-sheet-360');
    const row = (await JobActual.findByPk(job.id))!;
    expect(row).toMatchObject({ version: 2, editedById: org.installer.id, hours: [{ userId: org.installer.id, hours: 6.5 }] });
    await page.close();
  });
});
