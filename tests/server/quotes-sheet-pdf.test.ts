// The installer's job sheet as a PDF (plan with numbered strips, cut list by roll, van load, checks;
// no prices) and e-mailing it to the assigned installer.
import fs from 'node:fs';
import path from 'node:path';
import { simpleParser } from 'mailparser';
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { JobEvent, PlanRevision } from '../../server/db/models';
import { computeTakeoff } from '../../shared/takeoff/compute-takeoff';
import { parseProductCatalogue } from '../../shared/takeoff/products';
import { loadCatalogue } from '../../server/modules/catalogue/catalogue.service';
import { createJob, createTestContext, createUser, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';
import { readStoredTakeoff } from '../../shared/takeoff/takeoff-schema';
import { binary, examplePlan, quoteCompany, quoteJob } from './quotes-fixtures';

let ctx: TestContext;
let org: TestOrg;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await quoteCompany();
});
afterAll(async () => {
  await ctx?.close();
});

/** A scheduled job whose plan revision carries its saved takeoff, as the editor leaves it on save. */
async function scheduledJob(opts: { assigned?: boolean; stage?: 'scheduled' | 'accepted' } = {}) {
  const plan = examplePlan();
  const made = await createJob(org, { stage: opts.stage ?? 'scheduled', assignedInstallerId: opts.assigned === false ? null : org.installer.id, plan });
  const { products } = await loadCatalogue(org.id);
  await PlanRevision.update({ takeoff: computeTakeoff(plan, { products: parseProductCatalogue(products) }) as never }, { where: { spaceId: made.space.id } });
  return made;
}

const pdfText = async (buf: Buffer) => (await new PDFParse({ data: new Uint8Array(buf) }).getText()).text;

