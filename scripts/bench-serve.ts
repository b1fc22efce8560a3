/**
 * Serving speed of the compiled server (a script that prints numbers, not a test):
 *   npm run bench:serve [-- --seconds 8 --rates 50,100,200 --connections 10 --instances 1,2 --profile
 *                          --only bare,jobs,plan --base <another build's dist-server/index.js> --repeat 3
 *                          --node-args "--trace-gc"]
 * Builds dist-server/ if stale, makes a database of its own on the project cluster (quiltline_bench)
 * with the demo data, starts the server as plain `node` processes (one, then two on the same
 * database, connections spread round-robin by autocannon) and, beside them, a bare Express handler
 * that answers the same bytes as the plan read. Drives GET /api/jobs and GET /api/spaces/:id/plan
 * signed in as the demo office user at fixed rates (paced evenly, open loop: scripts/paced-load.ts)
 * and flat out (autocannon), and prints requests/s and p99 with their ratio to the bare handler in
 * the same run. --profile writes a V8 CPU profile of each server
 * process into test-output/cpu-profiles/ (open in Chrome DevTools). --base runs a second build (copy
 * an older dist-server/ under the repository, e.g. test-output/, so it finds node_modules) beside
 * this one, checks both answer every demo plan read and a range of job-list pages byte for byte as
 * each role, and measures both in the same run. Run on an otherwise idle machine.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import { createServer } from 'node:net';
import { loadavg } from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import { DEMO_PASSWORD } from '../server/db/seeders/demo';
import { medianOf, printTable, type Row } from './bench-serve-table';
import { pacedLoad } from './paced-load';
import { clusterTicks, cpuTicks, TICKS_PER_SECOND } from './proc-cpu';
import { buildServer } from './server-build.mjs';
import { REPO_ROOT, databaseUrl, dropDatabase, ensureDatabase, ensurePgRunning, stopPg } from './pg.mjs';

const arg = (name: string, fallback: string) => {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 ? process.argv[i + 1] : fallback;
};
const seconds = Number(arg('seconds', '8'));
const rates = arg('rates', '50,100,200').split(',').map(Number);
const connections = Number(arg('connections', '10'));
const instanceCounts = arg('instances', '1,2').split(',').map(Number);
const profile = process.argv.includes('--profile');
// --node-args "--trace-gc --max-semi-space-size=32": extra flags for the servers' node (NODE_OPTIONS refuses some, --trace-gc among them).
const nodeArgs = arg('node-args', '').split(' ').filter(Boolean);
// --repeat n: rounds per rate, targets interleaved; the table shows medians.
const repeat = Number(arg('repeat', '1'));
// --base <dist-server/index.js of another build>: its servers run beside this build's on the same
// database and are measured in the same run, so a change is judged old against new, not run against run.
const baseMain = arg('base', '');
// --only bare,jobs,plan: which targets to drive (all by default).
const only = arg('only', 'bare,jobs,plan').split(',');
const DB = 'quiltline_bench';
// Every instance signs cookies with the same secret, so a session made on one works on the other.
const SESSION_SECRET = randomBytes(24).toString('hex');
const PROFILE_DIR = path.join(REPO_ROOT, 'test-output', 'cpu-profiles');

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });
}

const children: ChildProcess[] = [];

function startProcess(args: string[], env: NodeJS.ProcessEnv, logName: string): ChildProcess {
  const log = fs.openSync(path.join(REPO_ROOT, 'test-output', `${logName}.log`), 'w');
  const child = spawn(process.execPath, args, { cwd: REPO_ROOT, env, stdio: ['ignore', log, log] });
  children.push(child);
  return child;
}

async function waitUntil(url: string, child: ChildProcess) {
  for (const started = Date.now(); Date.now() - started < 120_000;) {
    if (child.exitCode !== null) throw new Error(`${url}: the process exited (${child.exitCode}); see test-output/`);
    const ok = await fetch(url).then(
      (r) => r.ok,
      () => false,
    );
    if (ok) return;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`${url} did not answer within 2 minutes`);
}

async function stopProcess(child: ChildProcess) {
  if (child.exitCode !== null || child.signalCode !== null) return;
  await new Promise((resolve) => {
    child.once('exit', resolve);
    child.kill('SIGTERM');
  });
}

/** The compiled API server in production mode on the bench database. */
async function startServer(n: number | string, opts: { seed: boolean; serverMain: string; db: string }) {
  const port = await freePort();
  const args = ['--enable-source-maps'];
  if (profile) args.push('--cpu-prof', `--cpu-prof-dir=${PROFILE_DIR}`);
  args.push(...nodeArgs);
  const child = startProcess(
    [...args, opts.serverMain],
    {
      ...process.env,
      NODE_ENV: 'production',
      PORT: String(port),
      HOST: '127.0.0.1',
      DATABASE_URL: opts.db,
      SESSION_SECRET,
      // Nothing is mailed during the bench; a port with no server keeps the worker idle.
      SMTP_URL: 'smtp://127.0.0.1:9',
      SEED_DEMO: opts.seed ? '1' : '0',
      LOGIN_RATE_LIMIT: '1000',
      LOG_LEVEL: process.env.LOG_LEVEL ?? 'info',
    },
    `bench-server-${n}`,
  );
  const base = `http://127.0.0.1:${port}`;
  await waitUntil(`${base}/api/ready`, child);
  return { base, child };
}

