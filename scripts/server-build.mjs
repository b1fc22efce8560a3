// Compiles the server (server/ with the shared/ code it imports) and the payments stand-in into
// dist-server/ with esbuild, so `npm start` runs them with plain node. npm packages stay external:
// they are loaded from node_modules at run time, as the dependencies in package.json.
// Rebuilds only when dist-server/ is missing or older than its sources.
import fs from 'node:fs';
import path from 'node:path';
import { newestMtime } from './client-build.mjs';
import { REPO_ROOT } from './pg.mjs';

const OUT_DIR = path.join(REPO_ROOT, 'dist-server');
const ENTRIES = { index: 'server/index.ts', migrate: 'server/migrate.ts', 'fake-payments': 'scripts/fake-payments.ts' };
const SOURCES = ['server', 'shared', 'scripts/fake-payments.ts', 'scripts/server-build.mjs', 'package.json', 'tsconfig.json'];
const STAMP = path.join(OUT_DIR, '.built');

/** Whether dist-server/ is missing or older than any server source. */
export function serverIsStale() {
  if (!fs.existsSync(STAMP) || Object.keys(ENTRIES).some((n) => !fs.existsSync(path.join(OUT_DIR, `${n}.js`)))) return true;
  const builtAt = fs.statSync(STAMP).mtimeMs;
  return SOURCES.some((s) => newestMtime(path.join(REPO_ROOT, s)) > builtAt);
}

/** dist-server/<entry>.js for each entry; returns the file of the API server. */
export async function buildServer({ force = false, log = (m) => process.stderr.write(`[build] ${m}\n`) } = {}) {
  const main = path.join(OUT_DIR, 'index.js');
  if (!force && !serverIsStale()) return main;
  let esbuild;
  try {
    esbuild = await import('esbuild');
  } catch {
    if (fs.existsSync(main)) {
      log('dist-server/ may be older than the sources, but esbuild (a dev dependency) is not installed: running it as built');
      return main;
    }
    throw new Error('dist-server/ is missing and esbuild is not installed: run `npm install` (with dev dependencies), then `npm run build`');
  }
  const started = Date.now();
  fs.rmSync(OUT_DIR, { recursive: true, force: true });
  await esbuild.build({
    absWorkingDir: REPO_ROOT,
    entryPoints: ENTRIES,
    outdir: OUT_DIR,
    bundle: true,
    packages: 'external',
    platform: 'node',
    format: 'esm',
    target: 'node20.19',
    sourcemap: true,
    // Two modules may declare the same top-level name, which esbuild then renames; Sequelize takes a
    // model's name from its class, so class and function names are kept as written.
    keepNames: true,
    logLevel: 'warning',
  });
  // esbuild keeps a service process for further builds: end it, this process goes on as the launcher.
  await esbuild.stop();
  fs.writeFileSync(STAMP, `${new Date().toISOString()}\n`);
  log(`server compiled into dist-server/ in ${Date.now() - started} ms`);
  return main;
}

// `node scripts/server-build.mjs` (npm run build): always rebuild.
if (import.meta.url === `file://${process.argv[1]}`) {
  buildServer({ force: true }).catch((e) => {
    console.error(`[build] ${e.message}`);
    process.exit(1);
  });
}
