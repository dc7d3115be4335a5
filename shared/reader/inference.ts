/** What the reader infers from the geometry: the vertical axis and a plane frame (tables.md). */
import type { Inferences, Node, Support, VerticalAxis } from '../model/types.js';

/** `Z` if any node has z ≠ 0, else `Y` (tables.md "settings"). */
export function inferVerticalAxis(nodes: Node[]): VerticalAxis {
  return nodes.some((n) => n.z !== 0) ? 'Z' : 'Y';
}

type Plane = NonNullable<Inferences['planeFrame']>;

/** Candidate planes containing the vertical axis, with their out-of-plane freedoms (ux..rz indices). */
const PLANES: Record<VerticalAxis, { plane: Plane; coord: 'x' | 'y' | 'z'; outOfPlane: number[] }[]> = {
  // normal Z: uz, rx, ry leave the X–Y plane
  Y: [
    { plane: { plane: 'XY', normal: 'Z' }, coord: 'z', outOfPlane: [2, 3, 4] },
    { plane: { plane: 'YZ', normal: 'X' }, coord: 'x', outOfPlane: [0, 4, 5] },
  ],
  Z: [
    { plane: { plane: 'XZ', normal: 'Y' }, coord: 'y', outOfPlane: [1, 3, 5] },
    { plane: { plane: 'YZ', normal: 'X' }, coord: 'x', outOfPlane: [0, 4, 5] },
  ],
};

/**
 * The plane frame, if every node lies in one plane containing the vertical axis (to a
 * tolerance of 1e-9 of the model size) and the supports leave the out-of-plane freedoms
 * free; null otherwise.
 *
 * "Leave free" is judged on what the user wrote per freedom: an explicit `ux`…`rz` column
 * or a spring on an out-of-plane freedom shows 3D intent. The `type` shorthand (`fixed`,
 * `pinned`) restrains whole groups of freedoms and does not: a pinned-base portal frame
 * drawn in one plane is a plane frame. `explicit[i][f]` says whether support i gave
 * freedom f in its own column.
 */
export function detectPlaneFrame(nodes: Node[], supports: Support[], vertical: VerticalAxis, explicit?: boolean[][]): Inferences['planeFrame'] {
  if (nodes.length === 0) return null;
  let size = 0;
  for (const n of nodes) size = Math.max(size, Math.abs(n.x), Math.abs(n.y), Math.abs(n.z));
  const tol = 1e-9 * Math.max(size, 1);
  for (const cand of PLANES[vertical]) {
    const c0 = nodes[0][cand.coord];
    if (!nodes.every((n) => Math.abs(n[cand.coord] - c0) <= tol)) continue;
    const touches = supports.some((s, i) => cand.outOfPlane.some((f) =>
      s.springs[f] !== 0 || (s.restrained[f] && (explicit ? explicit[i]?.[f] === true : true))));
    if (touches) continue;
    return cand.plane;
  }
  return null;
}
