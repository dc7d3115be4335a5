/** The export header block names who ran the run and who approved it when (issue 13). */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runPeople, softwareVersion } from '../../../server/exports/export.service.js';
import { RunReviewEntity } from '../../../server/reviews/review.entity.js';
import { RunEntity, type RunRecord } from '../../../server/runs/run.entity.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { importDemo, newProject } from '../models/fixture.js';
import { runInState } from '../reviews/fixture.js';

describe('export header people', () => {
  let t: TestApp;
  let modelId: number;
  beforeAll(async () => {
    t = await createTestApp();
    modelId = await importDemo(t, await newProject(t, 'Header people'));
  }, 60_000);
  afterAll(async () => t.close());

  const run = async (id: number) => (await t.dataSource.getRepository(RunEntity).findOneByOrFail({ id })) as RunRecord;

  it('names the approver and the date of an approved run', async () => {
    const id = await runInState(t, modelId, 'approved', t.users.engineer!.id);
    await t.dataSource.getRepository(RunReviewEntity).insert({
      runId: id, action: 'approve', fromStatus: 'submitted', toStatus: 'approved', message: 'ok', userId: t.users.lead!.id,
      createdAt: new Date('2026-11-30T09:15:00Z'),
    });
    const people = await runPeople(t.dataSource, await run(id));
    expect(people.ranBy.startsWith(`${t.users.engineer!.name}, `)).toBe(true);
    expect(people.approved).toBe(`${t.users.lead!.name}, 2026-11-30 09:15 UTC`);
  });

  it('says a run in review is not approved', async () => {
    const id = await runInState(t, modelId, 'submitted', t.users.engineer!.id);
    expect((await runPeople(t.dataSource, await run(id))).approved).toBe('not approved (review status: submitted)');
  });

  it('gives the software version from package.json', () => {
    expect(softwareVersion()).toMatch(/^Trestle \d+\.\d+\.\d+/);
  });
});
