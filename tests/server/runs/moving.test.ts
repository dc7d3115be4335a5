/** Moving loads through the API: the road-bridge demo run serves vehicle positions, envelopes and influence lines. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

let t: TestApp;
let runId = 0;
beforeAll(async () => {
  t = await createTestApp({ seed: 'demo' });
  const rows: { id: number }[] = await t.dataSource.query(
    `SELECT runs.id AS id FROM runs JOIN models ON models.id = runs."modelId" WHERE models.name LIKE '%road%' OR models.name LIKE '%Mill Lane%'`,
  );
  runId = rows[0]?.id ?? 0;
}, 180_000);
afterAll(() => t.close());

describe('moving loads over the API', () => {
  it('grid rows carry the vehicle position; member detail has influence line and envelope', async () => {
    expect(runId).toBeGreaterThan(0);
    const members = await t.as('engineer').get(`/api/runs/${runId}/members`);
    expect(members.status).toBe(200);
    const v2 = members.body.members.find((m: { member: string }) => m.member === 'V2');
    expect(typeof v2.vehiclePosition).toBe('number');
    const detail = await t.as('engineer').get(`/api/runs/${runId}/members/BC4`);
    expect(detail.status).toBe(200);
    expect(detail.body.loadings.filter((l: { envelope?: string }) => l.envelope).length).toBe(6);
    const mv = detail.body.moving[0];
    expect(mv).toMatchObject({ vehicle: 'TRX-4', lane: 'DECK', key: 'M_major' });
    expect(mv.laneLength).toBeCloseTo(48, 9);
    expect(mv.influence.s.length).toBe(mv.influence.value.length);
    expect(Math.max(...mv.envelope.max)).toBeGreaterThan(0);
    // the absolute extremes under the axles: the M_major maximum is at least every station's
    // envelope value (it is one of them, at a station added under the governing axle), with x and the vehicle position
    const mMax = mv.extremes.find((e: { key: string }) => e.key === 'M_major').max;
    expect(mMax.value).toBeGreaterThanOrEqual(Math.max(...mv.envelope.max));
    expect(mv.envelope.x).toContain(mMax.x);
    expect(typeof mMax.lead).toBe('number');
    expect(['forward', 'backward']).toContain(mMax.direction);
  });

  it('opens member detail on the envelope (max or min) that governed the member', async () => {
    const members = await t.as('engineer').get(`/api/runs/${runId}/members`);
    const moving = members.body.members.filter((m: { vehiclePosition?: number }) => typeof m.vehiclePosition === 'number').slice(0, 3);
    expect(moving.length).toBeGreaterThan(0);
    for (const m of moving) {
      const detail = await t.as('engineer').get(`/api/runs/${runId}/members/${encodeURIComponent(m.member)}`);
      const recs = detail.body.governingRecords as { ratio: number | null }[];
      const top = Math.max(...recs.map((r) => r.ratio ?? -1));
      // the records of the loading the detail opens on reproduce the member's governing ratio
      expect(detail.body.governing.startsWith(`${m.combination}@`)).toBe(true);
      expect(Math.abs(top - m.ratio)).toBeLessThanOrEqual(1e-9 * Math.max(1, m.ratio));
    }
  });

  it('exports reactions with the envelope column', async () => {
    const res = await t.as('engineer').get(`/api/runs/${runId}/exports/reactions.csv`);
    expect(res.status).toBe(200);
    const text = res.text.replace(/^\uFEFF/, '');
    const header = text.split(/\r?\n/).find((l) => l.startsWith('loading'))!;
    expect(header.startsWith('loading,envelope,node')).toBe(true);
    expect(text).toMatch(/\nTRAFFIC,max,L0,/);
  });
});

describe('choosing an envelope loading', () => {
  it('takes `id@min` in ?loading= and answers with the same key', async () => {
    const max = await t.as('engineer').get(`/api/runs/${runId}/members/BC4?loading=${encodeURIComponent('ULS-traffic@max')}`);
    const min = await t.as('engineer').get(`/api/runs/${runId}/members/BC4?loading=${encodeURIComponent('ULS-traffic@min')}`);
    expect(max.body.loading).toBe('ULS-traffic@max');
    expect(min.body.loading).toBe('ULS-traffic@min');
    // envelope definition: max ≥ min station by station (same static part, max/min of the moving part)
    max.body.stations.M_major.forEach((v: number, i: number) => expect(v).toBeGreaterThanOrEqual(min.body.stations.M_major[i] - 1e-6));
    const pic = await t.as('engineer').get(`/api/runs/${runId}/model?loading=${encodeURIComponent('TRAFFIC@min')}`);
    expect(pic.body.loading).toBe('TRAFFIC@min');
    expect(pic.body.moving.lanes[0].lane).toBe('DECK');
  });
});
