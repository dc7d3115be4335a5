/**
 * Member loads (tables.md "member_loads") and self weight, resolved into member local
 * axes as one LoadSet per member and case.
 *   global_*     per unit member length, along the global axis
 *   projected_*  per unit length projected on the plane normal to the axis: w·|sin θ|
 *                per member length, θ the angle between member and axis
 *   local_*      along the local axis
 * Self weight: density · A · g · factor per unit length along −vertical, g = 9.80665 m/s²
 * (standard gravity, ISO 80000-3). Tapered members: A varies linearly between the ends.
 */
import type { LoadDirection, Model } from '../model/types.js';
import type { MemberInfo } from './discretise.js';
import { emptyLoadSet, type LoadSet } from './loadSet.js';

/** Standard acceleration of gravity, m/s² (ISO 80000-3, CGPM 1901). */
export const STANDARD_GRAVITY = 9.80665;

function axisIndex(d: LoadDirection): number {
  return d.endsWith('x') ? 0 : d.endsWith('y') ? 1 : 2;
}

/** Unit direction of a load in local axes, and the projection factor for line loads. */
function localDirection(d: LoadDirection, R: Float64Array): { v: [number, number, number]; projection: number } {
  const a = axisIndex(d);
  if (d.startsWith('local')) {
    const v: [number, number, number] = [0, 0, 0];
    v[a] = 1;
    return { v, projection: 1 };
  }
  // global unit vector e_a in local axes = column a of R
  const v: [number, number, number] = [R[a], R[3 + a], R[6 + a]];
  const c = R[a]; // cos of angle between member x and global axis a
  const projection = d.startsWith('projected') ? Math.sqrt(Math.max(0, 1 - c * c)) : 1;
  return { v, projection };
}

/**
 * Load sets indexed [member * nCases + case]; undefined where a member carries nothing.
 * Throws an Error naming the load row for loads that do not fit the member.
 */
export function buildLoadSets(model: Model, members: MemberInfo[], caseIndex: Map<string, number>): (LoadSet | undefined)[] {
  const nCases = model.cases.length;
  const sets: (LoadSet | undefined)[] = new Array(members.length * nCases);
  const memberIndex = new Map<string, number>(members.map((m, i) => [m.id, i]));
  const get = (m: number, c: number): LoadSet => (sets[m * nCases + c] ??= emptyLoadSet());

  for (const ld of model.memberLoads) {
    const where = `member load${ld.row !== undefined ? ` (row ${ld.row})` : ''} on member ${ld.member}`;
    const mi = memberIndex.get(ld.member);
    if (mi === undefined) throw new Error(`${where}: the member does not exist`);
    const c = caseIndex.get(ld.case);
    if (c === undefined) throw new Error(`${where}: case ${ld.case} does not exist`);
    const m = members[mi];
    const L = m.L;
    const tol = 1e-9 * L;
    let a = ld.a, b = ld.kind === 'point' || ld.kind === 'moment' ? ld.a : ld.b;
    if (!(a >= -tol && a <= L + tol)) throw new Error(`${where}: position a = ${a} m lies outside the member (length ${L} m)`);
    if (!(b >= -tol && b <= L + tol)) throw new Error(`${where}: position b = ${b} m lies outside the member (length ${L} m)`);
    if (b < a - tol) throw new Error(`${where}: b must not be less than a`);
    a = Math.min(Math.max(a, 0), L);
    b = Math.min(Math.max(b, a), L);
    const ls = get(mi, c);
    const alpha = m.material.alpha;
    switch (ld.kind) {
      case 'temperature':
        ls.eps += alpha * ld.w1;
        break;
      case 'temperature_gradient': {
        const d0 = m.props(0).depth, d1 = m.props(1).depth;
        if (!(d0 > 0 && d1 > 0) && ld.w1 !== ld.w2) throw new Error(`${where}: a temperature gradient needs the section depth`);
        ls.eps += (alpha * (ld.w1 + ld.w2)) / 2;
        ls.grad += alpha * (ld.w1 - ld.w2);
        break;
      }
      case 'point': {
        const { v } = localDirection(ld.direction, m.R);
        ls.point.push(a, ld.w1 * v[0], ld.w1 * v[1], ld.w1 * v[2]);
        break;
      }
      case 'moment': {
        const { v } = localDirection(ld.direction, m.R);
        // a truss member carries no torsion: the part about its axis is not applied
        ls.moment.push(a, m.truss ? 0 : ld.w1 * v[0], ld.w1 * v[1], ld.w1 * v[2]);
        break;
      }
      case 'uniform':
      case 'linear': {
        if (!(b > a)) break;
        const { v, projection } = localDirection(ld.direction, m.R);
        const w1 = ld.w1 * projection, w2 = (ld.kind === 'uniform' ? ld.w1 : ld.w2) * projection;
        ls.dist.push(a, b, w1 * v[0], w1 * v[1], w1 * v[2], w2 * v[0], w2 * v[1], w2 * v[2]);
        break;
      }
    }
  }

  const up = model.settings.verticalAxis === 'Y' ? 1 : 2;
  model.cases.forEach((lc, c) => {
    if (!lc.selfWeight) return;
    members.forEach((m, mi) => {
      const rho = m.material.density;
      if (!rho) return;
      const w0 = -rho * STANDARD_GRAVITY * lc.selfWeight * m.props(0).A;
      const w1 = m.tapered ? -rho * STANDARD_GRAVITY * lc.selfWeight * m.props(1).A : w0;
      const v = [m.R[up], m.R[3 + up], m.R[6 + up]];
      get(mi, c).dist.push(0, m.L, w0 * v[0], w0 * v[1], w0 * v[2], w1 * v[0], w1 * v[1], w1 * v[2]);
    });
  });
  for (const ls of sets) if (ls && ls.dist.length > 8) mergeSameSpan(ls);
  return sets;
}

/** Distributed loads over the same span add up into one (fewer pieces, closed-form fixed-end forces). */
function mergeSameSpan(ls: LoadSet): void {
  const d = ls.dist, out: number[] = [];
  for (let i = 0; i < d.length; i += 8) {
    let j = 0;
    while (j < out.length && !(out[j] === d[i] && out[j + 1] === d[i + 1])) j += 8;
    if (j === out.length) out.push(...d.slice(i, i + 8));
    else for (let c = 2; c < 8; c++) out[j + c] += d[i + c];
  }
  ls.dist = out;
}
