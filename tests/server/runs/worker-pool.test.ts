/**
 * The worker pool: member tasks of a run go to the thread holding its analysis and are
 * pipelined there (several sent while it answers one), answered in order with the same
 * results as one at a time; other tasks still take a thread each.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { WorkerPool } from '../../../server/runs/worker-pool.js';
import type { MemberTask, MemberTaskResult } from '../../../server/runs/worker-protocol.js';
import { readCsvFiles } from '../../../shared/reader/index.js';
import { CSV } from '../models/fixture.js';

let pool: WorkerPool;
let modelJson: string;
beforeAll(async () => {
  const read = await readCsvFiles(Object.entries(CSV).map(([name, text]) => ({ name, text })));
  if (!read.ok) throw new Error('fixture does not read');
  modelJson = JSON.stringify(read.model);
  pool = new WorkerPool(2);
  await pool.warm();
}, 60_000);
afterAll(async () => {
  await pool.close();
});

describe('WorkerPool', () => {
  it('pipelines member pages to the thread holding the run and answers each as one at a time would', async () => {
    await pool.run({ kind: 'run', runId: 7, modelJson, designCode: 'en1993-1-1' });
    expect(pool.holds(7)).toBe(true);
    // loadings D, L, ULS, SLS (fixture): ULS is index 2; members M1, M2
    const task = (member: number): MemberTask => ({ kind: 'member', runId: 7, designCode: 'en1993-1-1', member, loading: 2, governing: 2, stability: null });
    const one = await pool.run(task(0)) as MemberTaskResult;
    const many = await Promise.all(Array.from({ length: 20 }, (_, i) => pool.run(task(i % 2)))) as MemberTaskResult[];
    expect(pool.peakInFlight).toBeGreaterThan(1);
    expect(pool.peakInFlight).toBeLessThanOrEqual(8);
    for (let i = 0; i < many.length; i += 2) expect(many[i]).toEqual(one);
    expect(many[1].stations).not.toEqual(one.stations);
  }, 60_000);

  it('a failing member page fails alone', async () => {
    const bad: MemberTask = { kind: 'member', runId: 7, designCode: 'en1993-1-1', member: 99, loading: 2, governing: 2, stability: null };
    const good: MemberTask = { ...bad, member: 0 };
    const [a, b, c] = await Promise.allSettled([pool.run(good), pool.run(bad), pool.run(good)]);
    expect(a.status).toBe('fulfilled');
    expect(b.status).toBe('rejected');
    expect(c.status).toBe('fulfilled');
  }, 60_000);
});
