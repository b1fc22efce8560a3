import fs from 'node:fs';
import path from 'node:path';
import { simpleParser } from 'mailparser';
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { REPO_ROOT } from '../../server/config';
import { InstallSetting } from '../../server/db/models';
import { createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';
import { rotatedJpeg, scheduledJobWithTakeoff } from './job-sheet-fixtures';

let ctx: TestContext;
let org: TestOrg;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
});
afterAll(async () => {
  await ctx?.close();
});

async function pdfText(buf: Buffer) {
  const parser = new PDFParse({ data: new Uint8Array(buf) });
  try {
    return (await parser.getText()).text;
  } finally {
    await parser.destroy();
  }
}

type Agent = Awaited<ReturnType<typeof loginAs>>;

async function tickAll(agent: Agent, jobId: string, except: string[] = []) {
  const sheet = (await agent.get(`/api/jobs/${jobId}/job-sheet`)).body.sheet;
  for (const s of sheet.spaces) {
    for (const c of s.checks) {
      if (except.includes(c.code)) continue;
      const r = await agent.post(`/api/jobs/${jobId}/ticks`).send({ kind: 'check', spaceId: s.id, ref: c.code, done: true });
      expect(r.status).toBe(200);
    }
  }
  return sheet;
}

async function addPhoto(agent: Agent, jobId: string, spaceId: string, stage: string) {
  const r = await agent
    .post(`/api/jobs/${jobId}/photos`)
    .field('spaceId', spaceId)
    .field('stage', stage)
    .attach('photo', await rotatedJpeg(), 'p.jpg');
  expect(r.status).toBe(201);
}

describe('POST /api/jobs/:id/finish', () => {
  it('is refused while a check is neither ticked nor explained, naming it', async () => {
    const { job, space } = await scheduledJobWithTakeoff(org);
    const agent = await loginAs(ctx.app, org.installer);
    await tickAll(agent, job.id, ['downlight.covers']);
    await addPhoto(agent, job.id, space.id, 'after');
    const res = await agent.post(`/api/jobs/${job.id}/finish`).send({});
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('not_ready');
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toEqual([`checks.${space.id}:downlight.covers`]);
  });

  it('is refused without an after photo of every space, even with every check ticked', async () => {
    const { job, space } = await scheduledJobWithTakeoff(org);
    const agent = await loginAs(ctx.app, org.installer);
    await tickAll(agent, job.id);
    await addPhoto(agent, job.id, space.id, 'before');
    const res = await agent.post(`/api/jobs/${job.id}/finish`).send({});
    expect(res.status).toBe(409);
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toEqual([`photos.${space.id}`]);
  });

  it('marks the job installed with a written reason for the unticked check, e-mails the handover pack, and the office sees it', async () => {
    await InstallSetting.upsert({ organisationId: org.id, handoverRValues: true, handoverReceipt: true });
    const { job, space, takeoff } = await scheduledJobWithTakeoff(org, { customerEmail: 'ada.finch@example.com' });
    const agent = await loginAs(ctx.app, org.installer);
    await tickAll(agent, job.id, ['boarded.raise-or-leave']);
    await addPhoto(agent, job.id, space.id, 'before');
    await addPhoto(agent, job.id, space.id, 'after');
    ctx.outbox.clear();
    const res = await agent
      .post(`/api/jobs/${job.id}/finish`)
      .send({ reasons: { [`${space.id}:boarded.raise-or-leave`]: 'Customer keeps the boards as they are' } });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ stage: 'installed', emailed: true, warnings: [] });

    // Finishing twice is refused: the records are closed.
    expect((await agent.post(`/api/jobs/${job.id}/finish`).send({})).body.error.code).toBe('job_installed');
    expect((await agent.post(`/api/jobs/${job.id}/notes`).send({ text: 'late' })).status).toBe(409);

    const office = await loginAs(ctx.app, org.office);
    expect((await office.get(`/api/jobs/${job.id}`)).body.job.stage).toBe('installed');
    const sheet = (await office.get(`/api/jobs/${job.id}/job-sheet`)).body.sheet;
    expect(sheet.completion.by.name).toBe(org.installer.name);
    expect(sheet.ticks.find((t: { ref: string }) => t.ref === 'boarded.raise-or-leave').reason).toBe('Customer keeps the boards as they are');

    const mail = await ctx.outbox.waitFor((m) => m.to.includes('ada.finch@example.com'));
    const parsed = await simpleParser(mail.raw);
    const attachment = parsed.attachments.find((a) => a.contentType === 'application/pdf');
    expect(attachment).toBeDefined();

    const dl = await office
      .get(`/api/jobs/${job.id}/handover.pdf`)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(dl.status).toBe(200);
    expect(dl.headers['content-type']).toBe('application/pdf');
    // Kept for a person to look at (pdftoppm turns it into pages).
    fs.mkdirSync(path.join(REPO_ROOT, 'test-output'), { recursive: true });
    fs.writeFileSync(path.join(REPO_ROOT, 'test-output', 'handover-pack-sample.pdf'), dl.body as Buffer);
    for (const pdf of [dl.body as Buffer, attachment!.content]) {
      const text = (await pdfText(pdf)).replace(/\s+/g, ' ');
      // Areas and U-values as the takeoff computed them (one decimal for m², two for W/m²K).
      expect(text).toContain(`Area insulated: ${takeoff.netAreaM2.toFixed(1)} m²`);
      for (const l of takeoff.layers) expect(text).toContain(`${l.thicknessMm} mm thick, ${l.areaM2.toFixed(1)} m²`);
      // Each figure named: the ISO 6946 value of the insulated area and the whole ceiling, the RdSAP default beside them.
      expect(text).toContain(
        `U-value (BS EN ISO 6946 combined method) ${takeoff.uValueBefore.toFixed(2)} → ${takeoff.uValueAfter.toFixed(2)} W/m²K insulated area`,
      );
      expect(text).toContain(`${takeoff.uValueBeforeWholeCeiling.toFixed(2)} → ${takeoff.uValueAfterWholeCeiling.toFixed(2)} whole ceiling`);
      expect(text).toContain(`RdSAP 2012 Table S9 default ${takeoff.thermal.before.rdsapU.toFixed(2)} → ${takeoff.thermal.after.rdsapU.toFixed(2)}`);
      expect(text).toMatch(/Keep the eaves vents clear/);
      expect(text).toMatch(/walkway boards on raised supports/);
      expect(text).toContain(org.installer.name);
      // Company setting on: R-values and the signed receipt. R = thickness / λ (m²K/W).
      const base = takeoff.layers[0];
      expect(text).toContain(`R ${(base.thicknessMm / 1000 / base.lambda).toFixed(2)} m²K/W`);
      expect(text).toMatch(/Receipt of insulation installed/);
    }
  });

  it('keeps the handover pack from the office until the job is installed', async () => {
    const { job } = await scheduledJobWithTakeoff(org);
    const office = await loginAs(ctx.app, org.office);
    const res = await office.get(`/api/jobs/${job.id}/handover.pdf`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('not_installed');
  });
});