/** A bare Express handler answering `body` as JSON: the ceiling of this machine and Express. */
async function startBare(n: number, bodyFile: string) {
  const port = await freePort();
  const code = `
    const express = require('express');
    const body = JSON.parse(require('fs').readFileSync(${JSON.stringify(bodyFile)}, 'utf8'));
    const app = express();
    app.get('/bare', (_req, res) => res.json(body));
    app.get('/ready', (_req, res) => res.json({ ok: true }));
    app.listen(${port}, '127.0.0.1');
    process.on('SIGTERM', () => process.exit(0));`;
  const child = startProcess(['-e', code], process.env, `bench-bare-${n}`);
  const base = `http://127.0.0.1:${port}`;
  await waitUntil(`${base}/ready`, child);
  return { base, child };
}

async function signIn(base: string, email = 'office@demo.example.com'): Promise<string> {
  const res = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  if (!res.ok) throw new Error(`sign-in answered ${res.status}`);
  return res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
}

async function getJson<T>(url: string, cookie: string): Promise<{ body: T; bytes: number }> {
  const res = await fetch(url, { headers: { cookie } });
  const text = await res.text();
  if (!res.ok) throw new Error(`GET ${url} answered ${res.status}: ${text.slice(0, 200)}`);
  return { body: JSON.parse(text) as T, bytes: Buffer.byteLength(text) };
}

/** A space of the demo company with a saved plan (the editor's read). */
async function findPlanSpace(base: string, cookie: string): Promise<string> {
  const { body } = await getJson<{ jobs: Array<{ spaces: Array<{ id: string }> }> }>(`${base}/api/jobs?limit=100`, cookie);
  for (const job of body.jobs) {
    for (const space of job.spaces) {
      const { body: plan } = await getJson<{ revision: number }>(`${base}/api/spaces/${space.id}/plan`, cookie);
      if (plan.revision > 0) return space.id;
    }
  }
  throw new Error('no demo space has a saved plan');
}

/** Both builds' answer to one GET as `status body`; a difference is written out and stops the run. */
async function sameAnswer(base: string, other: string, url: string, cookie: string, role: string): Promise<string> {
  const [a, b] = await Promise.all(
    [base, other].map(async (server) => {
      const res = await fetch(`${server}${url}`, { headers: { cookie } });
      return `${res.status} ${await res.text()}`;
    }),
  );
  if (a !== b) {
    fs.writeFileSync(path.join(REPO_ROOT, 'test-output', 'bench-answer-this.txt'), a);
    fs.writeFileSync(path.join(REPO_ROOT, 'test-output', 'bench-answer-base.txt'), b);
    throw new Error(`GET ${url} as ${role}: this build and --base answer differently (test-output/bench-answer-*.txt)`);
  }
  return a;
}

// Job-list queries whose answers must match: every sort both ways, searches (a reference, a
// customer, a town, LIKE's own characters), a stage and an installer filter, each followed page by
// page through its cursors.
function jobListQueries(installerId: string): string[] {
  const sorts = ['updated', 'created', 'stage', 'customer', 'installDate'].flatMap((sort) => ['asc', 'desc'].map((dir) => `sort=${sort}&dir=${dir}`));
  const searches = [
    'q=JOB',
    'q=demo',
    'q=e',
    'q=%25',
    'q=_',
    'q=nothing-matches-this',
    'stage=surveyed',
    'stage=quoted&sort=customer&dir=asc',
    `installerId=${installerId}`,
  ];
  return [...sorts, ...searches].map((q) => `${q}&limit=2`);
}

