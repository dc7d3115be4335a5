/**
 * Browser-test harness: builds the client when `dist/` was not built from the current sources, starts
 * the real server on a free port with a fresh DATA_DIR (so the demo accounts are seeded),
 * and drives Debian's Chromium through playwright-core.
 *
 * Usage in a test file:
 *   const t = trestleSuite('my feature');        // call at the top of the file
 *   describe.skipIf(!t.enabled)('my feature', () => {
 *     beforeAll(t.setup); afterAll(t.teardown);
 *     it('…', async () => { const page = await t.app.newPage(); await signIn(page, 'engineer@example.com'); … });
 *   });
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { clientDist, clientIsStale as isStale, clientSourceHash, ensureClientBuilt as ensureBuilt } from '../../scripts/client-build.mjs';

export { clientSourceHash };

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const ARTIFACTS_DIR = path.join(ROOT, 'test-artifacts');
export const DEMO_PASSWORD = 'trestle-demo';

const require = createRequire(path.join(ROOT, 'package.json'));

/** True when the browser tests can run; otherwise says why, once, on the console. */
export function chromiumAvailable(suite: string): boolean {
  if (existsSync(CHROMIUM_PATH)) return true;
  console.warn(
    `SKIPPED browser tests "${suite}": Chromium not found at ${CHROMIUM_PATH}. ` +
      'Install it with `apt-get install -y chromium` (or set CHROMIUM_PATH); .ci/run does this.',
  );
  return false;
}

/** Where the client is built and served from (CLIENT_DIST lets parallel work trees of one checkout build their own). */
export const DIST_DIR = clientDist(ROOT);

/** True when the built client is missing or was built from other sources (scripts/client-build.mjs). */
export function clientIsStale(root = ROOT): boolean {
  return isStale(root, clientDist(root));
}

/**
 * Runs `vite build` unless the client was already built from exactly these sources (checked by
 * content, not file times, so CI builds once per run and a local run only after a change).
 * E2E_REBUILD=1 forces a build.
 */
