/**
 * The TypeORM DataSource over better-sqlite3: WAL journal, busy timeout, foreign keys on,
 * schema from hand-written migrations (never `synchronize`).
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { entities } from './entities.js';
import { migrations } from './migrations/index.js';

export const DATABASE_FILE = 'trestle.sqlite';
/** How long a statement waits for a lock held by another connection, in ms. */
export const BUSY_TIMEOUT_MS = 5000;

export interface DatabaseOptions {
  /** File path, or ':memory:' (tests). */
  database: string;
}

export function createDataSource({ database }: DatabaseOptions): DataSource {
  if (database !== ':memory:') mkdirSync(path.dirname(database), { recursive: true });
  return new DataSource({
    type: 'better-sqlite3',
    database,
    entities,
    migrations,
    migrationsTransactionMode: 'each',
    synchronize: false,
    enableWAL: database !== ':memory:',
    timeout: BUSY_TIMEOUT_MS,
    logging: false,
  });
}

export interface OpenedDatabase {
  dataSource: DataSource;
  /** True when this open created the schema (no migration had ever run). */
  isNew: boolean;
  /** Names of the migrations applied by this open. */
  applied: string[];
}

/** Opens the database, applies pending migrations and says whether it was new. */
export async function openDatabase(options: DatabaseOptions): Promise<OpenedDatabase> {
  const dataSource = createDataSource(options);
  await dataSource.initialize();
  try {
    const existing = await dataSource.query(`SELECT name FROM sqlite_master WHERE type = 'table' AND name = 'migrations'`);
    const isNew = existing.length === 0;
    const applied = await dataSource.runMigrations({ transaction: 'each' });
    return { dataSource, isNew, applied: applied.map((m) => m.name) };
  } catch (err) {
    await dataSource.destroy();
    throw err;
  }
}
