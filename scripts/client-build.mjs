// The built client and its sources: one place that says whether the client in CLIENT_DIST
// (default ./dist) was built from the current sources, and builds it when not. Used by
// `npm start` (scripts/start.mjs) and the browser-test harness (tests/e2e/harness.ts).
//
// "Built from the current sources" is judged by content, not file times: a build writes a
// SHA-256 of every client source file (paths and bytes) to `<dist>/.source-hash`; the client
// is stale when index.html or that stamp is missing, or the stamp differs from the sources'
// hash now (an edit, a pull, a checkout all change it; touching a file does not).
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
/** What the client build reads (relative to the project root). */
export const CLIENT_SOURCES = ['src', 'shared', 'index.html', 'vite.config.ts', 'public'];
export const STAMP = '.source-hash';

/** Folder of the built client: CLIENT_DIST (relative to the root) or ./dist. */
export function clientDist(root = ROOT, env = process.env) {
  return path.resolve(root, env.CLIENT_DIST || 'dist');
}

/** Every source file under the given paths, sorted (node_modules skipped). */
function sourceFiles(paths) {
  const out = [];
  const visit = (p) => {
    if (!existsSync(p)) return;
    if (statSync(p).isDirectory()) {
      for (const name of readdirSync(p)) if (name !== 'node_modules') visit(path.join(p, name));
    } else out.push(p);
  };
  for (const p of paths) visit(p);
  return out.sort();
}

/** A fingerprint of the client's sources (paths and contents). */
export function clientSourceHash(root = ROOT) {
  const hash = createHash('sha256');
  for (const file of sourceFiles(CLIENT_SOURCES.map((p) => path.join(root, p)))) {
    hash.update(path.relative(root, file).split(path.sep).join('/')).update('\0').update(readFileSync(file)).update('\0');
  }
  return hash.digest('hex');
}

/** Why the built client in `dist` must be rebuilt, or null when it was built from these sources. */
export function staleReason(root = ROOT, dist = clientDist(root)) {
  if (!existsSync(path.join(dist, 'index.html'))) return `${path.relative(root, dist) || dist}/index.html is missing`;
  const stamp = path.join(dist, STAMP);
  if (!existsSync(stamp)) return `${path.relative(root, dist) || dist} has no ${STAMP} (built by hand?)`;
  if (readFileSync(stamp, 'utf8').trim() !== clientSourceHash(root)) return 'the client sources changed since the last build';
  return null;
}

/** True when `dist` is missing or was built from other sources than the current ones. */
export function clientIsStale(root = ROOT, dist = clientDist(root)) {
  return staleReason(root, dist) !== null;
}

/**
 * `vite build` into `dist`, then the stamp. `inherit` shows Vite's output (npm start);
 * otherwise it is captured and returned in the error. Throws when the build fails.
 */
export function buildClient(root = ROOT, dist = clientDist(root), { inherit = false } = {}) {
  const hash = clientSourceHash(root);
  const require = createRequire(path.join(root, 'package.json'));
  const vite = path.join(path.dirname(require.resolve('vite/package.json')), 'bin', 'vite.js');
  const args = [vite, 'build', '--outDir', dist, '--emptyOutDir', ...(inherit ? [] : ['--logLevel', 'warn'])];
  const result = spawnSync(process.execPath, args, { cwd: root, encoding: 'utf8', stdio: inherit ? 'inherit' : 'pipe' });
  if (result.status !== 0) throw new Error(`vite build failed${inherit ? '' : `:\n${result.stdout}\n${result.stderr}`}`);
  writeFileSync(path.join(dist, STAMP), hash + '\n');
}

/** Builds the client unless it is current; returns why it was built, or null. `force` always builds. */
export function ensureClientBuilt(root = ROOT, dist = clientDist(root), { force = false, inherit = false, log = () => {} } = {}) {
  const reason = force ? 'a rebuild was asked for' : staleReason(root, dist);
  if (reason === null) return null;
  log(`Building the client with Vite (${reason})…`);
  buildClient(root, dist, { inherit });
  return reason;
}
