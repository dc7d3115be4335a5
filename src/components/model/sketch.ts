/**
 * The model drawn before any run, from its tables alone: nodes projected to the screen
 * (a plane frame face-on, otherwise an isometric view with the vertical axis up), members,
 * supports by kind, and the loads of one case as arrows. Pure, tested without mounting.
 */
import type { ModelTable, TableCell } from '../../../shared/schemas/models.js';
import { localAxes } from '../../../shared/engine/axes.js';

export type Plane = 'XY' | 'XZ' | 'YZ' | null;
export interface SketchNode { id: string; x: number; y: number }
/** `axes`: screen directions of local x, y, z (unit length; a zero vector points at the viewer) */
export interface SketchMember { id: string; a: SketchNode; b: SketchNode; axes: [number, number][] | null }
export interface SketchSupport { node: SketchNode; kind: 'fixed' | 'pinned' | 'roller' }
export interface SketchArrow { x: number; y: number; dx: number; dy: number; label: string }
export interface Sketch { nodes: SketchNode[]; members: SketchMember[]; supports: SketchSupport[]; arrows: SketchArrow[]; width: number; height: number }

function cellsBy(table: ModelTable | undefined): Record<string, TableCell>[] {
  if (!table) return [];
  return table.rows.map((r) => Object.fromEntries(table.columns.map((c, i) => [c.name, r.cells[i]])));
}
const num = (v: TableCell) => (typeof v === 'number' ? v : v === null || v === '' ? 0 : Number(v) || 0);

/** Screen coordinates (y down) of a point in the model's axes. */
export function project(p: [number, number, number], plane: Plane, vertical: 'Y' | 'Z'): [number, number] {
  const [x, y, z] = p;
  if (plane === 'XY') return [x, -y];
  if (plane === 'XZ') return [x, -z];
  if (plane === 'YZ') return [y, -z];
  const c = Math.cos(Math.PI / 6);
  const s = Math.sin(Math.PI / 6);
  // vertical axis up; the two horizontal axes at 30° either side
  const [h1, h2, v] = vertical === 'Z' ? [x, y, z] : [x, -z, y];
  return [(h1 - h2) * c, -(v + (h1 + h2) * s)];
}

const DIRS: Record<string, [number, number, number]> = { x: [1, 0, 0], y: [0, 1, 0], z: [0, 0, 1] };