/**
 * The comparison with --base means something only when both builds answer the same: every demo
 * space's plan read, as each demo role (prices stripped for the installer, 404 where not assigned),
 * and the jobs list for a range of sorts, searches, filters and cursors, byte for byte with the
 * same status.
 */
async function sameAnswers(base: string, other: string, officeCookie: string) {
  const { body } = await getJson<{ jobs: Array<{ spaces: Array<{ id: string }>; assignedInstaller: { id: string } | null }> }>(
    `${base}/api/jobs?limit=100`,
    officeCookie,
  );
  const spaceIds = body.jobs.flatMap((j) => j.spaces.map((s) => s.id));
  const installerId = body.jobs.find((j) => j.assignedInstaller)?.assignedInstaller?.id ?? '00000000-0000-4000-8000-000000000000';
  let plans = 0;
  let lists = 0;
  for (const role of ['office', 'estimator', 'installer']) {
    const cookie = await signIn(base, `${role}@demo.example.com`);
    for (const id of spaceIds) {
      await sameAnswer(base, other, `/api/spaces/${id}/plan`, cookie, role);
      plans++;
    }
    for (const q of jobListQueries(installerId)) {
      let cursor: string | null = null;
      do {
        const answer = await sameAnswer(base, other, `/api/jobs?${q}${cursor ? `&cursor=${encodeURIComponent(cursor)}` : ''}`, cookie, role);
        lists++;
        const page = answer.startsWith('200 ') ? (JSON.parse(answer.slice(4)) as { nextCursor: string | null }) : null;
        cursor = page?.nextCursor ?? null;
      } while (cursor);
    }
  }
  console.log(`same answers from both builds: ${plans} plan reads (${spaceIds.length} spaces × 3 roles), ${lists} job-list pages`);
}

// autocannon spreads connections round-robin over several URLs (connection i → urls[i % n]); its
// types only declare one.
const over = (urls: string[]) => urls as unknown as string;

interface Target {
  name: string;
  urls: string[];
  cookie: string;
  /** The processes answering (their CPU time is read around each run). */
  pids: number[];
}

async function measure(t: Target, rate: number | null): Promise<Omit<Row, 'instances' | 'target'>> {
  const load = loadavg()[0];
  const ticksBefore = t.pids.reduce((n, pid) => n + cpuTicks(pid), 0);
  const dbTicksBefore = clusterTicks();
  const headers: Record<string, string> = t.cookie ? { cookie: t.cookie } : {};
  // A fixed rate is paced evenly (scripts/paced-load.ts says why not autocannon's); flat out is autocannon's closed loop.
  const r = rate
    ? await pacedLoad({ urls: t.urls, headers, rate, seconds, connections })
    : await autocannon({ url: over(t.urls), connections, duration: seconds, headers }).then((a) => ({
        rps: a.requests.average,
        p50: a.latency.p50,
        p99: a.latency.p99,
        bad: a.non2xx + a.errors + a.timeouts,
        total: a.requests.total,
      }));
  const ticks = t.pids.reduce((n, pid) => n + cpuTicks(pid), 0) - ticksBefore;
  const perRequest = (n: number) => (r.total ? (n / TICKS_PER_SECOND / r.total) * 1e6 : 0);
  const cpuUs = perRequest(ticks);
  const dbCpuUs = perRequest(clusterTicks() - dbTicksBefore);
  return { rate, rps: r.rps, p50: r.p50, p99: r.p99, bad: r.bad, load, cpuUs, dbCpuUs };
}

