/**
 * A mode shape or buckled shape drawn along the members, not only at the nodes: each member
 * is a cubic between its end translations with the slopes of its end rotations (Hermite
 * shape functions of a beam), in a few straight pieces. The shapes come per node only, so
 * this is a drawing approximation between nodes: it ignores end releases and the member's own
 * inertia or buckling between nodes, which the label says ("a shape only").
 */
import type { RunGeometry } from '../../shared/schemas/runs.js';

type Vec = [number, number, number];

const sub = (a: Vec, b: Vec): Vec => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
const dot = (a: Vec, b: Vec) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
const cross = (a: Vec, b: Vec): Vec => [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];

/** Straight pieces per member in the drawing. */
export const SHAPE_PIECES = 8;

/**
 * Segment end points (pieces × 2 points × xyz per member) of the members displaced by
 * `scale` × the shape (per node ux, uy, uz, rx, ry, rz).
 */
export function curvedShapePositions(
  g: Pick<RunGeometry, 'nodes' | 'members'>,
  shape: ArrayLike<number>,
  scale: number,
  pieces = SHAPE_PIECES,
): Float32Array {
  const out = new Float32Array(g.members.length * pieces * 6);
  const at = (n: number, k: number) => (shape[n * 6 + k] ?? 0) * scale;
  let o = 0;
  for (const m of g.members) {
    const a = g.nodes[m.start];
    const b = g.nodes[m.end];
    const pa: Vec = [a[1], a[2], a[3]];
    const pb: Vec = [b[1], b[2], b[3]];
    const chord = sub(pb, pa);
    const L = Math.hypot(...chord) || 1;
    const t: Vec = [chord[0] / L, chord[1] / L, chord[2] / L];
    const ua: Vec = [at(m.start, 0), at(m.start, 1), at(m.start, 2)];
    const ub: Vec = [at(m.end, 0), at(m.end, 1), at(m.end, 2)];
    // slope of the transverse displacement along the member: rotation × axis
    const sa = cross([at(m.start, 3), at(m.start, 4), at(m.start, 5)], t);
    const sb = cross([at(m.end, 3), at(m.end, 4), at(m.end, 5)], t);
    const axA = dot(ua, t);
    const axB = dot(ub, t);
    const trA = sub(ua, [t[0] * axA, t[1] * axA, t[2] * axA]);
    const trB = sub(ub, [t[0] * axB, t[1] * axB, t[2] * axB]);
    const point = (xi: number): Vec => {
      const h1 = 1 - 3 * xi * xi + 2 * xi ** 3;
      const h2 = L * xi * (1 - xi) ** 2;
      const h3 = 3 * xi * xi - 2 * xi ** 3;
      const h4 = -L * xi * xi * (1 - xi);
      const ax = axA + (axB - axA) * xi;
      const p: Vec = [0, 0, 0];
      for (let k = 0; k < 3; k++) {
        p[k] = pa[k] + chord[k] * xi + t[k] * ax + h1 * trA[k] + h2 * sa[k] + h3 * trB[k] + h4 * sb[k];
      }
      return p;
    };
    let prev = point(0);
    for (let i = 1; i <= pieces; i++) {
      const next = point(i / pieces);
      out.set(prev, o);
      out.set(next, o + 3);
      o += 6;
      prev = next;
    }
  }
  return out;
}
