/**
 * Member diagrams served by the results worker show numerical noise as zero
 * (server/runs/worker-tasks.ts memberStations, rule in shared/design/noise.ts): the middle
 * column of the portal-frame sample carries almost no shear or moment under the symmetric
 * dead load, and the solver leaves ~1e-10 N there (found by analysing the sample), while the
 * rafters' real moments are kept exactly.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readCsvFiles } from '../../../shared/reader/index.js';
import { analyseModel } from '../../../shared/stability/index.js';
import { noiseFloor, NOISE_RELATIVE } from '../../../shared/design/noise.js';
import { memberStations } from '../../../server/runs/worker-tasks.js';

function sample(name: string) {
  const dir = join('samples', name, 'csv');
  const r = readCsvFiles(readdirSync(dir).map((f) => ({ name: f, text: readFileSync(join(dir, f), 'utf8') })));
  if (!r.ok) throw new Error(r.problems.map((p) => p.message).join('; '));
  return analyseModel(r.model);
}

describe('member diagrams without floating-point noise', () => {
  const { model, analysis } = sample('portal-frame-building');
  const loading = analysis.loadings.findIndex((l) => l.id === 'D');
  const col = model.members.findIndex((m) => m.id === 'COL-B');
  const floor = noiseFloor(model, analysis);
  const maxAbs = (a: ArrayLike<number>) => Array.from(a).reduce((m, v) => Math.max(m, Math.abs(v)), 0);

  it('the raw solver output of the middle column has noise below the floor (the case being fixed)', () => {
    const raw = analysis.memberForces(col, loading);
    expect(loading).toBeGreaterThanOrEqual(0);
    expect(maxAbs(raw.V_major)).toBeGreaterThan(0);
    expect(maxAbs(raw.V_major)).toBeLessThan(floor.force);
    expect(maxAbs(raw.M_major)).toBeGreaterThan(0);
    expect(maxAbs(raw.M_major)).toBeLessThan(floor.moment);
  });

  it('serves that noise as exact zeros, deflections included', () => {
    const s = memberStations(model, analysis, col, loading);
    expect(s.V_major.every((v) => v === 0)).toBe(true);
    expect(s.M_major.every((v) => v === 0)).toBe(true);
    const u = analysis.displacements(loading);
    let largest = 0;
    for (let i = 0; i < u.length; i += 6) largest = Math.max(largest, Math.hypot(u[i], u[i + 1], u[i + 2]));
    // chord deflection of an (almost) unbent column: noise against 1e-9 × the largest node translation
    expect(s.d_major.every((v) => v === 0 || Math.abs(v) >= NOISE_RELATIVE * largest)).toBe(true);
    // the column's axial force is real and kept as computed
    expect(s.N).toEqual(Array.from(analysis.memberForces(col, loading).N));
  });

  it('keeps real values unchanged', () => {
    const rafter = model.members.findIndex((_, i) => maxAbs(analysis.memberForces(i, loading).M_major) > 1000);
    expect(rafter).toBeGreaterThanOrEqual(0);
    const s = memberStations(model, analysis, rafter, loading);
    const raw = analysis.memberForces(rafter, loading);
    s.M_major.forEach((v, i) => expect(v === 0 ? Math.abs(raw.M_major[i]) < floor.moment : v === raw.M_major[i]).toBe(true));
    expect(s.d_major).toEqual(Array.from(raw.d_major).map((v, i) => (s.d_major[i] === 0 ? 0 : v)));
    expect(maxAbs(s.d_major)).toBeGreaterThan(0);
  });
});
