#!/usr/bin/env node
// `npm test`: the static checks (ESLint, server import cycles, tsc, Prettier, knip, file length)
// and then every vitest project (unit, server, browser), with one closing line `N passed, N failed`
// in which each check counts as one test. A failing check prints its output.
// Installs npm packages when node_modules is absent, ensures PostgreSQL and chromium (apt-get when
// root and absent), builds the client (browser tests need dist/), runs vitest with a JSON report.
// Extra arguments go to vitest and skip the static checks, e.g. `npm test -- tests/server`.
import { spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { buildClient } from './client-build.mjs';
import { REPO_ROOT, ensureChromium, ensurePgInstalled } from './pg.mjs';
import { summarise } from './test-summary.mjs';

const log = (m) => process.stderr.write(`[test] ${m}\n`);
const started = Date.now();
const reportFile = path.join(REPO_ROOT, 'test-output', 'vitest.json');
const vitestArgs = process.argv.slice(2);
const bin = (name) => path.join(REPO_ROOT, 'node_modules', '.bin', name);

const CHECKS = [
  { name: 'ESLint', cmd: bin('eslint'), args: ['--cache', '--cache-location', 'node_modules/.cache/eslint/', '.'] },
  { name: 'server import cycles', cmd: process.execPath, args: ['scripts/check-cycles.mjs'] },
  { name: 'tsc --noEmit', cmd: bin('tsc'), args: ['--noEmit', '-p', 'tsconfig.json'] },
  { name: 'prettier --check', cmd: bin('prettier'), args: ['--check', '--log-level', 'warn', '.'] },
  { name: 'knip', cmd: bin('knip'), args: ['--no-progress'] },
  { name: 'no source file over 400 lines', cmd: process.execPath, args: ['scripts/check-file-length.mjs'] },
];

function finish(passed, failed, note) {
  if (note) log(note);
  log(`took ${((Date.now() - started) / 1000).toFixed(1)} s`);
  console.log(`${passed} passed, ${failed} failed`);
  process.exit(failed > 0 ? 1 : 0);
}

/** Runs one check with its output captured; resolves to { ok, output, seconds }. */
function runCheck({ cmd, args }) {
  const t0 = Date.now();
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { cwd: REPO_ROOT, env: { ...process.env, FORCE_COLOR: '0' } });
    let output = '';
    child.stdout.on('data', (d) => (output += d));
    child.stderr.on('data', (d) => (output += d));
    child.on('error', (e) => resolve({ ok: false, output: `${output}${e.message}\n`, seconds: (Date.now() - t0) / 1000 }));
    child.on('close', (code, signal) =>
      resolve({ ok: code === 0, output: code === 0 ? output : `${output}(exit ${code ?? signal})\n`, seconds: (Date.now() - t0) / 1000 }),
    );
  });
}

/** The static checks, two at a time (the CI box has two cores); each result printed in list order. */
async function runChecks() {
  const results = new Array(CHECKS.length);
  let next = 0;
  const worker = async () => {
    while (next < CHECKS.length) {
      const i = next++;
      results[i] = await runCheck(CHECKS[i]);
    }
  };
  await Promise.all([worker(), worker()]);
  let passed = 0;
  let failed = 0;
  CHECKS.forEach((c, i) => {
    const r = results[i];
    if (r.ok) {
      passed++;
      log(`check passed: ${c.name} (${r.seconds.toFixed(1)} s)`);
    } else {
      failed++;
      log(`check FAILED: ${c.name} (${r.seconds.toFixed(1)} s):`);
      process.stderr.write(r.output.trimEnd() + '\n');
    }
  });
  return { passed, failed };
}

try {
  if (!fs.existsSync(bin('vitest'))) {
    log('node_modules is missing: npm install');
    const r = spawnSync('npm', ['install'], { cwd: REPO_ROOT, stdio: 'inherit' });
    if (r.status !== 0) throw new Error('npm install failed');
  }
} catch (e) {
  console.error(`[test] ${e.message}`);
  finish(0, 1, 'could not prepare the test run');
}

let checks = { passed: 0, failed: 0 };
if (vitestArgs.length === 0) checks = await runChecks();
else log(`arguments given (${vitestArgs.join(' ')}): vitest only, no static checks`);

try {
  ensurePgInstalled();
  ensureChromium();
  buildClient();
} catch (e) {
  console.error(`[test] ${e.message}`);
  finish(checks.passed, checks.failed + 1, 'could not prepare the test run');
}

fs.mkdirSync(path.dirname(reportFile), { recursive: true });
fs.rmSync(reportFile, { force: true });
const vitest = spawnSync(bin('vitest'), ['run', '--reporter=default', '--reporter=json', `--outputFile=${reportFile}`, ...vitestArgs], {
  cwd: REPO_ROOT,
  stdio: 'inherit',
  env: { ...process.env, NODE_ENV: 'test' },
});

if (!fs.existsSync(reportFile)) {
  finish(checks.passed, checks.failed + 1, `vitest wrote no report (exit ${vitest.status ?? vitest.signal}); see its output above`);
}
const report = JSON.parse(fs.readFileSync(reportFile, 'utf8'));
const { passed, failed, brokenFiles, unexplainedExit } = summarise(report, vitest.status ?? 1);
for (const f of brokenFiles) log(`file failed without a failing test: ${path.relative(REPO_ROOT, f.name)}: ${String(f.message).split('\n')[0]}`);
if (unexplainedExit) log(`vitest exited with ${vitest.status ?? vitest.signal} although no test failed (an unhandled error?)`);
if (checks.failed) log(`${checks.failed} static check(s) failed: see "check FAILED" above`);
finish(passed + checks.passed, failed + checks.failed);
