/** Builders for moving-load tests: simple spans, a Pratt truss, a two-span beam (SI units). */
import type { AnalysisResult } from '../../../shared/engine/types.js';
import type { Model } from '../../../shared/model/types.js';
import { ModelBuilder } from '../engine/builders.js';

/** Add a vehicle, a lane over `members` (in order) and a moving-load case `LM`. */
export function addMoving(
  b: ModelBuilder, axles: { offset: number; load: number }[], members: string[],
  opts: { step?: number; direction?: 'forward' | 'backward' | 'both'; case?: string } = {},
): ModelBuilder {
  const m = b.model;
  const lc = opts.case ?? 'LM';
  if (!m.cases.some((c) => c.id === lc)) m.cases.push({ id: lc, category: 'live', title: lc, selfWeight: 0, mass: false });
  axles.forEach((a, i) => m.vehicles.push({ vehicle: 'V', axle: String(i + 1), offset: a.offset, load: a.load }));
  members.forEach((id, i) => m.lanes.push({ lane: 'deck', seq: i + 1, member: id }));
  m.movingLoads.push({ case: lc, vehicle: 'V', lane: 'deck', step: opts.step, direction: opts.direction ?? 'both' });
  return b;
}

/** Simply supported span of n equal frame members along X (Z up), A pinned, B on a roller. */
export function simpleSpan(L: number, n: number): { b: ModelBuilder; members: string[] } {
  const b = new ModelBuilder({ planeNormal: 'Y' });
  for (let i = 0; i <= n; i++) b.node(`N${i}`, (L * i) / n, 0, 0);
  b.support('N0', 'ux uz').support(`N${n}`, 'uz');
  const members: string[] = [];
  for (let i = 0; i < n; i++) { b.member(`M${i + 1}`, `N${i}`, `N${i + 1}`); members.push(`M${i + 1}`); }
  return { b, members };
}

export function loadingIndex(r: AnalysisResult, id: string, envelope?: 'max' | 'min'): number {
  const i = r.loadings.findIndex((l) => l.id === id && l.envelope === envelope);
  if (i < 0) throw new Error(`no loading ${id} ${envelope ?? ''}`);
  return i;
}

/** Largest value of a member quantity over all members and stations, with where it is (global x of the station). */
export function extreme(model: Model, r: AnalysisResult, l: number, key: 'M_major' | 'V_major' | 'N', sign: 1 | -1) {
  let best = -Infinity, where = { member: -1, station: -1, x: NaN };
  model.members.forEach((mem, mi) => {
    const f = r.memberForces(mi, l);
    const x0 = model.nodes.find((n) => n.id === mem.start)!.x;
    const x1 = model.nodes.find((n) => n.id === mem.end)!.x;
    for (let i = 0; i < f.x.length; i++) {
      const v = sign * f[key][i];
      if (best === -Infinity || v > best + 1e-9 * Math.abs(best)) { best = v; where = { member: mi, station: i, x: x0 + ((x1 - x0) * f.x[i]) / r.memberLength(mi) }; }
    }
  });
  return { value: sign * best, ...where };
}