export function ensureClientBuilt(): void {
  ensureBuilt(ROOT, DIST_DIR, { force: process.env.E2E_REBUILD === '1' });
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.unref();
    srv.on('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const address = srv.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

export interface RunningServer {
  baseUrl: string;
  dataDir: string;
  /** Everything the server printed, for failure messages. */
  output: () => string;
  stop: () => Promise<void>;
}

/** Starts `server/index.ts` (via tsx) on a free port with a fresh, seeded DATA_DIR. */
export async function startServer(env: Record<string, string> = {}): Promise<RunningServer> {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'trestle-e2e-data-'));
  const port = await freePort();
  const tsx = path.join(path.dirname(require.resolve('tsx/package.json')), 'dist', 'cli.mjs');
  let log = '';
  const child: ChildProcess = spawn(process.execPath, [tsx, 'server/index.ts'], {
    cwd: ROOT,
    env: { ...process.env, NODE_ENV: 'test', PORT: String(port), HOST: '127.0.0.1', DATA_DIR: dataDir, LOG_LEVEL: 'warn', SEED_DEMO: 'true', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout?.on('data', (d: Buffer) => (log += d.toString()));
  child.stderr?.on('data', (d: Buffer) => (log += d.toString()));
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));

  const baseUrl = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`the server exited with code ${child.exitCode}:\n${log}`);
    try {
      const res = await fetch(`${baseUrl}/api/health`);
      if (res.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) {
      child.kill('SIGKILL');
      throw new Error(`the server did not answer /api/health within 60 s:\n${log}`);
    }
    await new Promise((r) => setTimeout(r, 200));
  }

  return {
    baseUrl,
    dataDir,
    output: () => log,
    stop: async () => {
      if (child.exitCode === null) {
        child.kill('SIGTERM');
        const timer = setTimeout(() => child.kill('SIGKILL'), 8000);
        await exited;
        clearTimeout(timer);
      }
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

export interface RunningBrowser {
  context: BrowserContext;
  close: () => Promise<void>;
}

/** Headless Chromium with a fresh profile. */
export async function launchBrowser(): Promise<RunningBrowser> {
  const profile = mkdtempSync(path.join(tmpdir(), 'trestle-e2e-profile-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM_PATH,
    headless: true,
    viewport: { width: 1280, height: 800 },
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  return {
    context,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** A running app: server + browser, with page helpers bound to its address. */
export interface TrestleApp {
  server: RunningServer;
  browser: RunningBrowser;
  baseUrl: string;
  /** A new tab (fresh cookies are shared across tabs of one context; use `clearSession` between users). */
  newPage: () => Promise<Page>;
  /** Opens a path of the app, e.g. '/projects'. */
  goto: (page: Page, pathname: string) => Promise<void>;
  /** Drops every cookie (signs everyone out). */
  clearSession: () => Promise<void>;
  /** Requests the page made that the server answered with 5xx, for assertions. */
  serverErrors: string[];
  /** Requests to any other origin (fonts, scripts…): the app must make none. */
  externalRequests: string[];
}

export async function startApp(): Promise<TrestleApp> {
  ensureClientBuilt();
  const server = await startServer();
  let browser: RunningBrowser;
  try {
    browser = await launchBrowser();
  } catch (err) {
    await server.stop();
    throw err;
  }
  const serverErrors: string[] = [];
  const externalRequests: string[] = [];
  const app: TrestleApp = {
    server,
    browser,
    baseUrl: server.baseUrl,
    serverErrors,
    externalRequests,
    newPage: async () => {
      const page = await browser.context.newPage();
      // Generous: the machine running the tests may be busy; a real failure still fails.
      page.setDefaultTimeout(30_000);
      page.setDefaultNavigationTimeout(45_000);
      page.on('request', (req) => {
        const url = req.url();
        if (!url.startsWith(server.baseUrl) && !url.startsWith('data:') && !url.startsWith('blob:')) externalRequests.push(url);
      });
      page.on('response', (res) => {
        if (res.status() >= 500) serverErrors.push(`${res.status()} ${res.request().method()} ${res.url()}`);
      });
      return page;
    },
    goto: async (page, pathname) => {
      await page.goto(server.baseUrl + pathname);
    },
    clearSession: () => browser.context.clearCookies(),
  };
  return app;
}

export async function stopApp(app: TrestleApp | undefined): Promise<void> {
  if (!app) return;
  try {
    await app.browser.close();
  } finally {
    await app.server.stop();
  }
}

/**
 * Signs in through the sign-in screen (dropping any earlier session first, so a failed test
 * cannot leave the next one signed in) and waits for the app shell.
 */
export async function signIn(page: Page, baseUrl: string, email: string, password = DEMO_PASSWORD): Promise<void> {
  // On a busy machine a first attempt can stall (the app still booting while the form is
  // used); try once more from a fresh sign-in page before failing, and say so.
  for (let attempt = 1; ; attempt++) {
    await page.context().clearCookies();
    await page.goto(`${baseUrl}/sign-in`, { waitUntil: 'networkidle' });
    await page.locator('[data-test=sign-in-email] input').fill(email);
    await page.locator('[data-test=sign-in-password] input').fill(password);
    await page.locator('[data-test=sign-in-submit]').click();
    try {
      await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'), { timeout: attempt === 1 ? 20_000 : 45_000 });
      break;
    } catch (err) {
      if (attempt >= 2) throw err;
      console.warn(`sign-in as ${email} did not leave the sign-in page in 20 s; trying again`);
    }
  }
  await page.locator('[data-test=user-menu]').waitFor();
}

/** Signs out through the user menu and waits for the sign-in screen. */
export async function signOut(page: Page): Promise<void> {
  await page.locator('[data-test=user-menu]').click();
  await page.locator('[data-test=sign-out]').click();
  await page.waitForURL((u) => u.pathname.startsWith('/sign-in'));
}

/** Creates a project as the signed-in user (through the page's session) and returns its id. */
export async function createProject(page: Page, name: string): Promise<number> {
  const created = await apiFromPage(page, 'POST', '/api/projects', { name });
  if (created.status !== 201) throw new Error(`creating project "${name}" answered ${created.status}: ${JSON.stringify(created.body)}`);
  return (created.body as { id: number }).id;
}

/** Calls the API from inside the page (with its session cookie); returns status and body. */
export async function apiFromPage(page: Page, method: string, pathname: string, body?: unknown): Promise<{ status: number; body: unknown }> {
  return page.evaluate(
    async ({ method, pathname, body }) => {
      const res = await fetch(pathname, {
        method,
        credentials: 'same-origin',
        headers: body === undefined ? {} : { 'Content-Type': 'application/json' },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      const text = await res.text();
      let parsed: unknown = text;
      try {
        parsed = JSON.parse(text);
      } catch {
        // not JSON
      }
      return { status: res.status, body: parsed };
    },
    { method, pathname, body },
  );
}

/** Saves a full-page screenshot as test-artifacts/<name>.png and returns its path. */
export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(ARTIFACTS_DIR, { recursive: true });
  const file = path.join(ARTIFACTS_DIR, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/** Screenshots of every open tab as test-artifacts/<prefix>-<n>.png (for a failed test). */
export async function screenshotOpenPages(app: TrestleApp, prefix: string): Promise<string[]> {
  const files: string[] = [];
  const pages = app.browser.context.pages();
  for (let i = 0; i < pages.length; i++) {
    try {
      files.push(await screenshot(pages[i], `${prefix}-${i + 1}`));
    } catch {
      // the tab may be closing
    }
  }
  return files;
}

/** A file-name-safe slug of a test name. */
export function slug(text: string): string {
  return text.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 60);
}

/** Writes each named CSV text into dir (created if missing); returns the file paths, for an upload. */
export function writeCsvs(dir: string, files: Record<string, string>): string[] {
  mkdirSync(dir, { recursive: true });
  return Object.entries(files).map(([name, text]) => {
    const file = path.join(dir, name);
    writeFileSync(file, text);
    return file;
  });
}
