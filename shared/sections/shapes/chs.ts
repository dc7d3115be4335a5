/** Circular hollow section: outside diameter D, wall thickness t (design thickness). */
import type { SectionDims, SectionProps } from '../../model/types.js';

export function chsProperties(dims: SectionDims): SectionProps {
  const D = dims.D!, t = dims.t!;
  const Di = D - 2 * t;
  const A = (Math.PI * (D * D - Di * Di)) / 4;
  const I = (Math.PI * (D ** 4 - Di ** 4)) / 64;
  const S = (2 * I) / D;
  const Z = (D ** 3 - Di ** 3) / 6;
  return {
    A,
    I_major: I,
    I_minor: I,
    J: 2 * I, // exact for a circular tube (polar moment)
    Cw: 0,
    S_major: S,
    S_minor: S,
    Z_major: Z,
    Z_minor: Z,
    // AISC 360-22 G5: Vn = Fcr·Ag/2, i.e. an effective shear area of A/2
    Av_major: A / 2,
    Av_minor: A / 2,
    depth: D,
  };
}