/** Everything to draw, scaled into a width × height box with a margin. */
export function buildSketch(tables: ModelTable[], loadCase: string | null, plane: Plane, width = 900, height = 520): Sketch {
  const t = (name: string) => tables.find((x) => x.name === name);
  const settings = Object.fromEntries(cellsBy(t('settings')).map((r) => [String(r.key), r.value]));
  const vertical = settings.vertical_axis === 'Z' ? 'Z' : 'Y';
  const raw = cellsBy(t('nodes')).map((r) => ({ id: String(r.node), g: [num(r.x), num(r.y), num(r.z)] as [number, number, number], p: project([num(r.x), num(r.y), num(r.z)], plane, vertical) }));
  const global = new Map(raw.map((n) => [n.id, n.g]));
  const xs = raw.map((n) => n.p[0]);
  const ys = raw.map((n) => n.p[1]);
  const [x0, x1, y0, y1] = [Math.min(...xs, 0), Math.max(...xs, 0), Math.min(...ys, 0), Math.max(...ys, 0)];
  const margin = 60;
  const k = Math.min((width - 2 * margin) / Math.max(x1 - x0, 1e-9), (height - 2 * margin) / Math.max(y1 - y0, 1e-9));
  const ox = (width - k * (x1 - x0)) / 2;
  const oy = (height - k * (y1 - y0)) / 2;
  const nodes = raw.map((n) => ({ id: n.id, x: ox + k * (n.p[0] - x0), y: oy + k * (n.p[1] - y0) }));
  const byId = new Map(nodes.map((n) => [n.id, n]));
  const screenDir = (d: readonly number[]): [number, number] => {
    const [px, py] = project([d[0], d[1], d[2]], plane, vertical);
    const [qx, qy] = project([0, 0, 0], plane, vertical);
    const l = Math.hypot(px - qx, py - qy);
    return l > 1e-9 ? [(px - qx) / l, (py - qy) / l] : [0, 0];
  };
  // the engine's local axes (conventions.md): rows of R are local x, y, z in global axes
  const rows = new Map<string, Float64Array>();
  const members = cellsBy(t('members')).flatMap((r) => {
    const a = byId.get(String(r.start));
    const b = byId.get(String(r.end));
    if (!a || !b) return [];
    let axes: [number, number][] | null = null;
    try {
      const R = localAxes(global.get(String(r.start))!, global.get(String(r.end))!, (num(r.roll) * Math.PI) / 180, vertical);
      rows.set(String(r.member), R);
      axes = [0, 1, 2].map((i) => screenDir([R[3 * i], R[3 * i + 1], R[3 * i + 2]]));
    } catch {
      axes = null;
    }
    return [{ id: String(r.member), a, b, axes }];
  });
  const supports = cellsBy(t('supports')).flatMap((r) => {
    const node = byId.get(String(r.node));
    if (!node) return [];
    const fixed = (f: string, base: boolean) => (r[f] === null || r[f] === undefined || r[f] === '' ? base : ['1', 'fixed', 'yes', 'true'].includes(String(r[f]).toLowerCase()));
    const type = String(r.type ?? '');
    const rot = ['rx', 'ry', 'rz'].every((f) => fixed(f, type === 'fixed'));
    const trans = ['ux', 'uy', 'uz'].filter((f) => fixed(f, type === 'fixed' || type === 'pinned')).length;
    return [{ node, kind: (rot && trans === 3 ? 'fixed' : trans >= (plane ? 2 : 3) ? 'pinned' : 'roller') as SketchSupport['kind'] }];
  });
  const arrows: SketchArrow[] = [];
  if (loadCase !== null) {
    for (const r of cellsBy(t('node_loads'))) {
      if (String(r.case) !== loadCase) continue;
      const n = byId.get(String(r.node));
      if (!n) continue;
      (['x', 'y', 'z'] as const).forEach((ax) => {
        const f = num(r[`f${ax}`]);
        if (f) { const [dx, dy] = screenDir(DIRS[ax]); arrows.push({ x: n.x, y: n.y, dx: dx * Math.sign(f), dy: dy * Math.sign(f), label: String(f) }); }
      });
    }
    const members2 = new Map(members.map((m) => [m.id, m]));
    for (const r of cellsBy(t('member_loads'))) {
      if (String(r.case) !== loadCase) continue;
      const m = members2.get(String(r.member));
      const w1 = num(r.w1);
      if (!m || !w1 || String(r.kind).startsWith('temperature')) continue;
      const dir = String(r.direction ?? '');
      const ax = dir.slice(-1);
      let d: [number, number];
      const R = rows.get(m.id);
      if (dir.startsWith('local') && R) {
        const i = ax === 'x' ? 0 : ax === 'y' ? 1 : 2;
        d = screenDir([R[3 * i], R[3 * i + 1], R[3 * i + 2]]);
      } else d = screenDir(DIRS[ax] ?? [0, 1, 0]);
      const along = String(r.kind) === 'point' || String(r.kind) === 'moment' ? [0.5] : [0.2, 0.5, 0.8];
      for (const s of along) {
        arrows.push({ x: m.a.x + s * (m.b.x - m.a.x), y: m.a.y + s * (m.b.y - m.a.y), dx: d[0] * Math.sign(w1), dy: d[1] * Math.sign(w1), label: s === 0.5 ? `${w1}${dir.startsWith('local') ? ` (${dir})` : ''}` : '' });
      }
    }
  }
  return { nodes, members, supports, arrows, width, height };
}
