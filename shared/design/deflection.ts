/**
 * Serviceability: deflection of a member under service combinations against span / N.
 * - Members with both ends connected: the largest deflection relative to the chord,
 *   combining the local components vectorially, δ = √(d_major² + d_minor²), over the
 *   stations; span = member length.
 * - Cantilevers (one end node connected to nothing else and unsupported): the free end's
 *   displacement minus the root node's displacement, the component transverse to the
 *   member axis (the root's rotation is included, as it moves the tip); span = the
 *   cantilever length (not 2L: conservative).
 */
import type { DesignCode } from '../model/types.js';
import type { StationForces } from '../engine/types.js';
import { inp } from './record.js';
import { statusOf } from './record.js';
import type { CheckRecord } from './types.js';

/** Largest chord-relative deflection: writes [δ, x] into out. */
export function chordDeflection(sf: StationForces, out: Float64Array): void {
  let m = 0, at = 0;
  for (let i = 0; i < sf.x.length; i++) {
    const a = sf.d_major[i], b = sf.d_minor[i];
    const v = a * a + b * b;
    if (v > m) { m = v; at = sf.x[i]; }
  }
  out[0] = Math.sqrt(m);
  out[1] = at;
}

/**
 * Tip deflection of a cantilever transverse to its axis (unit vector e): displacements of
 * the tip and root nodes (global ux, uy, uz) read from `u` at offsets tip*6 and root*6.
 */
export function cantileverTip(u: Float64Array, tip: number, root: number, ex: number, ey: number, ez: number): number {
  const dx = u[tip * 6] - u[root * 6];
  const dy = u[tip * 6 + 1] - u[root * 6 + 1];
  const dz = u[tip * 6 + 2] - u[root * 6 + 2];
  const ax = dx * ex + dy * ey + dz * ez;
  const tx = dx - ax * ex, ty = dy - ax * ey, tz = dz - ax * ez;
  return Math.sqrt(tx * tx + ty * ty + tz * tz);
}

export function deflectionRecord(
  member: string, code: DesignCode, combination: string, delta: number, x: number,
  span: number, limitN: number, cantilever: boolean,
): CheckRecord {
  const allowed = span / limitN;
  const ratio = delta === 0 ? 0 : delta / allowed;
  return {
    member, family: 'deflection', code, clause: cantilever ? 'service: cantilever tip' : 'service: span',
    title: cantilever ? 'deflection of cantilever tip' : 'deflection relative to the chord',
    equation: cantilever
      ? 'δ = |tip displacement − root displacement| transverse to the member ≤ L/N (common practice)'
      : 'δ = max √(d_major² + d_minor²) relative to the chord ≤ L/N (common practice)',
    inputs: [inp('L', cantilever ? 'cantilever length' : 'span (member length)', span, 'length'), inp('N', 'deflection limit span/N', limitN, 'ratio'), inp('L/N', 'allowed deflection', allowed, 'displacement')],
    capacity: allowed, demand: delta, quantity: 'displacement', combination, x, ratio, status: statusOf(ratio),
  };
}
