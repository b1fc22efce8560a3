/**
 * Load figures for the jobs list (a script that prints numbers, not a test):
 *   npm run load:jobs [-- --jobs 190,270 --seconds 10 --connections 10 --path /api/jobs]
 * Starts the API on loopback against a database of its own (quiltline_load on the project
 * cluster), tops one company up to each job count (one customer and one space per job, as the
 * demo has), signs in as its office user and drives GET <path> with autocannon. Prints requests/s,
 * p50/p99 latency and the size of one answer. Run it on an otherwise idle machine: the numbers
 * depend on the CPU.
 */
import type { AddressInfo } from 'node:net';
import { loadavg } from 'node:os';
import autocannon from 'autocannon';
import bcrypt from 'bcryptjs';
import { createApp } from '../server/app';
import { loadConfig } from '../server/config';
import { Customer, Job, Organisation, Space, User } from '../server/db/models';
import { runMigrations } from '../server/db/migrate';
import { createDeps } from '../server/deps';
import { nextJobReference } from '../server/modules/jobs/job-reference';
import { databaseUrl, dropDatabase, ensureDatabase, ensurePgRunning, stopPg } from './pg.mjs';

const arg = (name: string, fallback: string) => {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 ? process.argv[i + 1] : fallback;
};
const counts = arg('jobs', '190,270').split(',').map(Number);
const seconds = Number(arg('seconds', '10'));
const connections = Number(arg('connections', '10'));
const target = arg('path', '/api/jobs');
const DB = 'quiltline_load';

const pg = await ensurePgRunning();
dropDatabase(DB);
ensureDatabase(DB);
const config = loadConfig({ ...process.env, NODE_ENV: 'test', DATABASE_URL: databaseUrl(DB), SEED_DEMO: '0', LOGIN_RATE_LIMIT: '1000' });
const deps = await createDeps(config);
await runMigrations(deps.sequelize, config.databaseUrl);
const app = createApp(deps);
const server = app.listen(0, '127.0.0.1');
await new Promise((r) => server.once('listening', r));
const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

const org = await Organisation.create({ name: 'Load Test Lofts' });
const password = 'load-test-password';
const office = await User.create({
  organisationId: org.id,
  email: 'office@load.example.com',
  name: 'Office',
  role: 'office',
  passwordHash: await bcrypt.hash(password, 4),
  active: true,
});
const login = await fetch(`${base}/api/auth/login`, {
  method: 'POST',
  headers: { 'content-type': 'application/json' },
  body: JSON.stringify({ email: office.email, password }),
});
const cookie = login.headers
  .getSetCookie()
  .map((c) => c.split(';')[0])
  .join('; ');

async function addJobs(n: number) {
  for (let i = 0; i < n; i++) {
    const customer = await Customer.create({
      organisationId: org.id,
      name: `Customer ${i} Example`,
      email: `customer${i}@load.example.com`,
      phone: '01632 960000',
      addressLine1: `${i + 1} Example Road`,
      addressLine2: '',
      town: 'Exampleton',
      postcode: 'EX1 1AA',
    });
    const job = await Job.create({
      organisationId: org.id,
      reference: await nextJobReference(deps.sequelize, org.id),
      customerId: customer.id,
      addressLine1: `${i + 1} Example Road`,
      addressLine2: '',
      town: 'Exampleton',
      postcode: 'EX1 1AA',
      stage: 'enquiry',
      assignedInstallerId: null,
      installDate: null,
      accessNotes: 'Hatch on the landing; ladder needed.',
      notes: 'Loft partly boarded around the hatch.',
      createdById: office.id,
    });
    await Space.create({ organisationId: org.id, jobId: job.id, name: 'Main loft' });
  }
}

let have = 0;
console.log(`GET ${target}, ${connections} connections, ${seconds} s each, on ${base} (load average ${loadavg()[0].toFixed(1)})`);
for (const n of counts) {
  await addJobs(n - have);
  have = n;
  const one = await fetch(`${base}${target}`, { headers: { cookie } });
  const bytes = (await one.arrayBuffer()).byteLength;
  if (one.status !== 200) throw new Error(`GET ${target} answered ${one.status}`);
  const r = await autocannon({ url: `${base}${target}`, connections, duration: seconds, headers: { cookie } });
  console.log(
    `${String(n).padStart(4)} jobs: ${r.requests.average.toFixed(1)} requests/s, p50 ${r.latency.p50} ms, p99 ${r.latency.p99} ms, ` +
      `${(bytes / 1024).toFixed(1)} kB per answer, ${r.non2xx} non-2xx, ${r.errors} errors`,
  );
}

server.closeAllConnections();
await new Promise((r) => server.close(r));
await deps.close();
dropDatabase(DB);
if (pg.startedHere) stopPg();
