/**
 * How the model picture is looked at, without three.js: the camera pose that fits the whole
 * model in view, the screen directions of the global axes for the axis triad, the kind of
 * each support (fixed, pinned, roller) for its symbol, the loading the picture opens on and
 * where a label may sit so that it stays inside the canvas. Pure, tested in
 * tests/client/picture-view.test.ts.
 */
import type { LoadingInfo, RunGeometry } from '../../shared/schemas/runs.js';

export type Vec3 = [number, number, number];

const dot = (a: Vec3, b: Vec3) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
const cross = (a: Vec3, b: Vec3): Vec3 => [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
const norm = (a: Vec3): Vec3 => {
  const l = Math.hypot(a[0], a[1], a[2]) || 1;
  return [a[0] / l, a[1] / l, a[2] / l];
};

/** The camera's right, up and backward (towards the viewer) unit vectors for a view direction and up vector. */
export function cameraAxes(dir: Vec3, up: Vec3): { right: Vec3; up: Vec3; back: Vec3 } {
  const back = norm(dir);
  const right = norm(cross(up, back));
  return { right, up: cross(back, right), back };
}

/**
 * The distance from the model's centre along the view direction at which every point lies
 * inside a perspective camera's view (vertical field of view `fovDeg`, width / height
 * `aspect`), with `margin` (1.1 = 10 % spare) around it. Each point p (relative to the
 * centre) must satisfy |p·right| ≤ (d − p·back)·tan(hfov/2) and likewise for up.
 */
export function fitDistance(points: Vec3[], center: Vec3, dir: Vec3, up: Vec3, fovDeg: number, aspect: number, margin = 1.12): number {
  const ax = cameraAxes(dir, up);
  const tv = Math.tan((fovDeg * Math.PI) / 360);
  const th = tv * Math.max(aspect, 1e-6);
  let d = 0;
  let span = 0;
  for (const q of points) {
    const p: Vec3 = [q[0] - center[0], q[1] - center[1], q[2] - center[2]];
    const depth = dot(p, ax.back);
    d = Math.max(d, (Math.abs(dot(p, ax.right)) * margin) / th + depth, (Math.abs(dot(p, ax.up)) * margin) / tv + depth);
    span = Math.max(span, Math.hypot(...p));
  }
  // keep the camera in front of the nearest point even for a model seen edge-on
  return Math.max(d, span * 1.05, 1e-6);
}

/** The corners of the box around the nodes grown by `pad` on every side (what the fit has to show). */
export function boxCorners(nodes: RunGeometry['nodes'], pad = 0): Vec3[] {
  if (!nodes.length) return [[0, 0, 0]];
  const lo: Vec3 = [Infinity, Infinity, Infinity];
  const hi: Vec3 = [-Infinity, -Infinity, -Infinity];
  for (const n of nodes) {
    for (let k = 0; k < 3; k++) {
      const v = n[k + 1] as number;
      if (v < lo[k]) lo[k] = v;
      if (v > hi[k]) hi[k] = v;
    }
  }
  const out: Vec3[] = [];
  for (const x of [lo[0] - pad, hi[0] + pad]) for (const y of [lo[1] - pad, hi[1] + pad]) for (const z of [lo[2] - pad, hi[2] + pad]) out.push([x, y, z]);
  return out;
}

/**
 * Where a unit vector along each global axis X, Y, Z points on the screen (x right, y down,
 * length ≤ 1: shorter when the axis points towards or away from the viewer), for a camera
 * looking along −back with the given right and up vectors (three's camera matrix columns).
 */
export function triadDirections(right: Vec3, up: Vec3): { axis: 'X' | 'Y' | 'Z'; x: number; y: number }[] {
  return (['X', 'Y', 'Z'] as const).map((axis, i) => ({ axis, x: right[i], y: -up[i] }));
}

export type SupportKind = 'fixed' | 'pinned' | 'roller';

/**
 * The symbol of a support from its restrained freedoms (ux, uy, uz, rx, ry, rz). A plane frame
 * counts only its in-plane freedoms (two translations, the rotation about the plane's normal);
 * a 3D model all six. Every counted freedom held: fixed; every counted translation held but a
 * rotation free: pinned; a counted translation free: roller (it slides).
 */
export function supportKind(restrained: readonly boolean[], planeNormal: 'X' | 'Y' | 'Z' | null): SupportKind {
  const n = planeNormal === 'X' ? 0 : planeNormal === 'Y' ? 1 : planeNormal === 'Z' ? 2 : -1;
  const trans = [0, 1, 2].filter((k) => k !== n);
  const rots = n >= 0 ? [3 + n] : [3, 4, 5];
  if (!trans.every((k) => restrained[k])) return 'roller';
  return rots.every((k) => restrained[k]) ? 'fixed' : 'pinned';
}

/** The select value of a loading: `<id>@max|min` for a moving-load envelope, else its id. */
export function loadingValue(l: Pick<LoadingInfo, 'id' | 'envelope'>): string {
  return l.envelope ? `${l.id}@${l.envelope}` : l.id;
}

/**
 * The loading the picture opens on: the combination that governs the member with the
 * largest ratio; when no member has a ratio, the combination that governs the most members;
 * null when no row names a loading of the run (the server's default is kept then).
 */
export function governingLoading(
  rows: readonly { ratio: number | null; combination: string }[] | null | undefined,
  loadings: readonly Pick<LoadingInfo, 'id' | 'envelope'>[],
): string | null {
  if (!rows?.length || !loadings.length) return null;
  const valueOf = (c: string): string | null => {
    if (!c) return null;
    const l = loadings.find((x) => loadingValue(x) === c) ?? loadings.find((x) => x.id === c);
    return l ? loadingValue(l) : null;
  };
  let best: { ratio: number; value: string } | null = null;
  const counts = new Map<string, number>();
  for (const r of rows) {
    const v = valueOf(r.combination);
    if (!v) continue;
    counts.set(v, (counts.get(v) ?? 0) + 1);
    if (r.ratio !== null && Number.isFinite(r.ratio) && (!best || r.ratio > best.ratio)) best = { ratio: r.ratio, value: v };
  }
  if (best) return best.value;
  let most: string | null = null;
  for (const [v, n] of counts) if (most === null || n > (counts.get(most) ?? 0)) most = v;
  return most;
}

/**
 * The top-left corner of a label of size w × h anchored at (x, y) (its centre-left, offset a
 * little), moved inside a width × height canvas with a pad so that no part of it is cut off.
 */
export function placeLabel(x: number, y: number, w: number, h: number, width: number, height: number, pad = 4): { left: number; top: number } {
  const left = Math.min(Math.max(x + 6, pad), Math.max(pad, width - w - pad));
  const top = Math.min(Math.max(y - h / 2, pad), Math.max(pad, height - h - pad));
  return { left, top };
}
