// Builds the client with Vite when dist/ is missing or older than its sources.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { REPO_ROOT } from './pg.mjs';

const SOURCES = ['src', 'shared', 'public', 'index.html', 'vite.config.ts', 'tailwind.config.ts', 'package.json'];

/** The newest modification time under a file or folder (ms), 0 when it does not exist; the build scripts' staleness test. */
export function newestMtime(p) {
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

function copyTree(from, to, skip) {
  fs.mkdirSync(to, { recursive: true });
  for (const e of fs.readdirSync(from, { withFileTypes: true })) {
    const src = path.join(from, e.name);
    const dst = path.join(to, e.name);
    if (skip(src)) continue;
    if (e.isDirectory()) copyTree(src, dst, skip);
    else fs.copyFileSync(src, dst);
  }
}

function listFiles(dir) {
  if (!fs.existsSync(dir)) return [];
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? listFiles(path.join(dir, e.name)) : [path.join(dir, e.name)]));
}

/**
 * Runs `vite build` (when stale, or always with force). Throws when the build fails.
 *
 * Builds into a private folder, then merges into dist/ with index.html replaced last (atomically),
 * keeping the previous build's hashed assets for a while: several test runs and servers share this
 * work tree, and a page loaded from the old index.html must still find its scripts.
 */
export function buildClient({ force = false, log = (m) => process.stderr.write(`${m}\n`) } = {}) {
  if (!force && !clientIsStale()) {
    log('[build] dist/ is up to date');
    return false;
  }
  log('[build] building the client with Vite ...');
  const started = Date.now();
  const dist = path.join(REPO_ROOT, 'dist');
  const tmp = path.join(REPO_ROOT, 'node_modules', '.cache', `quiltline-build-${process.pid}`);
  fs.rmSync(tmp, { recursive: true, force: true });
  try {
    const r = spawnSync(path.join(REPO_ROOT, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'warn', '--outDir', tmp, '--emptyOutDir'], {
      cwd: REPO_ROOT,
      stdio: 'inherit',
    });
    if (r.status !== 0) throw new Error(`vite build failed (exit ${r.status})`);
    const indexHtml = path.join(tmp, 'index.html');
    copyTree(tmp, dist, (src) => src === indexHtml);
    const staged = path.join(dist, `.index-${process.pid}.html`);
    fs.copyFileSync(indexHtml, staged);
    fs.renameSync(staged, path.join(dist, 'index.html'));
    // Old hashed assets go once they are an hour old and not part of this build.
    const fresh = new Set(listFiles(tmp).map((f) => path.relative(tmp, f)));
    for (const f of listFiles(path.join(dist, 'assets'))) {
      if (!fresh.has(path.relative(dist, f)) && Date.now() - fs.statSync(f).mtimeMs > 3600_000) fs.rmSync(f, { force: true });
    }
  } finally {
    fs.rmSync(tmp, { recursive: true, force: true });
  }
  log(`[build] done in ${((Date.now() - started) / 1000).toFixed(1)} s`);
  return true;
}
