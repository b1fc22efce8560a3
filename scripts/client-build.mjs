// Builds the client with Vite when dist/ is missing or older than its sources.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { REPO_ROOT } from './pg.mjs';

const SOURCES = ['src', 'shared', 'public', 'index.html', 'vite.config.ts', 'tailwind.config.ts', 'package.json'];

function newestMtime(p) {
  if (!fs.existsSync(p)) return 0;
  const st = fs.statSync(p);
  if (!st.isDirectory()) return st.mtimeMs;
  let newest = st.mtimeMs;
  for (const e of fs.readdirSync(p)) newest = Math.max(newest, newestMtime(path.join(p, e)));
  return newest;
}

/** Whether dist/index.html is missing or older than any client source. */
export function clientIsStale() {
  const built = path.join(REPO_ROOT, 'dist', 'index.html');
  if (!fs.existsSync(built)) return true;
  const builtAt = fs.statSync(built).mtimeMs;
  return SOURCES.some((s) => newestMtime(path.join(REPO_ROOT, s)) > builtAt);
}

/** Runs `vite build` (when stale, or always with force). Throws when the build fails. */
export function buildClient({ force = false, log = (m) => process.stderr.write(`${m}\n`) } = {}) {
  if (!force && !clientIsStale()) {
    log('[build] dist/ is up to date');
    return false;
  }
  log('[build] building the client with Vite ...');
  const started = Date.now();
  const r = spawnSync(path.join(REPO_ROOT, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'warn'], { cwd: REPO_ROOT, stdio: 'inherit' });
  if (r.status !== 0) throw new Error(`vite build failed (exit ${r.status})`);
  log(`[build] done in ${((Date.now() - started) / 1000).toFixed(1)} s`);
  return true;
}
