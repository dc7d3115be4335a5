/** Solid rectangle (h along local z, b along local y) and solid round bar (diameter D). */
import type { SectionDims, SectionProps } from '../../model/types.js';

/**
 * Saint-Venant torsion constant of a solid rectangle, long side a, short side c:
 * J = a·c³·(1/3 − 0.21·(c/a)·(1 − c⁴/(12·a⁴)))  (Roark's Formulas, Table 10.1, from memory;
 * within about 0.5 % of the exact series for every aspect ratio).
 */
export function rectTorsion(h: number, b: number): number {
  const a = Math.max(h, b), c = Math.min(h, b);
  return a * c ** 3 * (1 / 3 - 0.21 * (c / a) * (1 - c ** 4 / (12 * a ** 4)));
}

export function rectProperties(dims: SectionDims): SectionProps {
  const h = dims.h!, b = dims.b!;
  const A = b * h;
  return {
    A,
    I_major: (b * h ** 3) / 12,
    I_minor: (h * b ** 3) / 12,
    J: rectTorsion(h, b),
    Cw: 0, // solid section: warping negligible (common practice)
    S_major: (b * h * h) / 6,
    S_minor: (h * b * b) / 6,
    Z_major: (b * h * h) / 4,
    Z_minor: (h * b * b) / 4,
    // Timoshenko shear coefficient 5/6 for a rectangle (common practice)
    Av_major: (5 / 6) * A,
    Av_minor: (5 / 6) * A,
    depth: h,
  };
}

export function roundProperties(dims: SectionDims): SectionProps {
  const D = dims.D!;
  const A = (Math.PI * D * D) / 4;
  const I = (Math.PI * D ** 4) / 64;
  return {
    A,
    I_major: I,
    I_minor: I,
    J: 2 * I,
    Cw: 0,
    S_major: (Math.PI * D ** 3) / 32,
    S_minor: (Math.PI * D ** 3) / 32,
    Z_major: D ** 3 / 6,
    Z_minor: D ** 3 / 6,
    // Timoshenko shear coefficient 0.9 for a circle (common practice)
    Av_major: 0.9 * A,
    Av_minor: 0.9 * A,
    depth: D,
  };
}
