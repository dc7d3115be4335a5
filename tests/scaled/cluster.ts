/**
 * The scaled mode on one machine, for tests and the scale bench: a throwaway PostgreSQL and
 * Redis (engines.ts), N web servers (`server/index.ts`) and M worker processes
 * (`server/worker.ts`) on free ports, sharing DATABASE_URL, QUEUE_URL and JWT_SECRET.
 * `stop()` ends every process it started and removes the data, also after a failure.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { freePort, startPostgres, startRedis, stopChild, track, type Engine } from './engines.js';

const ROOT = path.resolve(path.dirname(new URL(import.meta.url).pathname), '../..');

export interface Proc {
  child: ChildProcess;
  output(): string;
  /** a worker process's id (its own task queue, `runs.workerId`) */
  workerId?: string;
}

export interface ClusterServer extends Proc {
  url: string;
}

export interface Cluster {
  databaseUrl: string;
  queueUrl: string;
  servers: ClusterServer[];
  workers: Proc[];
  startWorker(env?: Record<string, string>): Promise<Proc>;
  /** SIGKILL: as if the host died */
  killWorker(w: Proc): Promise<void>;
  stop(): Promise<void>;
}

export interface ClusterOptions {
  servers?: number;
  workers?: number;
  env?: Record<string, string>;
  workerEnv?: Record<string, string>;
}

/** Starts `server/index.ts` or `server/worker.ts` (tsx's loader in this node) with the environment given. */
export function launch(entry: string, env: Record<string, string>): Proc {
  let log = '';
  // one process (tsx's loader in node itself, not tsx's CLI that forks a child): a kill reaches the server or worker
  const child = spawn(process.execPath, ['--import', 'tsx', entry], {
    cwd: ROOT,
    env: { ...process.env, TSX_TSCONFIG_PATH: 'tsconfig.server.json', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  track(child);
  const keep = (d: Buffer) => (log = (log + d.toString()).slice(-20_000));
  child.stdout!.on('data', keep);
  child.stderr!.on('data', keep);
  return { child, output: () => log };
}

export async function until(what: string, p: Proc, ready: () => Promise<boolean>, ms = 90_000): Promise<void> {
  const deadline = Date.now() + ms;
  for (;;) {
    if (p.child.exitCode !== null) throw new Error(`${what} exited with code ${p.child.exitCode}:\n${p.output()}`);
    if (await ready().catch(() => false)) return;
    if (Date.now() > deadline) throw new Error(`${what} was not ready within ${ms / 1000} s:\n${p.output()}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

export async function startCluster(options: ClusterOptions = {}): Promise<Cluster> {
  const engines: Engine[] = [];
  const procs: Proc[] = [];
  const dataDir = mkdtempSync(path.join(tmpdir(), 'trestle-scaled-'));
  const stop = async () => {
    await Promise.all(procs.map((p) => stopChild(p.child, 'SIGTERM', 8000)));
    await Promise.all(engines.map((e) => e.stop()));
    rmSync(dataDir, { recursive: true, force: true });
  };
  try {
    const pg = await startPostgres();
    engines.push(pg);
    const redis = await startRedis();
    engines.push(redis);
    const common = {
      DATABASE_URL: pg.url,
      QUEUE_URL: redis.url,
      JWT_SECRET: 'scaled-test-secret-scaled-test-secret-0123456789',
      NODE_ENV: 'test',
      LOG_LEVEL: 'warn',
      DATA_DIR: dataDir,
      ...options.env,
    };
    const servers: ClusterServer[] = [];
    for (let i = 0; i < (options.servers ?? 2); i++) {
      const port = await freePort();
      const p = launch('server/index.ts', { ...common, PORT: String(port), HOST: '127.0.0.1', SEED_DEMO: 'true' });
      procs.push(p);
      const url = `http://127.0.0.1:${port}`;
      // the first server migrates and seeds; the others start after it
      await until(`server ${i + 1}`, p, async () => (await fetch(`${url}/api/health`)).ok);
      servers.push({ ...p, url });
    }
    const workers: Proc[] = [];
    const startWorker = async (env: Record<string, string> = {}) => {
      // info: the worker says when it is ready and which runs it takes
      const w = launch('server/worker.ts', { ...common, ...options.workerEnv, ...env, LOG_LEVEL: 'info' });
      procs.push(w);
      await until('worker', w, async () => /Trestle worker \S+:/.test(w.output()));
      w.workerId = /Trestle worker (\S+):/.exec(w.output())![1];
      workers.push(w);
      return w;
    };
    for (let i = 0; i < (options.workers ?? 2); i++) await startWorker();
    return {
      databaseUrl: pg.url,
      queueUrl: redis.url,
      servers,
      workers,
      startWorker,
      killWorker: async (w) => {
        await stopChild(w.child, 'SIGKILL');
        workers.splice(workers.indexOf(w), 1);
      },
      stop,
    };
  } catch (err) {
    await stop();
    throw err;
  }
}

/** A signed-in API client (cookie kept) against one server. */
export class ApiClient {
  private cookie = '';
  constructor(public base: string) {}

  /** The same session against another server. */
  on(base: string): ApiClient {
    const c = new ApiClient(base);
    c.cookie = this.cookie;
    return c;
  }

  async signIn(email: string, password = 'trestle-demo'): Promise<void> {
    const res = await this.request('POST', '/api/auth/login', { email, password });
    if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  }

  async request(method: string, url: string, body?: unknown | FormData): Promise<{ status: number; body: any; bytes: Uint8Array; headers: Headers }> {
    const headers: Record<string, string> = {};
    if (this.cookie) headers.cookie = this.cookie;
    let payload: FormData | string | undefined;
    if (body instanceof FormData) payload = body;
    else if (body !== undefined) {
      headers['content-type'] = 'application/json';
      payload = JSON.stringify(body);
    }
    const res = await fetch(this.base + url, { method, headers, body: payload });
    const set = res.headers.getSetCookie?.() ?? [];
    for (const c of set) if (c.startsWith('trestle_session=')) this.cookie = c.split(';')[0];
    const bytes = new Uint8Array(await res.arrayBuffer());
    let parsed: unknown = null;
    if ((res.headers.get('content-type') ?? '').includes('json')) parsed = JSON.parse(Buffer.from(bytes).toString('utf8'));
    return { status: res.status, body: parsed, bytes, headers: res.headers };
  }

  get = (url: string) => this.request('GET', url);
  post = (url: string, body: unknown = {}) => this.request('POST', url, body);
  patch = (url: string, body: unknown) => this.request('PATCH', url, body);
}
