// Shared set-up for the installer's tests: a scheduled job whose space has a plan and its takeoff.
import fs from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import { PlanRevision, Job } from '../../server/db/models';
import { REPO_ROOT } from '../../server/config';
import { planSchema } from '../../shared/plan/plan-schema';
import { computeTakeoff } from '../../shared/takeoff/compute-takeoff';
import { parseProductCatalogue } from '../../shared/takeoff/products';
import { PRICE_KEY_RE } from '../../server/lib/redact';
import { createJob, type loginAs, type TestOrg } from '../helpers/test-app';

export function examplePlan(name = 'tank-hatch-downlights.json') {
  return planSchema.parse(JSON.parse(fs.readFileSync(path.join(REPO_ROOT, 'examples', name), 'utf8')));
}

export function exampleProducts() {
  return parseProductCatalogue(JSON.parse(fs.readFileSync(path.join(REPO_ROOT, 'examples', 'products.json'), 'utf8')));
}

/** A job assigned to the org's installer, scheduled for `installDate`, whose one space has the example plan and its takeoff. */
export async function scheduledJobWithTakeoff(
  org: TestOrg,
  opts: { installDate?: string; customerEmail?: string; planFile?: string; installerId?: string } = {},
) {
  const plan = examplePlan(opts.planFile);
  const takeoff = computeTakeoff(plan, { products: exampleProducts() });
  const made = await createJob(org, { stage: 'scheduled', assignedInstallerId: opts.installerId ?? org.installer.id, plan });
  await PlanRevision.update({ takeoff: JSON.parse(JSON.stringify(takeoff)) }, { where: { spaceId: made.space.id } });
  await Job.update(
    { installDate: opts.installDate ?? new Date().toISOString().slice(0, 10), accessNotes: 'Key with neighbour at no. 10' },
    { where: { id: made.job.id } },
  );
  if (opts.customerEmail) await made.customer.update({ email: opts.customerEmail });
  return { ...made, takeoff, plan };
}

type Agent = Awaited<ReturnType<typeof loginAs>>;

/** A scheduled job of `org`'s installer with every check ticked and an after photo, through the API as `agent` (that installer): ready to finish. */
export async function readyToFinish(org: TestOrg, agent: Agent) {
  const made = await scheduledJobWithTakeoff(org);
  const sheet = (await agent.get(`/api/jobs/${made.job.id}/job-sheet`)).body.sheet as { spaces: { id: string; checks: { code: string }[] }[] };
  for (const s of sheet.spaces)
    for (const c of s.checks) {
      const res = await agent.post(`/api/jobs/${made.job.id}/ticks`).send({ kind: 'check', spaceId: s.id, ref: c.code, done: true });
      if (res.status !== 200) throw new Error(`tick ${c.code}: ${res.status}`);
    }
  const photo = await agent
    .post(`/api/jobs/${made.job.id}/photos`)
    .field('spaceId', made.space.id)
    .field('stage', 'after')
    .attach('photo', await rotatedJpeg(), 'a.jpg');
  if (photo.status !== 201) throw new Error(`after photo: ${photo.status}`);
  const productIds = [...new Set(made.takeoff.layers.map((l) => l.productId))];
  return { ...made, productIds };
}

/** Every key path in a JSON value whose name looks like money (price, cost, total, margin…). */
export function priceKeyPaths(value: unknown, at = '$'): string[] {
  if (Array.isArray(value)) return value.flatMap((v, i) => priceKeyPaths(v, `${at}[${i}]`));
  if (value && typeof value === 'object') {
    return Object.entries(value as Record<string, unknown>).flatMap(([k, v]) => [
      ...(PRICE_KEY_RE.test(k) || /margin|price|cost|total/i.test(k) ? [`${at}.${k}`] : []),
      ...priceKeyPaths(v, `${at}.${k}`),
    ]);
  }
  return [];
}

/** A small JPEG whose EXIF says "rotate 90° clockwise" (orientation 6): 400 × 200 stored, 200 × 400 upright. */
export function rotatedJpeg(): Promise<Buffer> {
  return sharp({ create: { width: 400, height: 200, channels: 3, background: '#c8a050' } })
    .jpeg()
    .withMetadata({ orientation: 6 })
    .toBuffer();
}

/** Files under a folder, recursively (to prove that a refused upload stored nothing). */
export function filesUnder(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return fs
    .readdirSync(dir, { recursive: true, withFileTypes: true })
    .filter((d) => d.isFile())
    .map((d) => path.join(d.parentPath, d.name));
}
