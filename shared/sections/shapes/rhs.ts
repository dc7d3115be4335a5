/**
 * Rectangular or square hollow section: depth h along local z, width b along local y,
 * wall thickness t (the design thickness; the catalogue applies 0.93·t_nom where AISC
 * requires it). Corners are rounded with outer radius 2t and inner radius t, the basis of
 * the AISC HSS property tables (from memory) and close to EN 10219 cold-formed practice
 * (2t for t ≤ 6 mm). When 2t exceeds half the smaller side the outer radius is capped there.
 * An optional outer corner radius `r` replaces 2t, with inner radius min(t, r): the
 * hot-finished basis of EN 10210-2 (ro = 1.5t, ri = t, from memory) used by the catalogue.
 */
import type { SectionDims, SectionProps } from '../../model/types.js';
import { spandrel } from '../parts.js';

/**
 * Outer corner radius used for a wall thickness t (and the inner radius ro − t); with an
 * outer radius r given, that radius and an inner radius min(t, r) (EN 10210-2 hot-finished).
 */
export function rhsCornerRadii(h: number, b: number, t: number, r?: number): { ro: number; ri: number } {
  if (r !== undefined && r > 0) {
    const ro = Math.min(r, Math.min(h, b) / 2);
    return { ro, ri: Math.min(t, ro, Math.min(h, b) / 2 - t) };
  }
  const ro = Math.min(2 * t, Math.min(h, b) / 2);
  return { ro, ri: Math.max(ro - t, 0) };
}

/** A solid rectangle H (along z) × B (along y) with four corners rounded to radius R. */
function roundedRect(H: number, B: number, R: number) {
  const f = spandrel(R);
  const zf = H / 2 - f.offset, yf = B / 2 - f.offset;
  return {
    A: H * B - 4 * f.area,
    Iy: (B * H ** 3) / 12 - 4 * (f.iOwn + f.area * zf * zf),
    Iz: (H * B ** 3) / 12 - 4 * (f.iOwn + f.area * yf * yf),
    // first moment of the half above the axis, doubled: Z of the solid
    Zy: (B * H * H) / 4 - 4 * f.area * zf,
    Zz: (H * B * B) / 4 - 4 * f.area * yf,
  };
}

export function rhsProperties(dims: SectionDims): SectionProps {
  const h = dims.h!, b = dims.b!, t = dims.t!;
  const { ro, ri } = rhsCornerRadii(h, b, t, dims.r);
  const o = roundedRect(h, b, ro);
  const i = roundedRect(h - 2 * t, b - 2 * t, ri);
  const A = o.A - i.A;
  const I_major = o.Iy - i.Iy;
  const I_minor = o.Iz - i.Iz;
  // Bredt–Batho thin-walled closed section: J = 4·Ap²·t / p, Ap and p on the wall's
  // mid-line (corner radius (ro + ri)/2, = ro − t/2 for ri = ro − t); the same basis as the
  // AISC HSS tables (from memory)
  const rm = (ro + ri) / 2;
  const Ap = (h - t) * (b - t) - (4 - Math.PI) * rm * rm;
  const p = 2 * (h - t) + 2 * (b - t) - (8 - 2 * Math.PI) * rm;
  return {
    A,
    I_major,
    I_minor,
    J: (4 * Ap * Ap * t) / p,
    Cw: 0, // closed section: warping negligible (common practice)
    S_major: (2 * I_major) / h,
    S_minor: (2 * I_minor) / b,
    Z_major: o.Zy - i.Zy,
    Z_minor: o.Zz - i.Zz,
    // AISC 360-22 G4: Aw = 2·h'·t with h' = h − 3t when the corner radius is not known;
    // for walls so thick that h − 3t ≤ 0, EN 1993-1-1 6.2.6(3)(f) A·h/(b + h) instead
    Av_major: h > 3 * t ? 2 * (h - 3 * t) * t : (A * h) / (b + h),
    Av_minor: b > 3 * t ? 2 * (b - 3 * t) * t : (A * b) / (b + h),
    depth: h,
  };
}
