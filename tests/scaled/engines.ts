/**
 * Real PostgreSQL and Redis for the scaled-mode tests and the scale bench: each started on a
 * free port with throwaway data in a temp folder, stopped (and the folder removed) by `stop()`,
 * and killed on process exit even when a test fails. `missingEngines()` names what is not
 * installed so the suite can say why it skipped.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { chownSync, existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import net from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import pg from 'pg';

const children = new Set<ChildProcess>();
process.once('exit', () => {
  for (const c of children) if (c.exitCode === null) c.kill('SIGKILL');
});

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const port = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(port));
    });
  });
}

function onPath(name: string): string | null {
  for (const dir of (process.env.PATH ?? '').split(path.delimiter)) {
    const file = path.join(dir, name);
    if (dir && existsSync(file)) return file;
  }
  return null;
}

/** Folder holding initdb and postgres (PATH first, then Debian's /usr/lib/postgresql/<n>/bin). */
export function postgresBin(): string | null {
  const fromPath = onPath('initdb');
  if (fromPath && onPath('postgres')) return path.dirname(fromPath);
  const root = '/usr/lib/postgresql';
  if (!existsSync(root)) return null;
  for (const v of readdirSync(root).sort((a, b) => Number(b) - Number(a))) {
    const bin = path.join(root, v, 'bin');
    if (existsSync(path.join(bin, 'initdb')) && existsSync(path.join(bin, 'postgres'))) return bin;
  }
  return null;
}

export function redisBin(): string | null {
  return onPath('redis-server') ?? (existsSync('/usr/bin/redis-server') ? '/usr/bin/redis-server' : null);
}

/** What is missing to run the scaled suite ('' when nothing). */
export function missingEngines(): string {
  const missing: string[] = [];
  if (!postgresBin()) missing.push('PostgreSQL (initdb and postgres; Debian package postgresql)');
  if (!redisBin()) missing.push('Redis (redis-server; Debian package redis-server)');
  return missing.join(' and ');
}

export interface Engine {
  url: string;
  stop(): Promise<void>;
}

function stopChild(child: ChildProcess, signal: NodeJS.Signals = 'SIGTERM', graceMs = 5000): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    const force = setTimeout(() => child.kill('SIGKILL'), graceMs);
    child.once('exit', () => {
      clearTimeout(force);
      children.delete(child);
      resolve();
    });
    child.kill(signal);
  });
}

/** PostgreSQL refuses to run as root: run it as the `postgres` account (or nobody) then. */
function asUser(): { uid: number; gid: number; name: string } | null {
  if (process.getuid?.() !== 0) return null;
  for (const name of ['postgres', 'nobody']) {
    const id = spawnSync('id', ['-u', name], { encoding: 'utf8' });
    const gid = spawnSync('id', ['-g', name], { encoding: 'utf8' });
    if (id.status === 0) return { uid: Number(id.stdout.trim()), gid: Number(gid.stdout.trim()), name };
  }
  return null;
}

function wrap(command: string, args: string[], user: ReturnType<typeof asUser>): [string, string[]] {
  if (!user) return [command, args];
  return ['setpriv', [`--reuid=${user.uid}`, `--regid=${user.gid}`, '--clear-groups', '--', command, ...args]];
}

async function waitFor(what: string, check: () => Promise<boolean>, child: ChildProcess, log: () => string, ms = 30_000): Promise<void> {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    if (child.exitCode !== null) throw new Error(`${what} exited (${child.exitCode}): ${log()}`);
    if (await check().catch(() => false)) return;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`${what} did not start within ${ms / 1000} s: ${log()}`);
}

/** A throwaway PostgreSQL cluster (fsync off) with database `trestle`; `url` is its DATABASE_URL. */
export async function startPostgres(): Promise<Engine> {
  const bin = postgresBin();
  if (!bin) throw new Error('PostgreSQL is not installed');
  const dir = mkdtempSync(path.join(tmpdir(), 'trestle-pg-'));
  const data = path.join(dir, 'data');
  const user = asUser();
  if (user) chownSync(dir, user.uid, user.gid);
  const [initCmd, initArgs] = wrap(path.join(bin, 'initdb'), ['-D', data, '-U', 'trestle', '--auth=trust', '-E', 'UTF8', '--no-sync'], user);
  const init = spawnSync(initCmd, initArgs, { encoding: 'utf8' });
  if (init.status !== 0) {
    rmSync(dir, { recursive: true, force: true });
    throw new Error(`initdb failed: ${init.stderr || init.stdout}`);
  }
  const port = await freePort();
  const [cmd, args] = wrap(
    path.join(bin, 'postgres'),
    ['-D', data, '-p', String(port), '-h', '127.0.0.1', '-k', dir, '-c', 'fsync=off', '-c', 'synchronous_commit=off', '-c', 'full_page_writes=off', '-c', 'max_connections=200'],
    user,
  );
  const child = spawn(cmd, args, { stdio: ['ignore', 'ignore', 'pipe'] });
  children.add(child);
  let log = '';
  child.stderr!.on('data', (d: Buffer) => (log = (log + d.toString()).slice(-4000)));
  const admin = `postgres://trestle@127.0.0.1:${port}/postgres`;
  const stop = async () => {
    await stopChild(child, 'SIGINT');
    rmSync(dir, { recursive: true, force: true });
  };
  try {
    await waitFor('postgres', async () => {
      const c = new pg.Client({ connectionString: admin });
      await c.connect();
      await c.end();
      return true;
    }, child, () => log);
    const c = new pg.Client({ connectionString: admin });
    await c.connect();
    await c.query('CREATE DATABASE trestle');
    await c.end();
  } catch (err) {
    await stop();
    throw err;
  }
  return { url: `postgres://trestle@127.0.0.1:${port}/trestle`, stop };
}

/** A throwaway Redis (no persistence); `url` is its QUEUE_URL. */
export async function startRedis(): Promise<Engine> {
  const bin = redisBin();
  if (!bin) throw new Error('Redis is not installed');
  const dir = mkdtempSync(path.join(tmpdir(), 'trestle-redis-'));
  const port = await freePort();
  const child = spawn(bin, ['--port', String(port), '--bind', '127.0.0.1', '--save', '', '--appendonly', 'no', '--dir', dir], { stdio: ['ignore', 'pipe', 'pipe'] });
  children.add(child);
  let log = '';
  const keep = (d: Buffer) => (log = (log + d.toString()).slice(-4000));
  child.stdout!.on('data', keep);
  child.stderr!.on('data', keep);
  const stop = async () => {
    await stopChild(child);
    rmSync(dir, { recursive: true, force: true });
  };
  try {
    await waitFor('redis-server', () => new Promise((resolve) => {
      const s = net.connect(port, '127.0.0.1');
      s.once('connect', () => {
        s.write('PING\r\n');
        s.once('data', (d) => {
          s.destroy();
          resolve(d.toString().startsWith('+PONG'));
        });
      });
      s.once('error', () => resolve(false));
    }), child, () => log);
  } catch (err) {
    await stop();
    throw err;
  }
  return { url: `redis://127.0.0.1:${port}`, stop };
}

/** Registers a child process to be killed if this process exits without stopping it. */
export function track(child: ChildProcess): void {
  children.add(child);
  child.once('exit', () => children.delete(child));
}
export { stopChild };
