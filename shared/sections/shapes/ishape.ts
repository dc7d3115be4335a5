/**
 * Doubly symmetric I or H section: depth d, flange width bf, flange thickness tf,
 * web thickness tw, optional root radius r (rolled sections; 0 or absent = welded).
 *
 * The web lies along local z (major-axis bending about y). With r > 0 the four root
 * fillets are included exactly (spandrel area (1 − π/4)·r² each, see ../parts.ts) in A,
 * I, S and Z, which is how the European section tables are computed: IPE300 gives
 * A = 53.81 cm², Iy = 8356 cm⁴, Wpl,y = 628.4 cm³.
 */
import type { SectionDims, SectionProps } from '../../model/types.js';
import { spandrel } from '../parts.js';

export function iProperties(dims: SectionDims): SectionProps {
  const d = dims.d!, bf = dims.bf!, tf = dims.tf!, tw = dims.tw!, r = dims.r ?? 0;
  const hw = d - 2 * tf;
  const f = spandrel(r);
  const zf = d / 2 - tf - f.offset; // lever of a fillet's centroid from the major axis
  const yf = tw / 2 + f.offset; // lever from the minor axis

  const A = 2 * bf * tf + hw * tw + 4 * f.area;
  const I_major =
    2 * (bf * tf ** 3 / 12 + bf * tf * ((d - tf) / 2) ** 2) + (tw * hw ** 3) / 12 + 4 * (f.iOwn + f.area * zf * zf);
  const I_minor = (2 * tf * bf ** 3) / 12 + (hw * tw ** 3) / 12 + 4 * (f.iOwn + f.area * yf * yf);
  const Z_major = bf * tf * (d - tf) + (tw * hw * hw) / 4 + 4 * f.area * zf;
  const Z_minor = (tf * bf * bf) / 2 + (hw * tw * tw) / 4 + 4 * f.area * yf;

  return {
    A,
    I_major,
    I_minor,
    J: iTorsion(d, bf, tf, tw, r),
    // warping constant of the two flanges, Cw = tf·bf³·ho²/24 with ho = d − tf
    // (= Iz,flanges·ho²/4; AISC Design Guide 9, and the basis of the EN tables' Iw)
    Cw: (tf * bf ** 3 * (d - tf) ** 2) / 24,
    S_major: (2 * I_major) / d,
    S_minor: (2 * I_minor) / bf,
    Z_major,
    Z_minor,
    // AISC 360-22 G2.1: Aw = d·tw; G6 (minor axis): 2·bf·tf
    Av_major: d * tw,
    Av_minor: 2 * bf * tf,
    depth: d,
  };
}

/**
 * Torsion constant. Welded (r = 0): thin-walled open section on centrelines,
 * J = (2·bf·tf³ + (d − tf)·tw³)/3 (AISC Design Guide 9 eq. 3.4, from memory).
 * Rolled (r > 0): El Darwish & Johnston (1965), as used for the AISC tables:
 * J = 2·bf·tf³·(1/3 − 0.21·(tf/bf)·(1 − tf⁴/(12·bf⁴))) + (d − 2tf)·tw³/3 + 2·α·D⁴,
 * α = (t1/t2)·(0.15 + 0.1·r/tf), t1 = min(tf, tw), t2 = max(tf, tw),
 * D = ((tf + r)² + tw·(r + tw/4)) / (2r + tf)  (from memory).
 * W12X26 gives 0.3015 in⁴ against 0.300 tabulated; European tables give a few per cent
 * less (IPE300: 20.9 against 20.12 cm⁴ tabulated).
 */
export function iTorsion(d: number, bf: number, tf: number, tw: number, r: number): number {
  if (!(r > 0)) return (2 * bf * tf ** 3 + (d - tf) * tw ** 3) / 3;
  const flange = bf * tf ** 3 * (1 / 3 - 0.21 * (tf / bf) * (1 - tf ** 4 / (12 * bf ** 4)));
  const web = ((d - 2 * tf) * tw ** 3) / 3;
  const t1 = Math.min(tf, tw);
  const t2 = Math.max(tf, tw);
  const alpha = (t1 / t2) * (0.15 + (0.1 * r) / tf);
  const D = ((tf + r) ** 2 + tw * (r + tw / 4)) / (2 * r + tf);
  return 2 * flange + web + 2 * alpha * D ** 4;
}