describe('job sheet PDF', () => {
  it('prints the plan strips, the cut list by roll, the van load and the checks, and no prices', async () => {
    const { job } = await scheduledJob();
    const installer = await loginAs(ctx.app, org.installer);
    const res = await installer.get(`/api/jobs/${job.id}/sheet.pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    fs.mkdirSync(path.join(process.cwd(), 'test-output', 'pdf'), { recursive: true });
    fs.writeFileSync(path.join(process.cwd(), 'test-output', 'pdf', 'job-sheet.pdf'), res.body);
    const text = await pdfText(res.body);
    const sheet = (await installer.get(`/api/jobs/${job.id}/job-sheet`)).body;
    const s = sheet.sheet ?? sheet;
    const firstStrip = s.spaces[0].layers[0].strips[0].label;
    expect(text).toContain(job.reference);
    expect(text).toMatch(/Cut list, by roll/);
    expect(text).toContain('Roll 1');
    expect(text).toContain(firstStrip);
    expect(text).toMatch(/Van load/);
    expect(text).toContain(s.spaces[0].checks[0].title);
    // Whole words: "conservation" (a site check cites the Conservation of Habitats and Species Regulations) is no VAT.
    expect(text).not.toMatch(/£|\bprices?\b|\bVAT\b/i);
    // The legend speaks of the layers the space has and of the arrow drawn (the first layer's, as on the phone).
    const flat = text.replace(/\s+/g, ' ');
    expect(flat).toContain(`Arrow: lay direction of the ${s.spaces[0].layers[0].label.toLowerCase()}.`);
    expect(flat.includes('Straw: base strips')).toBe(s.spaces[0].layers.some((l: { role: string }) => l.role === 'base'));
    // Each product is named once in the cut list, not on every row of its rolls.
    const cutList = flat.slice(flat.indexOf('Cut list, by roll'), flat.indexOf('Site checks'));
    for (const l of s.spaces[0].layers as Array<{ productName: string }>) expect(cutList.split(l.productName).length - 1, l.productName).toBe(1);
  });

  it('names each U-value, before and after, as the quote does: ISO 6946 insulated area and whole ceiling, the RdSAP default, and what the target is judged on', async () => {
    const { job, space } = await scheduledJob();
    const t = readStoredTakeoff((await PlanRevision.findOne({ where: { spaceId: space.id } }))!.takeoff)!;
    const f = (x: number) => x.toFixed(2);
    // The figures of the stored takeoff, each under its name: the whole ceiling is the area-weighted
    // mean over the insulated area, hatch, downlights, tank and eaves strip (so above the insulated area's U).
    expect(t.uValueAfterWholeCeiling).toBeGreaterThan(t.uValueAfter);
    const expected = [
      `U-value (BS EN ISO 6946 combined method) ${f(t.uValueBefore)} → ${f(t.uValueAfter)} W/m²K insulated area`,
      `${f(t.uValueBeforeWholeCeiling)} → ${f(t.uValueAfterWholeCeiling)} whole ceiling`,
      `RdSAP 2012 Table S9 default ${f(t.thermal.before.rdsapU)} → ${f(t.thermal.after.rdsapU)}`,
      // examples/tank-hatch-downlights.json has a depth target of 270 mm.
      `target 270 mm of insulation: ${t.thermal.meetsTarget ? 'met' : 'not met'}`,
    ];
    const installer = await loginAs(ctx.app, org.installer);
    const sheet = await installer.get(`/api/jobs/${job.id}/sheet.pdf`).buffer(true).parse(binary);
    const sheetText = (await pdfText(sheet.body)).replace(/\s+/g, ' ');
    for (const e of expected) expect(sheetText, e).toContain(e);

    // A U-value target (examples/eaves-two-sides.json: U 0.16), judged on the whole ceiling by default.
    const quoted = await quoteJob(org, { plan: examplePlan('eaves-two-sides.json') });
    const qt = readStoredTakeoff((await PlanRevision.findOne({ where: { spaceId: quoted.space.id } }))!.takeoff)!;
    const office = await loginAs(ctx.app, org.office);
    const q = (await office.post(`/api/jobs/${quoted.job.id}/quotes`).send({})).body.quote;
    const quoteText = (await pdfText((await office.get(`/api/quotes/${q.id}/pdf`).buffer(true).parse(binary)).body)).replace(/\s+/g, ' ');
    expect(quoteText).toContain(`${f(qt.uValueBeforeWholeCeiling)} → ${f(qt.uValueAfterWholeCeiling)} whole ceiling`);
    expect(quoteText).toContain(`RdSAP 2012 Table S9 default ${f(qt.thermal.before.rdsapU)} → ${f(qt.thermal.after.rdsapU)}`);
    expect(qt.thermal.targetJudgedOn).toBe('whole-ceiling');
    expect(quoteText).toContain(`target U 0.16 W/m²K judged on the whole ceiling (ISO 6946): ${qt.thermal.meetsTarget ? 'met' : 'not met'}`);
  });

  it('is refused to an installer the job is not assigned to', async () => {
    const { job } = await scheduledJob();
    const other = await createUser(org.id, 'installer');
    const agent = await loginAs(ctx.app, other);
    expect((await agent.get(`/api/jobs/${job.id}/sheet.pdf`)).status).toBe(404);
  });

  it('is e-mailed by the office to the assigned installer, with the PDF attached, and recorded on the timeline', async () => {
    const { job } = await scheduledJob();
    const office = await loginAs(ctx.app, org.office);
    const estimator = await loginAs(ctx.app, org.estimator);
    expect((await estimator.post(`/api/jobs/${job.id}/sheet/send`).send({})).status).toBe(403);
    const res = await office.post(`/api/jobs/${job.id}/sheet/send`).send({});
    expect(res.status).toBe(200);
    const mail = await ctx.outbox.waitFor((m) => m.to.includes(org.installer.email));
    const parsed = await simpleParser(mail.raw);
    const pdf = parsed.attachments.find((a) => a.contentType === 'application/pdf')!;
    expect(pdf.filename).toBe(`job-sheet-${job.reference}.pdf`);
    expect(await pdfText(pdf.content)).toContain(job.reference);
    expect(mail.links.some((l) => l.endsWith(`/jobs/${job.id}`))).toBe(true);
    const events = await JobEvent.findAll({ where: { jobId: job.id, kind: 'email_sent' } });
    expect(events.map((e) => e.data)).toContainEqual(expect.objectContaining({ to: org.installer.email, purpose: 'job_sheet' }));
  });

  it('asks for an installer before e-mailing', async () => {
    const { job } = await scheduledJob({ assigned: false, stage: 'accepted' });
    const office = await loginAs(ctx.app, org.office);
    const res = await office.post(`/api/jobs/${job.id}/sheet/send`).send({});
    expect(res.status).toBe(422);
    expect(res.body.error.details[0].path).toBe('assignedInstallerId');
  });
});
