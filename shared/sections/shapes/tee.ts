/**
 * Tee: overall depth d along local z, flange (width bf, thickness tf) at the top (+z),
 * stem (thickness tw) below; sharp corners. Symmetric about the minor axis (z); the
 * major axis (y) passes through the centroid at `zBar` below the top of the flange.
 */
import type { SectionDims, SectionProps } from '../../model/types.js';
import { plasticModulus, rectangle } from '../parts.js';

export interface TeeGeometry {
  /** centroid below the top of the flange */
  zBar: number;
  /** shear centre (at the flange mid-thickness) above the centroid */
  z0: number;
  /** elastic moduli about y: to the top of the flange and to the tip of the stem */
  S_flange: number;
  S_stem: number;
}

export function teeGeometry(dims: SectionDims): TeeGeometry {
  const d = dims.d!, bf = dims.bf!, tf = dims.tf!, tw = dims.tw!;
  const hs = d - tf;
  const A = bf * tf + hs * tw;
  const zBar = (bf * tf * (tf / 2) + hs * tw * (tf + hs / 2)) / A;
  const I = teeIMajor(dims, zBar);
  return { zBar, z0: zBar - tf / 2, S_flange: I / zBar, S_stem: I / (d - zBar) };
}

function teeIMajor(dims: SectionDims, zBar: number): number {
  const d = dims.d!, bf = dims.bf!, tf = dims.tf!, tw = dims.tw!;
  const hs = d - tf;
  return (bf * tf ** 3) / 12 + bf * tf * (zBar - tf / 2) ** 2 + (tw * hs ** 3) / 12 + tw * hs * (tf + hs / 2 - zBar) ** 2;
}

export function teeProperties(dims: SectionDims): SectionProps {
  const d = dims.d!, bf = dims.bf!, tf = dims.tf!, tw = dims.tw!;
  const hs = d - tf;
  const A = bf * tf + hs * tw;
  const g = teeGeometry(dims);
  const I_major = teeIMajor(dims, g.zBar);
  const I_minor = (tf * bf ** 3) / 12 + (hs * tw ** 3) / 12;
  // plastic neutral axis where the areas above and below are equal (may lie in the flange)
  const parts = [rectangle(-bf / 2, d - tf, bf / 2, d), rectangle(-tw / 2, 0, tw / 2, d - tf)];
  const Z_major = plasticModulus(parts, [0, 1]).Z;
  const ds = d - tf / 2; // stem length to the flange mid-thickness
  return {
    A,
    I_major,
    I_minor,
    // thin-walled open section on centrelines: J = (bf·tf³ + (d − tf/2)·tw³)/3
    J: (bf * tf ** 3 + ds * tw ** 3) / 3,
    // Cw = tf³·bf³/144 + tw³·(d − tf/2)³/36  (AISC Design Guide 9 for tees, from memory; small)
    Cw: (tf ** 3 * bf ** 3) / 144 + (tw ** 3 * ds ** 3) / 36,
    // smallest elastic modulus (extreme fibre, normally the stem tip)
    S_major: Math.min(g.S_flange, g.S_stem),
    S_minor: (2 * I_minor) / bf,
    Z_major,
    Z_minor: (tf * bf * bf) / 4 + (hs * tw * tw) / 4,
    // AISC 360-22 G3 (stem: Aw = d·tw; flange: bf·tf)
    Av_major: d * tw,
    Av_minor: bf * tf,
    depth: d,
  };
}
