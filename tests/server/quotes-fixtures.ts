// Shared set-up for the quote API tests: a company with the demo catalogue, fixed tax rates, and a
// job whose one space holds an example plan (tank, hatch, downlights).
import fs from 'node:fs';
import path from 'node:path';
import type request from 'supertest';
import { planSchema, type Plan } from '../../shared/plan/plan-schema';
import { Customer } from '../../server/db/models';
import { TaxRate } from '../../server/db/models/tax-rate';
import { seedDemoCatalogue } from '../../server/modules/settings/settings.service';
import { createJob, createOrgWithUsers, type TestOrg } from '../helpers/test-app';

export function examplePlan(file = 'tank-hatch-downlights.json'): Plan {
  return planSchema.parse(JSON.parse(fs.readFileSync(path.join(process.cwd(), 'examples', file), 'utf8')));
}

/** Collects a binary response body (PDF, XLSX) with supertest. */
export function binary(res: request.Response, cb: (err: Error | null, body: Buffer) => void) {
  const stream = res as unknown as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (c: Buffer) => chunks.push(Buffer.from(c)));
  stream.on('end', () => cb(null, Buffer.concat(chunks)));
}

/**
 * A company with the demo catalogue and tax rates that do not depend on today's date:
 * energy-saving 5% and standard 20% from 2000-01-01 (so the hand-worked numbers hold whenever the tests run).
 */
export async function quoteCompany(): Promise<TestOrg> {
  const org = await createOrgWithUsers(undefined, `Quote Test Lofts ${Math.random().toString(36).slice(2, 7)}`);
  await seedDemoCatalogue(org.id, { email: `office-${org.id.slice(0, 6)}@lofts.example.com`, companyName: 'Quote Test Lofts Ltd' });
  await TaxRate.destroy({ where: { organisationId: org.id } });
  await TaxRate.bulkCreate([
    { organisationId: org.id, taxClass: 'energy_saving', rateBp: 500, validFrom: '2000-01-01', label: 'reduced' },
    { organisationId: org.id, taxClass: 'standard', rateBp: 2000, validFrom: '2000-01-01', label: 'standard' },
  ] as never);
  return org;
}

export async function quoteJob(org: TestOrg, opts: { plan?: Plan; customerName?: string; email?: string } = {}) {
  const made = await createJob(org, { stage: 'surveyed', plan: opts.plan ?? examplePlan(), customerName: opts.customerName ?? 'Winifred Ashdown' });
  await Customer.update({ email: opts.email ?? 'winifred.ashdown@example.com' }, { where: { id: made.customer.id } });
  return made;
}
