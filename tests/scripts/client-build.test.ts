/**
 * scripts/client-build.mjs: the client is rebuilt when its sources changed since the build in
 * CLIENT_DIST (default ./dist), and only then; `npm start` (scripts/start.mjs) serves the
 * client from CLIENT_DIST without rebuilding a current one.
 *
 * The build tests run in a throwaway project whose `vite` is a stand-in script (it writes
 * index.html into --outDir and counts its runs), so they take milliseconds, not a real build.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { ROOT, STAMP, clientDist, clientIsStale, clientSourceHash, ensureClientBuilt, staleReason } from '../../scripts/client-build.mjs';

const FAKE_VITE = `
const fs = require('node:fs'); const path = require('node:path');
const out = process.argv[process.argv.indexOf('--outDir') + 1];
fs.mkdirSync(out, { recursive: true });
fs.writeFileSync(path.join(out, 'index.html'), '<!doctype html><title>built</title>');
const counter = path.join(process.cwd(), 'builds.txt');
fs.writeFileSync(counter, String((fs.existsSync(counter) ? Number(fs.readFileSync(counter, 'utf8')) : 0) + 1));
`;

const temps: string[] = [];
afterEach(() => {
  for (const d of temps.splice(0)) rmSync(d, { recursive: true, force: true });
});

/** A project with client sources and a stand-in vite. */
function project(): string {
  const root = mkdtempSync(path.join(tmpdir(), 'trestle-client-build-'));
  temps.push(root);
  mkdirSync(path.join(root, 'src'), { recursive: true });
  mkdirSync(path.join(root, 'shared'), { recursive: true });
  mkdirSync(path.join(root, 'node_modules', 'vite', 'bin'), { recursive: true });
  writeFileSync(path.join(root, 'package.json'), '{"name":"p","private":true}');
  writeFileSync(path.join(root, 'node_modules', 'vite', 'package.json'), '{"name":"vite","version":"0.0.0"}');
  writeFileSync(path.join(root, 'node_modules', 'vite', 'bin', 'vite.js'), FAKE_VITE);
  writeFileSync(path.join(root, 'index.html'), '<div id="app"></div>');
  writeFileSync(path.join(root, 'src', 'main.ts'), 'console.log(1);\n');
  writeFileSync(path.join(root, 'shared', 'units.ts'), 'export const g = 9.80665;\n');
  return root;
}
const builds = (root: string) => Number(readFileSync(path.join(root, 'builds.txt'), 'utf8'));

describe('client build (scripts/client-build.mjs)', () => {
  it('builds when the client is missing, then not again while the sources are the same', () => {
    const root = project();
    const dist = path.join(root, 'dist');
    expect(staleReason(root, dist)).toMatch(/index\.html is missing/);
    expect(ensureClientBuilt(root, dist)).not.toBeNull();
    expect(builds(root)).toBe(1);
    expect(readFileSync(path.join(dist, STAMP), 'utf8').trim()).toBe(clientSourceHash(root));
    expect(clientIsStale(root, dist)).toBe(false);
    expect(ensureClientBuilt(root, dist)).toBeNull();
    expect(builds(root)).toBe(1);
  });

  it('rebuilds when a client source is newer than the build (edited after it)', () => {
    const root = project();
    const dist = path.join(root, 'dist');
    ensureClientBuilt(root, dist);
    writeFileSync(path.join(root, 'src', 'main.ts'), 'console.log(2);\n');
    expect(staleReason(root, dist)).toMatch(/sources changed/);
    ensureClientBuilt(root, dist);
    expect(builds(root)).toBe(2);
    // a shared module is a client source too (the client imports shared/)
    writeFileSync(path.join(root, 'shared', 'units.ts'), 'export const g = 9.81;\n');
    expect(clientIsStale(root, dist)).toBe(true);
  });

  it('judges by content: touching a file without changing it does not rebuild', () => {
    const root = project();
    const dist = path.join(root, 'dist');
    ensureClientBuilt(root, dist);
    const later = new Date(Date.now() + 60_000);
    utimesSync(path.join(root, 'src', 'main.ts'), later, later);
    expect(clientIsStale(root, dist)).toBe(false);
  });

  it('rebuilds a client built by hand (no stamp) and a forced rebuild', () => {
    const root = project();
    const dist = path.join(root, 'dist');
    mkdirSync(dist);
    writeFileSync(path.join(dist, 'index.html'), 'old');
    expect(staleReason(root, dist)).toMatch(/no \.source-hash/);
    ensureClientBuilt(root, dist);
    expect(ensureClientBuilt(root, dist, { force: true })).toBe('a rebuild was asked for');
    expect(builds(root)).toBe(2);
  });

  it('takes the folder from CLIENT_DIST, relative to the project root, default ./dist', () => {
    expect(clientDist('/p', {})).toBe(path.resolve('/p', 'dist'));
    expect(clientDist('/p', { CLIENT_DIST: '/tmp/dist-x' })).toBe('/tmp/dist-x');
    expect(clientDist('/p', { CLIENT_DIST: 'build/client' })).toBe(path.resolve('/p', 'build/client'));
  });
});

