import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { BUSY_TIMEOUT_MS, DATABASE_FILE, openDatabase } from '../../server/db/data-source.js';
import { migrations } from '../../server/db/migrations/index.js';
import { DEMO_ACCOUNTS, seedDemoData, seedFirstAdmin, seedHooks } from '../../server/db/seed.js';
import { ProjectEntity } from '../../server/projects/project.entity.js';
import { UserEntity } from '../../server/users/user.entity.js';

const dir = mkdtempSync(path.join(tmpdir(), 'trestle-db-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('database file', () => {
  const file = path.join(dir, DATABASE_FILE);

  it('is created and migrated on first open, in WAL mode with a busy timeout', async () => {
    const { dataSource, isNew, applied } = await openDatabase({ database: file });
    expect(isNew).toBe(true);
    expect([...applied].sort()).toEqual(migrations.map((m) => m.name).sort());
    expect((await dataSource.query('PRAGMA journal_mode'))[0].journal_mode).toBe('wal');
    expect((await dataSource.query('PRAGMA busy_timeout'))[0].timeout).toBe(BUSY_TIMEOUT_MS);
    expect((await dataSource.query('PRAGMA foreign_keys'))[0].foreign_keys).toBe(1);
    await seedDemoData(dataSource);
    await dataSource.destroy();
  });

  it('is not new on the next open, applies nothing and keeps the seeded data', async () => {
    const { dataSource, isNew, applied } = await openDatabase({ database: file });
    expect(isNew).toBe(false);
    expect(applied).toEqual([]);
    const emails = (await dataSource.getRepository(UserEntity).find()).map((u) => u.email).sort();
    expect(emails).toEqual(DEMO_ACCOUNTS.map((a) => a.email).sort());
    expect(await dataSource.getRepository(ProjectEntity).count()).toBe(2);
    await dataSource.destroy();
  });

  it('rejects a duplicate e-mail and an unknown role at the table level', async () => {
    const { dataSource } = await openDatabase({ database: file });
    const insert = (email: string, role: string) =>
      dataSource.query(`INSERT INTO users (email, name, passwordHash, role) VALUES (?, 'x', 'x', ?)`, [email, role]);
    await expect(insert('admin@example.com', 'viewer')).rejects.toThrow(/UNIQUE/);
    await expect(insert('other@example.com', 'owner')).rejects.toThrow(/CHECK/);
    await dataSource.destroy();
  });
});

describe('demo seed', () => {
  it('runs the seed hooks in the same transaction, and saves nothing when one fails', async () => {
    const { dataSource } = await openDatabase({ database: ':memory:' });
    const seen: string[] = [];
    const hook = async (seed: Parameters<(typeof seedHooks)[number]>[0]) => {
      seen.push(seed.users.engineer.email, ...seed.projects.map((p) => p.name));
      throw new Error('hook failed');
    };
    seedHooks.push(hook);
    try {
      await expect(seedDemoData(dataSource)).rejects.toThrow('hook failed');
    } finally {
      seedHooks.splice(seedHooks.indexOf(hook), 1);
    }
    expect(seen[0]).toBe('engineer@example.com');
    expect(seen).toHaveLength(3);
    expect(await dataSource.getRepository(UserEntity).count()).toBe(0);
    expect(await dataSource.getRepository(ProjectEntity).count()).toBe(0);
    await dataSource.destroy();
  });
});

describe('first admin', () => {
  it('is created only while there are no users', async () => {
    const { dataSource } = await openDatabase({ database: ':memory:' });
    expect(await seedFirstAdmin(dataSource, 'Boss@Example.com', 'long-enough')).toBe(true);
    expect(await seedFirstAdmin(dataSource, 'other@example.com', 'long-enough')).toBe(false);
    const users = await dataSource.getRepository(UserEntity).find();
    expect(users.map((u) => [u.email, u.role])).toEqual([['boss@example.com', 'admin']]);
    await dataSource.destroy();
  });
});
