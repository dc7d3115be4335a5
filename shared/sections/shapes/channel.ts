/**
 * Channel: depth d (web along local z), flange width bf, flange thickness tf, web
 * thickness tw; sharp corners (no root fillets: tables.md gives no r for channels).
 * Symmetric about the major axis (y); the minor axis (z) passes through the centroid at
 * `xBar` from the back of the web, and the flange tips are the extreme fibre.
 */
import type { SectionDims, SectionProps } from '../../model/types.js';
import { plasticModulus, rectangle } from '../parts.js';

export interface ChannelGeometry {
  /** centroid from the back of the web */
  xBar: number;
  /** shear centre from the web centreline, away from the flanges (thin-walled) */
  e0: number;
  /** distance between centroid and shear centre along y */
  y0: number;
}

export function channelGeometry(dims: SectionDims): ChannelGeometry {
  const d = dims.d!, bf = dims.bf!, tf = dims.tf!, tw = dims.tw!;
  const hw = d - 2 * tf;
  const A = 2 * bf * tf + hw * tw;
  const xBar = (2 * bf * tf * (bf / 2) + hw * tw * (tw / 2)) / A;
  // thin-walled, centreline dimensions b' = bf − tw/2, h' = d − tf:
  // e0 = 3·b'²·tf / (6·b'·tf + h'·tw)  (closed form, e.g. AISC Design Guide 9, from memory)
  const b1 = bf - tw / 2, h1 = d - tf;
  const e0 = (3 * b1 * b1 * tf) / (6 * b1 * tf + h1 * tw);
  return { xBar, e0, y0: e0 + (xBar - tw / 2) };
}

export function channelProperties(dims: SectionDims): SectionProps {
  const d = dims.d!, bf = dims.bf!, tf = dims.tf!, tw = dims.tw!;
  const hw = d - 2 * tf;
  const A = 2 * bf * tf + hw * tw;
  const { xBar } = channelGeometry(dims);
  const I_major = (bf * d ** 3 - (bf - tw) * hw ** 3) / 12;
  const I_minor =
    2 * ((tf * bf ** 3) / 12 + bf * tf * (bf / 2 - xBar) ** 2) + (hw * tw ** 3) / 12 + hw * tw * (xBar - tw / 2) ** 2;
  // plastic modulus about the minor axis: the plastic neutral axis is parallel to the web
  // where the areas either side are equal (found numerically on the exact outline)
  const parts = [rectangle(0, -d / 2, tw, d / 2), rectangle(tw, d / 2 - tf, bf, d / 2), rectangle(tw, -d / 2, bf, -d / 2 + tf)];
  const Z_minor = plasticModulus(parts, [1, 0]).Z;
  const b1 = bf - tw / 2, h1 = d - tf;
  return {
    A,
    I_major,
    I_minor,
    // thin-walled open section on centrelines: J = (2·b'·tf³ + h'·tw³)/3
    J: (2 * b1 * tf ** 3 + h1 * tw ** 3) / 3,
    // Cw = tf·b'³·h'²/12 · (3·b'·tf + 2·h'·tw) / (6·b'·tf + h'·tw)  (AISC Design Guide 9, from memory)
    Cw: ((tf * b1 ** 3 * h1 ** 2) / 12) * ((3 * b1 * tf + 2 * h1 * tw) / (6 * b1 * tf + h1 * tw)),
    S_major: (2 * I_major) / d,
    S_minor: I_minor / (bf - xBar),
    Z_major: bf * tf * (d - tf) + (tw * hw * hw) / 4,
    Z_minor,
    // AISC 360-22 G2.1: Aw = d·tw; G6: 2·bf·tf
    Av_major: d * tw,
    Av_minor: 2 * bf * tf,
    depth: d,
  };
}
