/**
 * Angle: leg d along local z, leg b along local y, thickness t, sharp corners (tables.md
 * gives no root or toe radius). I_major / I_minor are the PRINCIPAL values (what governs a
 * single angle in buckling and unrestrained bending); the major principal axis makes the
 * angle `alpha` with the leg b (see anglePrincipalAxes). The engine's local y is the major
 * principal axis (conventions.md), so the user orients the member with `roll`.
 * The geometric-axis values (about axes parallel to the legs) are in anglePrincipalAxes
 * for codes that use them (e.g. AISC F10 for restrained bending).
 */
import type { SectionDims, SectionProps } from '../../model/types.js';
import { plasticModulus, polygonMoments, rectangle, type Polygon } from '../parts.js';

export interface AngleAxes {
  /** centroid from the outer face of the leg d (along y) and of the leg b (along z) */
  yBar: number;
  zBar: number;
  /** geometric-axis second moments about the centroid: Iy about the axis parallel to leg b */
  Iy: number;
  Iz: number;
  Iyz: number;
  /** angle (rad) from +y (leg b) to the major principal axis, counter-clockwise */
  alpha: number;
  I_major: number;
  I_minor: number;
  /** geometric-axis elastic moduli to the extreme fibre (smallest) */
  S_y: number;
  S_z: number;
  /** geometric-axis plastic moduli */
  Z_y: number;
  Z_z: number;
  /** shear centre (the heel, where the leg centrelines meet) from the centroid, principal axes */
  u0: number;
  v0: number;
}

/** The outline as two non-overlapping rectangles, corner (heel) at the origin. */
function angleParts(dims: SectionDims): Polygon[] {
  const d = dims.d!, b = dims.b!, t = dims.t!;
  return [rectangle(0, 0, t, d), rectangle(t, 0, b, t)];
}

function outline(dims: SectionDims): [number, number][] {
  const d = dims.d!, b = dims.b!, t = dims.t!;
  return [[0, 0], [b, 0], [b, t], [t, t], [t, d], [0, d]];
}

export function anglePrincipalAxes(dims: SectionDims): AngleAxes {
  const parts = angleParts(dims);
  let A = 0, Sy = 0, Sz = 0, Iyy = 0, Izz = 0, Iyz = 0;
  for (const p of parts) {
    const m = polygonMoments(p);
    A += m.A; Sy += m.Sy; Sz += m.Sz; Iyy += m.Iyy; Izz += m.Izz; Iyz += m.Iyz;
  }
  const yBar = Sz / A, zBar = Sy / A;
  // about the centroid (parallel axis theorem)
  const Iy = Iyy - A * zBar * zBar; // ∫z² dA
  const Iz = Izz - A * yBar * yBar; // ∫y² dA
  const Pyz = Iyz - A * yBar * zBar; // ∫y·z dA
  const mean = (Iy + Iz) / 2;
  const rad = Math.hypot((Iy - Iz) / 2, Pyz);
  // the major principal axis direction u (bending about u): second moment ∫(n·p)² with n ⟂ u
  // is largest. For an axis at angle θ from +y: I(θ) = Iy cos²θ + Iz sin²θ − 2·Pyz·sinθ·cosθ.
  const alpha = 0.5 * Math.atan2(-2 * Pyz, Iy - Iz);
  const I_major = mean + rad;
  const I_minor = mean - rad;

  const pts = outline(dims).map(([y, z]) => [y - yBar, z - zBar] as [number, number]);
  const maxAbs = (f: (p: [number, number]) => number) => Math.max(...pts.map((p) => Math.abs(f(p))));
  const S_y = Iy / maxAbs((p) => p[1]);
  const S_z = Iz / maxAbs((p) => p[0]);
  const Z_y = plasticModulus(parts, [0, 1]).Z;
  const Z_z = plasticModulus(parts, [1, 0]).Z;

  // heel of the centrelines at (t/2, t/2) from the outer corner
  const t = dims.t!;
  const hy = t / 2 - yBar, hz = t / 2 - zBar;
  const c = Math.cos(alpha), s = Math.sin(alpha);
  return {
    yBar, zBar, Iy, Iz, Iyz: Pyz, alpha, I_major, I_minor, S_y, S_z, Z_y, Z_z,
    u0: hy * c + hz * s,
    v0: -hy * s + hz * c,
  };
}

export function angleProperties(dims: SectionDims): SectionProps {
  const d = dims.d!, b = dims.b!, t = dims.t!;
  const ax = anglePrincipalAxes(dims);
  const parts = angleParts(dims);
  const c = Math.cos(ax.alpha), s = Math.sin(ax.alpha);
  // unit normals: bending about the major axis u = (c, s) stresses vary along v = (−s, c)
  const nMajor: [number, number] = [-s, c];
  const nMinor: [number, number] = [c, s];
  const pts = outline(dims).map(([y, z]) => [y - ax.yBar, z - ax.zBar]);
  const far = (n: [number, number]) => Math.max(...pts.map((p) => Math.abs(n[0] * p[0] + n[1] * p[1])));
  return {
    A: (d + b - t) * t,
    I_major: ax.I_major,
    I_minor: ax.I_minor,
    // thin-walled open section on centrelines: J = ((d − t/2) + (b − t/2))·t³/3
    J: ((d + b - t) * t ** 3) / 3,
    // negligible for an angle (both legs meet at the shear centre; common practice)
    Cw: 0,
    S_major: ax.I_major / far(nMajor),
    S_minor: ax.I_minor / far(nMinor),
    Z_major: plasticModulus(parts, nMajor).Z,
    Z_minor: plasticModulus(parts, nMinor).Z,
    // AISC 360-22 G3: Aw = b·t of the leg parallel to the shear (leg d for major, leg b for minor)
    Av_major: d * t,
    Av_minor: b * t,
    depth: d,
  };
}
