/**
 * The geometry the design checks need, from a section's dimensions and properties:
 * properties under axis-neutral names (major / minor), radii of gyration, clear web depth,
 * distance between flange centroids, and whether an I-section is rolled. Lengths in m.
 *
 * Conventions used throughout the checks (stated in their records):
 * - a section that gives a root radius `r` is treated as rolled, otherwise as welded;
 * - the clear web depth of an I or channel is d − 2tf − 2r (d − 2tf when welded);
 * - the flat width of a hollow-section wall is the outside dimension − 3t (corner radius
 *   unknown: AISC 360-22 B4.1b(d); EN 1993-1-1 Table 5.2 c = b − 3t, common practice).
 */
import type { Section, ShapeKind } from '../model/types.js';

export interface DesignGeometry {
  shape: ShapeKind;
  A: number;
  /** second moments about the major (local y) and minor (local z) axes */
  Imaj: number;
  Imin: number;
  J: number;
  Cw: number;
  Smaj: number;
  Smin: number;
  Zmaj: number;
  Zmin: number;
  /** radii of gyration */
  rmaj: number;
  rmin: number;
  /** dimensions (0 when the shape has none) */
  d: number;
  bf: number;
  tf: number;
  tw: number;
  r: number;
  t: number;
  h: number;
  b: number;
  D: number;
  /** I, channel, tee: clear web depth between fillets (or flanges when welded) */
  hw: number;
  /** I, channel: distance between flange centroids */
  ho: number;
  /** I, channel, tee: hot rolled (a root radius is given) */
  rolled: boolean;
  /** whether dimensions are known (false for `custom` sections) */
  hasDims: boolean;
  /** shear areas the user gave in `sections` (NaN = not given: the code's rule applies) */
  AvGivenMajor: number;
  AvGivenMinor: number;
}

export function designGeometry(section: Section): DesignGeometry {
  const p = section.props;
  const dm = section.dims;
  const d = dm.d ?? 0, bf = dm.bf ?? 0, tf = dm.tf ?? 0, tw = dm.tw ?? 0, r = dm.r ?? 0;
  const rolled = (section.shape === 'i' || section.shape === 'channel' || section.shape === 'tee') && r > 0;
  let hw = 0, ho = 0;
  if (section.shape === 'i' || section.shape === 'channel') {
    hw = d - 2 * tf - 2 * r;
    ho = d - tf;
  } else if (section.shape === 'tee') {
    hw = d - tf - r;
  }
  let Cw = p.Cw;
  if (!(Cw > 0) && section.shape === 'i') Cw = (p.I_minor * ho * ho) / 4;
  return {
    shape: section.shape,
    A: p.A,
    Imaj: p.I_major,
    Imin: p.I_minor,
    J: p.J,
    Cw,
    Smaj: p.S_major,
    Smin: p.S_minor,
    Zmaj: p.Z_major,
    Zmin: p.Z_minor,
    rmaj: Math.sqrt(p.I_major / p.A),
    rmin: Math.sqrt(p.I_minor / p.A),
    d, bf, tf, tw, r,
    t: dm.t ?? 0,
    h: dm.h ?? 0,
    b: dm.b ?? 0,
    D: dm.D ?? 0,
    hw, ho, rolled,
    hasDims: section.shape !== 'custom',
    AvGivenMajor: section.given?.includes('Av_major') ? p.Av_major : NaN,
    AvGivenMinor: section.given?.includes('Av_minor') ? p.Av_minor : NaN,
  };
}