async function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const srv = createServer();
    srv.listen(0, '127.0.0.1', () => {
      const a = srv.address();
      const port = typeof a === 'object' && a ? a.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

describe('npm start (scripts/start.mjs)', () => {
  let child: ChildProcess | null = null;
  afterEach(() => {
    if (child && child.exitCode === null) child.kill('SIGTERM');
    child = null;
  });

  it('serves the client in CLIENT_DIST without rebuilding it when it was built from the current sources', async () => {
    const dist = mkdtempSync(path.join(tmpdir(), 'trestle-start-dist-'));
    const data = mkdtempSync(path.join(tmpdir(), 'trestle-start-data-'));
    temps.push(dist, data);
    writeFileSync(path.join(dist, 'index.html'), '<!doctype html><title>current build marker</title>');
    writeFileSync(path.join(dist, STAMP), clientSourceHash(ROOT) + '\n');
    const port = await freePort();
    let output = '';
    child = spawn(process.execPath, ['scripts/start.mjs'], {
      cwd: ROOT,
      env: { ...process.env, CLIENT_DIST: dist, PORT: String(port), HOST: '127.0.0.1', DATA_DIR: data, NODE_ENV: 'test', LOG_LEVEL: 'warn', SEED_DEMO: 'false' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    child.stdout!.on('data', (d) => (output += String(d)));
    child.stderr!.on('data', (d) => (output += String(d)));
    let body = '';
    for (let i = 0; i < 120 && !body; i++) {
      await new Promise((r) => setTimeout(r, 500));
      try {
        const res = await fetch(`http://127.0.0.1:${port}/`);
        if (res.ok) body = await res.text();
      } catch {
        /* not listening yet */
      }
    }
    expect(body, output).toContain('current build marker');
    expect(output).not.toMatch(/Building the client/);
  }, 90_000);
});

describe('npm start in a project whose client is stale', () => {
  /** The throwaway project with the real start script and a stand-in server (tsx) that only says it started. */
  function startProject(): string {
    const root = project();
    mkdirSync(path.join(root, 'scripts'));
    for (const f of ['start.mjs', 'client-build.mjs']) copyFileSync(path.join(ROOT, 'scripts', f), path.join(root, 'scripts', f));
    mkdirSync(path.join(root, 'node_modules', 'tsx', 'dist'), { recursive: true });
    writeFileSync(path.join(root, 'node_modules', 'tsx', 'package.json'), '{"name":"tsx","version":"0.0.0"}');
    writeFileSync(path.join(root, 'node_modules', 'tsx', 'dist', 'cli.mjs'), "console.log('server started with', process.argv.slice(2).join(' '));\n");
    return root;
  }
  const start = (root: string, dist: string) =>
    spawnSync(process.execPath, [path.join(root, 'scripts', 'start.mjs')], { cwd: root, env: { ...process.env, CLIENT_DIST: dist }, encoding: 'utf8' });

  it('builds into CLIENT_DIST when the sources are newer than the build, then starts the server; not again when current', () => {
    const root = startProject();
    const dist = path.join(root, 'out', 'client');
    const first = start(root, dist);
    expect(first.status, first.stderr).toBe(0);
    expect(first.stdout).toMatch(/Building the client with Vite \(.*index\.html is missing\)/);
    expect(first.stdout).toContain('server started with server/index.ts');
    expect(existsSync(path.join(dist, 'index.html'))).toBe(true);
    expect(existsSync(path.join(root, 'dist'))).toBe(false); // CLIENT_DIST, not ./dist
    const again = start(root, dist);
    expect(again.stdout).not.toMatch(/Building the client/);
    writeFileSync(path.join(root, 'src', 'main.ts'), 'console.log(3);\n');
    const edited = start(root, dist);
    expect(edited.stdout).toMatch(/Building the client with Vite \(the client sources changed since the last build\)/);
    expect(builds(root)).toBe(2);
  });
});
