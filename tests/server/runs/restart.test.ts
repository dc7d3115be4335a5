/** A server restart marks the runs it interrupted as failed. */
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { createApp } from '../../../server/app.js';
import { createLogger } from '../../../server/config/logger.js';
import { openDatabase } from '../../../server/db/data-source.js';
import { seedDemoAccounts } from '../../../server/db/seed.js';
import { RunEntity } from '../../../server/runs/run.entity.js';
import { INTERRUPTED_MESSAGE, recoverInterruptedRuns } from '../../../server/runs/run.service.js';
import { testConfig } from '../helpers/test-app.js';

const dir = mkdtempSync(path.join(os.tmpdir(), 'trestle-restart-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('restart', () => {
  it('marks queued and running runs failed with a message, leaving done runs alone', async () => {
    const file = path.join(dir, 'db.sqlite');
    const first = await openDatabase({ database: file });
    await first.dataSource.transaction((m) => seedDemoAccounts(m));
    await first.dataSource.query(`INSERT INTO projects (name, designCode, units) VALUES ('P', 'none', 'metric')`);
    await first.dataSource.query(
      `INSERT INTO models (projectId, name, currentVersion, designCode, units) VALUES (1, 'M', 1, 'none', 'metric')`,
    );
    for (const status of ['queued', 'running', 'done']) {
      await first.dataSource.query(`INSERT INTO runs (modelId, version, designCode, settingsJson, status) VALUES (1, 1, 'none', '{}', ?)`, [status]);
    }
    await first.dataSource.destroy();

    const second = await openDatabase({ database: file });
    createApp({ config: testConfig(), dataSource: second.dataSource, logger: createLogger('silent') });
    await recoverInterruptedRuns(second.dataSource);
    const runs = await second.dataSource.getRepository(RunEntity).find({ order: { id: 'ASC' } });
    expect(runs.map((r) => r.status)).toEqual(['failed', 'failed', 'done']);
    expect(runs[0].message).toBe(INTERRUPTED_MESSAGE);
    expect(runs[0].finishedAt).not.toBeNull();
    await second.dataSource.destroy();
  });
});
