/**
 * Numbers behind the model picture, without three.js: member segment coordinates, colours
 * by ratio band, the deflected shape, the model's extent, a default deflection scale and the
 * viewing direction (face-on for plane frames).
 */
import type { RunGeometry } from '../../shared/schemas/runs.js';
import { BAND_COLORS, ratioBand } from './ratioBand.js';

export interface Extent {
  center: [number, number, number];
  size: number;
}

export function modelExtent(nodes: RunGeometry['nodes']): Extent {
  if (!nodes.length) return { center: [0, 0, 0], size: 1 };
  const lo = [Infinity, Infinity, Infinity];
  const hi = [-Infinity, -Infinity, -Infinity];
  for (const n of nodes) {
    for (let k = 0; k < 3; k++) {
      const v = n[k + 1] as number;
      if (v < lo[k]) lo[k] = v;
      if (v > hi[k]) hi[k] = v;
    }
  }
  const size = Math.max(hi[0] - lo[0], hi[1] - lo[1], hi[2] - lo[2]) || 1;
  return { center: [(lo[0] + hi[0]) / 2, (lo[1] + hi[1]) / 2, (lo[2] + hi[2]) / 2], size };
}

/** Two points per member (start, end): xyz, optionally displaced by `scale` × node displacement. */
export function segmentPositions(g: Pick<RunGeometry, 'nodes' | 'members' | 'displacements'>, scale = 0): Float32Array {
  const out = new Float32Array(g.members.length * 6);
  const d = g.displacements;
  g.members.forEach((m, i) => {
    for (const [j, node] of [m.start, m.end].entries()) {
      const n = g.nodes[node];
      const o = i * 6 + j * 3;
      out[o] = n[1] + (scale ? scale * (d[node * 6] ?? 0) : 0);
      out[o + 1] = n[2] + (scale ? scale * (d[node * 6 + 1] ?? 0) : 0);
      out[o + 2] = n[3] + (scale ? scale * (d[node * 6 + 2] ?? 0) : 0);
    }
  });
  return out;
}

function hexToRgb(hex: string): [number, number, number] {
  const v = parseInt(hex.slice(1), 16);
  return [((v >> 16) & 255) / 255, ((v >> 8) & 255) / 255, (v & 255) / 255];
}

/** RGB (0..1) per segment vertex, by the member's ratio band. */
export function segmentColors(members: RunGeometry['members']): Float32Array {
  const out = new Float32Array(members.length * 6);
  members.forEach((m, i) => {
    const rgb = hexToRgb(BAND_COLORS[ratioBand(m.ratio, m.status)]);
    out.set(rgb, i * 6);
    out.set(rgb, i * 6 + 3);
  });
  return out;
}

/**
 * A deflection scale that makes the largest displacement about 5 % of the model's size
 * (rounded down to 1, 2 or 5 × a power of ten, so the drawn size is between 2 % and 5 %).
 */
export const DEFLECTION_SHARE = 0.05;
export function defaultDeflectionScale(maxDisplacement: number, size: number): number {
  if (!(maxDisplacement > 0) || !(size > 0)) return 1;
  const raw = (DEFLECTION_SHARE * size) / maxDisplacement;
  const p = Math.pow(10, Math.floor(Math.log10(raw)));
  const m = raw / p;
  return (m >= 5 ? 5 : m >= 2 ? 2 : 1) * p;
}

/**
 * Direction from the model's centre to the camera and the up vector. A plane frame is seen
 * face-on along its normal, from the side that puts the plane's first horizontal axis (+X,
 * or +Y for a YZ frame, +Z for a YZ frame with Y up) to the right: the camera's right is
 * up × dir (three.js lookAt), so an XZ frame with Z up is seen from −Y, not from +Y (which
 * drew it mirrored, +x running left). A 3D model is seen from a corner, vertical axis up.
 */
export function viewDirection(verticalAxis: 'Y' | 'Z', planeNormal: 'X' | 'Y' | 'Z' | null): { dir: [number, number, number]; up: [number, number, number] } {
  const up: [number, number, number] = verticalAxis === 'Y' ? [0, 1, 0] : [0, 0, 1];
  if (planeNormal) {
    const k = planeNormal === 'X' ? 0 : planeNormal === 'Y' ? 1 : 2;
    // looking along the vertical axis (a floor plan): keep a horizontal axis up instead
    const upFace: [number, number, number] = planeNormal === verticalAxis ? (verticalAxis === 'Y' ? [0, 0, -1] : [0, 1, 0]) : up;
    const dir: [number, number, number] = [0, 0, 0];
    dir[k] = 1;
    // right = up × dir; its in-plane horizontal component must be positive
    const right = [upFace[1] * dir[2] - upFace[2] * dir[1], upFace[2] * dir[0] - upFace[0] * dir[2], upFace[0] * dir[1] - upFace[1] * dir[0]];
    if (right[0] + right[1] + right[2] < 0) dir[k] = -1;
    return { dir, up: upFace };
  }
  return verticalAxis === 'Y' ? { dir: [1, 0.7, 1.3], up } : { dir: [1, -1.3, 0.7], up };
}

/** The member hit by a ray on a segment list: two vertices per member. */
export function memberOfSegmentVertex(index: number): number {
  return Math.floor(index / 2);
}
