/**
 * The conventions help page (src/views/ConventionsView.vue): its topics, which import
 * problems point to which topic, the units table, and arrow geometry for its drawings.
 */
import type { UnitSystem } from '../../shared/model/types.js';
import { SYSTEM_UNITS, type Quantity } from '../../shared/units/index.js';

export type ConventionTopic = 'global-axes' | 'local-axes' | 'internal-forces' | 'load-directions' | 'units';

export const TOPIC_TITLES: Record<ConventionTopic, string> = {
  'global-axes': 'Global axes and the vertical axis',
  'local-axes': 'Member local axes and roll',
  'internal-forces': 'Signs of N, V, M, T and deflections',
  'load-directions': 'Load directions',
  units: 'Units and header brackets',
};

/** Only what the problem concerns: its column first, then words of its message. */
interface ProblemLike {
  table: string;
  column?: string | null;
  message: string;
}

/** The help topic an import problem concerns, or null. */
export function problemTopic(p: ProblemLike): ConventionTopic | null {
  const col = (p.column ?? '').trim().toLowerCase();
  const msg = p.message.toLowerCase();
  if (/\bunit\b|\bunits\b|\[[^\]]*\]|bracket/.test(msg)) return 'units';
  if (col === 'direction' || /global_[xyz]|projected_[xyz]|local_[xyz]|\bdirection\b/.test(msg)) return 'load-directions';
  if (col === 'roll' || /\broll\b|local ax/.test(msg)) return 'local-axes';
  if (/vertical_axis|vertical axis|plane frame|out-of-plane/.test(msg)) return 'global-axes';
  if (p.table === 'settings' && (col === 'vertical_axis' || msg.startsWith('vertical_axis'))) return 'global-axes';
  return null;
}

/** Topics that a list of problems concerns, with how many problems each, in page order. */
export function problemTopics(problems: readonly ProblemLike[]): { topic: ConventionTopic; title: string; count: number }[] {
  const counts = new Map<ConventionTopic, number>();
  for (const p of problems) {
    const t = problemTopic(p);
    if (t) counts.set(t, (counts.get(t) ?? 0) + 1);
  }
  return (Object.keys(TOPIC_TITLES) as ConventionTopic[]).filter((t) => counts.has(t)).map((t) => ({ topic: t, title: TOPIC_TITLES[t], count: counts.get(t)! }));
}

/** The rows of the units table (tables.md "Unit systems"), taken from shared/units itself. */
export const UNIT_ROWS: { quantity: Quantity; label: string }[] = [
  { quantity: 'length', label: 'Length: coordinates, member lengths, load positions, buckling and unbraced lengths' },
  { quantity: 'section_dim', label: 'Section dimension (d, bf, tf, tw, b, t, h, D, depth)' },
  { quantity: 'area', label: 'Area (A, Av, An, Ae)' },
  { quantity: 'inertia', label: 'Second moment of area, torsion constant (I, J)' },
  { quantity: 'modulus', label: 'Elastic and plastic section modulus (S, Z)' },
  { quantity: 'warping', label: 'Warping constant (Cw)' },
  { quantity: 'force', label: 'Force (node loads fx, fy, fz; point loads; axle loads)' },
  { quantity: 'moment', label: 'Moment (mx, my, mz; concentrated moments)' },
  { quantity: 'line_load', label: 'Line load (uniform and linear member loads)' },
  { quantity: 'stress', label: 'Stress, elastic modulus (E, G, fy, fu)' },
  { quantity: 'density', label: 'Mass density' },
  { quantity: 'temperature', label: 'Temperature change' },
  { quantity: 'thermal_expansion', label: 'Coefficient of thermal expansion' },
  { quantity: 'spring_trans', label: 'Translational spring (k_ux, k_uy, k_uz)' },
  { quantity: 'spring_rot', label: 'Rotational spring (k_rx, k_ry, k_rz)' },
  { quantity: 'displacement', label: 'Result displacement' },
  { quantity: 'rotation', label: 'Result rotation, settlement rotation' },
];

export function unitFor(quantity: Quantity, system: UnitSystem): string {
  return SYSTEM_UNITS[system][quantity];
}

/**
 * The head of an arrow from (x1, y1) to (x2, y2): the three corners of a triangle whose tip
 * is (x2, y2), `length` long and `width` wide, as an SVG `points` attribute.
 */
export function arrowHead(x1: number, y1: number, x2: number, y2: number, length = 9, width = 7): string {
  const dx = x2 - x1;
  const dy = y2 - y1;
  const d = Math.hypot(dx, dy) || 1;
  const ux = dx / d;
  const uy = dy / d;
  const bx = x2 - ux * length;
  const by = y2 - uy * length;
  const px = -uy * (width / 2);
  const py = ux * (width / 2);
  const f = (n: number) => Number(n.toFixed(2));
  return `${f(x2)},${f(y2)} ${f(bx + px)},${f(by + py)} ${f(bx - px)},${f(by - py)}`;
}

/** The end of a shaft that stops at the base of its head (so a thick line does not poke through the tip). */
export function shaftEnd(x1: number, y1: number, x2: number, y2: number, length = 9): [number, number] {
  const d = Math.hypot(x2 - x1, y2 - y1) || 1;
  const k = Math.max(0, d - length * 0.8) / d;
  return [x1 + (x2 - x1) * k, y1 + (y2 - y1) * k];
}

/**
 * A circular arc of radius r about (cx, cy) from angle a0 to a1 (degrees, counterclockwise
 * on the screen, 0 = right), as an SVG path, and its end point and the tangent there.
 */
export function arcPath(cx: number, cy: number, r: number, a0: number, a1: number): { d: string; end: [number, number]; before: [number, number] } {
  const p = (a: number): [number, number] => [cx + r * Math.cos((a * Math.PI) / 180), cy - r * Math.sin((a * Math.PI) / 180)];
  const [x0, y0] = p(a0);
  const [x1, y1] = p(a1);
  const large = Math.abs(a1 - a0) > 180 ? 1 : 0;
  const sweep = a1 > a0 ? 0 : 1; // screen y points down: counterclockwise is sweep 0
  const f = (n: number) => Number(n.toFixed(2));
  return { d: `M ${f(x0)} ${f(y0)} A ${r} ${r} 0 ${large} ${sweep} ${f(x1)} ${f(y1)}`, end: [x1, y1], before: p(a1 - Math.sign(a1 - a0) * 12) };
}