async function main() {
  fs.mkdirSync(path.join(REPO_ROOT, 'test-output'), { recursive: true });
  if (profile) fs.mkdirSync(PROFILE_DIR, { recursive: true });
  const pg = await ensurePgRunning();
  dropDatabase(DB);
  ensureDatabase(DB);
  const db = databaseUrl(DB);
  const serverMain = await buildServer({ log: (m: string) => console.log(`[build] ${m}`) });
  const loadBefore = loadavg();
  const rows: Row[] = [];
  const servers: Array<{ base: string; child: ChildProcess }> = [];
  const baseServers: Array<{ base: string; child: ChildProcess }> = [];
  const bares: Array<{ base: string; child: ChildProcess }> = [];
  let planBytes = 0;
  let jobsBytes = 0;
  try {
    for (const count of instanceCounts) {
      while (servers.length < count) servers.push(await startServer(servers.length + 1, { seed: servers.length === 0, serverMain, db }));
      const cookie = await signIn(servers[0].base);
      const spaceId = await findPlanSpace(servers[0].base, cookie);
      const plan = await getJson<unknown>(`${servers[0].base}/api/spaces/${spaceId}/plan`, cookie);
      jobsBytes = (await getJson<unknown>(`${servers[0].base}/api/jobs`, cookie)).bytes;
      planBytes = plan.bytes;
      const bodyFile = path.join(REPO_ROOT, 'test-output', 'bench-plan-body.json');
      fs.writeFileSync(bodyFile, JSON.stringify(plan.body));
      while (bares.length < count) bares.push(await startBare(bares.length + 1, bodyFile));
      if (baseMain)
        while (baseServers.length < count) baseServers.push(await startServer(`base-${baseServers.length + 1}`, { seed: false, serverMain: baseMain, db }));
      const target = (name: string, procs: Array<{ base: string; child: ChildProcess }>, route: string, c: string): Target => ({
        name,
        urls: procs.slice(0, count).map((p) => `${p.base}${route}`),
        cookie: c,
        pids: procs.slice(0, count).map((p) => p.child.pid!),
      });
      const planRoute = `/api/spaces/${spaceId}/plan`;
      const targets: Target[] = [
        target('bare handler', bares, '/bare', ''),
        ...(only.includes('jobs') ? [target('GET /api/jobs', servers, '/api/jobs', cookie)] : []),
        ...(only.includes('jobs') && baseMain ? [target('GET /api/jobs (base)', baseServers, '/api/jobs', cookie)] : []),
        ...(only.includes('plan') ? [target('GET /api/spaces/:id/plan', servers, planRoute, cookie)] : []),
        ...(only.includes('plan') && baseMain ? [target('GET /api/spaces/:id/plan (base)', baseServers, planRoute, cookie)] : []),
      ];
      if (baseMain) await sameAnswers(servers[0].base, baseServers[0].base, cookie);
      for (const t of targets) await autocannon({ url: over(t.urls), connections, duration: 2, headers: t.cookie ? { cookie: t.cookie } : {} }); // warm up
      // Rounds interleave the targets (each round starting one further along), so a change in the
      // machine's load during the run falls on all of them alike; each row is the median of its rounds.
      for (const rate of [...rates, null]) {
        const runs = new Map<string, Array<Omit<Row, 'instances' | 'target'>>>();
        for (let round = 0; round < repeat; round++) {
          for (let i = 0; i < targets.length; i++) {
            const t = targets[(i + round) % targets.length];
            const run = await measure(t, rate);
            runs.set(t.name, [...(runs.get(t.name) ?? []), run]);
            console.log(
              `${count} instance(s) ${t.name} at ${rate ?? 'max'} (round ${round + 1}): ${run.rps.toFixed(0)} req/s, p99 ${run.p99} ms, ${run.cpuUs.toFixed(0)} µs node + ${run.dbCpuUs.toFixed(0)} µs PostgreSQL CPU/request`,
            );
          }
        }
        for (const t of targets) rows.push({ instances: count, target: t.name, ...medianOf(runs.get(t.name)!) });
      }
    }
  } finally {
    await Promise.all(children.map(stopProcess));
  }
  const loadAfter = loadavg();
  printTable(rows);
  console.log(
    `\nanswers: plan ${(planBytes / 1024).toFixed(1)} kB, jobs list ${(jobsBytes / 1024).toFixed(1)} kB; ${connections} connections, ${seconds} s per run, median of ${repeat} interleaved round(s)`,
  );
  console.log(`load average before ${loadBefore.map((l) => l.toFixed(2)).join(' ')}, after ${loadAfter.map((l) => l.toFixed(2)).join(' ')}`);
  if (profile) console.log(`CPU profiles in ${path.relative(REPO_ROOT, PROFILE_DIR)}/`);
  dropDatabase(DB);
  if (pg.startedHere) stopPg();
}

main().catch(async (e) => {
  console.error(e);
  await Promise.all(children.map(stopProcess));
  process.exit(1);
});
