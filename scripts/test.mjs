#!/usr/bin/env node
// `npm test`: every test (unit, API, browser) with one closing line `N passed, N failed`.
// Installs npm packages when node_modules is absent, ensures PostgreSQL and chromium (apt-get when
// root and absent), builds the client (browser tests need dist/), runs vitest with a JSON report.
// Extra arguments go to vitest, e.g. `npm test -- tests/server`.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { buildClient } from './client-build.mjs';
import { REPO_ROOT, ensureChromium, ensurePgInstalled } from './pg.mjs';
import { summarise } from './test-summary.mjs';

const log = (m) => process.stderr.write(`[test] ${m}\n`);
const started = Date.now();
const reportFile = path.join(REPO_ROOT, 'test-output', 'vitest.json');

function finish(passed, failed, note) {
  if (note) log(note);
  log(`took ${((Date.now() - started) / 1000).toFixed(1)} s`);
  console.log(`${passed} passed, ${failed} failed`);
  process.exit(failed > 0 ? 1 : 0);
}

try {
  if (!fs.existsSync(path.join(REPO_ROOT, 'node_modules', '.bin', 'vitest'))) {
    log('node_modules is missing: npm install');
    const r = spawnSync('npm', ['install'], { cwd: REPO_ROOT, stdio: 'inherit' });
    if (r.status !== 0) throw new Error('npm install failed');
  }
  ensurePgInstalled();
  ensureChromium();
  buildClient();
} catch (e) {
  console.error(`[test] ${e.message}`);
  finish(0, 1, 'could not prepare the test run');
}

fs.mkdirSync(path.dirname(reportFile), { recursive: true });
fs.rmSync(reportFile, { force: true });
const vitest = spawnSync(
  path.join(REPO_ROOT, 'node_modules', '.bin', 'vitest'),
  ['run', '--reporter=default', '--reporter=json', `--outputFile=${reportFile}`, ...process.argv.slice(2)],
  { cwd: REPO_ROOT, stdio: 'inherit', env: { ...process.env, NODE_ENV: 'test' } },
);

if (!fs.existsSync(reportFile)) {
  finish(0, 1, `vitest wrote no report (exit ${vitest.status ?? vitest.signal}); see its output above`);
}
const report = JSON.parse(fs.readFileSync(reportFile, 'utf8'));
const { passed, failed, brokenFiles, unexplainedExit } = summarise(report, vitest.status ?? 1);
for (const f of brokenFiles) log(`file failed without a failing test: ${path.relative(REPO_ROOT, f.name)}: ${String(f.message).split('\n')[0]}`);
if (unexplainedExit) log(`vitest exited with ${vitest.status ?? vitest.signal} although no test failed (an unhandled error?)`);
finish(passed, failed);
