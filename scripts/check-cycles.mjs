#!/usr/bin/env node
// Fails when server/ has an import cycle. Two levels: files (any cycle at all) and domain modules
// (server/modules/<name>/ counted as one node, so two modules that import each other through
// different files still count). Type-only imports are skipped (they vanish at run time, and the
// Sequelize models name each other's types for their associations).
import fs from 'node:fs';
import path from 'node:path';
import ts from 'typescript';

const ROOT = path.resolve(path.dirname(new URL(import.meta.url).pathname), '..');

// Module edges allowed to sit in a cycle: none. The list may only shrink: an edge in a cycle that is
// not listed fails, and so does a listed edge that is no longer in a cycle. Written "from -> to".
const ALLOWED_MODULE_EDGES = new Set([]);

function listFiles(dir) {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = path.join(dir, e.name);
    if (e.isDirectory()) return listFiles(p);
    return /\.tsx?$/.test(e.name) && !e.name.endsWith('.d.ts') ? [p] : [];
  });
}

function resolve(from, spec) {
  const base = path.resolve(path.dirname(from), spec.replace(/\.js$/, ''));
  for (const c of [base, `${base}.ts`, `${base}.tsx`, path.join(base, 'index.ts')]) {
    if (fs.existsSync(c) && fs.statSync(c).isFile()) return c;
  }
  return null;
}

/** Specifiers of the imports and re-exports of a file that bring in values (not only types). */
function valueImports(file) {
  const sf = ts.createSourceFile(file, fs.readFileSync(file, 'utf8'), ts.ScriptTarget.Latest, false);
  const specs = [];
  const visit = (node) => {
    if (ts.isImportDeclaration(node) && ts.isStringLiteral(node.moduleSpecifier)) {
      const c = node.importClause;
      const typeOnly =
        c && (c.isTypeOnly || (!c.name && c.namedBindings && ts.isNamedImports(c.namedBindings) && c.namedBindings.elements.every((e) => e.isTypeOnly)));
      if (!typeOnly) specs.push(node.moduleSpecifier.text);
    } else if (ts.isExportDeclaration(node) && node.moduleSpecifier && ts.isStringLiteral(node.moduleSpecifier)) {
      const typeOnly = node.isTypeOnly || (node.exportClause && ts.isNamedExports(node.exportClause) && node.exportClause.elements.every((e) => e.isTypeOnly));
      if (!typeOnly) specs.push(node.moduleSpecifier.text);
    } else if (ts.isCallExpression(node) && node.expression.kind === ts.SyntaxKind.ImportKeyword && ts.isStringLiteral(node.arguments[0])) {
      specs.push(node.arguments[0].text);
    }
    ts.forEachChild(node, visit);
  };
  visit(sf);
  return specs;
}

/** Strongly connected components with more than one node (Tarjan), each as a Set. */
function cyclicComponents(graph) {
  let index = 0;
  const idx = new Map();
  const low = new Map();
  const stack = [];
  const onStack = new Set();
  const out = [];
  const visit = (v) => {
    idx.set(v, index);
    low.set(v, index++);
    stack.push(v);
    onStack.add(v);
    for (const w of graph.get(v) ?? []) {
      if (!idx.has(w)) {
        visit(w);
        low.set(v, Math.min(low.get(v), low.get(w)));
      } else if (onStack.has(w)) low.set(v, Math.min(low.get(v), idx.get(w)));
    }
    if (low.get(v) === idx.get(v)) {
      const comp = new Set();
      let w;
      do {
        w = stack.pop();
        onStack.delete(w);
        comp.add(w);
      } while (w !== v);
      if (comp.size > 1) out.push(comp);
    }
  };
  for (const v of graph.keys()) if (!idx.has(v)) visit(v);
  return out;
}

const rel = (f) => path.relative(ROOT, f).replace(/\.tsx?$/, '');
const moduleOf = (f) => {
  const m = /^server\/modules\/([^/]+)\//.exec(path.relative(ROOT, f));
  return m ? m[1] : null;
};

const files = listFiles(path.join(ROOT, 'server'));
const fileGraph = new Map();
const moduleGraph = new Map();
for (const f of files) {
  const deps = new Set();
  for (const fileName of valueImports(f)) {
    if (!fileName.startsWith('.')) continue;
    const target = resolve(f, fileName);
    if (target && target.startsWith(path.join(ROOT, 'server'))) deps.add(target);
  }
  fileGraph.set(f, deps);
  const from = moduleOf(f);
  if (!from) continue;
  if (!moduleGraph.has(from)) moduleGraph.set(from, new Set());
  for (const d of deps) {
    const to = moduleOf(d);
    if (to && to !== from) moduleGraph.get(from).add(to);
  }
}

const problems = [];
for (const comp of cyclicComponents(fileGraph)) {
  if (new Set([...comp].map(moduleOf)).size > 1) continue; // reported below, by module
  problems.push(`file cycle: ${[...comp].map(rel).join(', ')}`);
}
const cyclicEdges = new Set();
for (const comp of cyclicComponents(moduleGraph)) {
  for (const from of comp) for (const to of moduleGraph.get(from)) if (comp.has(to)) cyclicEdges.add(`${from} -> ${to}`);
}
for (const e of [...cyclicEdges].sort()) {
  if (!ALLOWED_MODULE_EDGES.has(e)) problems.push(`module cycle edge not allowed: ${e}`);
}
for (const e of ALLOWED_MODULE_EDGES) {
  if (!cyclicEdges.has(e)) problems.push(`allowed edge "${e}" is no longer in a cycle: delete it from ALLOWED_MODULE_EDGES in scripts/check-cycles.mjs`);
}
if (process.argv.includes('--print')) for (const e of [...cyclicEdges].sort()) console.log(e);
if (problems.length) {
  for (const p of problems) console.error(p);
  process.exit(1);
}
console.log(`no import cycles in server/ (${files.length} files; ${ALLOWED_MODULE_EDGES.size} allowed module edges left)`);
