/**
 * Geometry the design checks need beyond the property set: radii of gyration, element
 * width-to-thickness ratios for AISC 360-22 Table B4.1 and EN 1993-1-1 Table 5.2, the
 * EN 6.2.6(3) shear areas, and shear-centre data for singly symmetric and unsymmetric
 * shapes (AISC E4). Everything SI; ratios dimensionless. Fields absent = not applicable.
 *
 * Names (agreed with the design checks):
 *   bt.*  AISC Table B4.1 λ = b/t or h/tw:
 *         flange  I: bf/(2tf) · channel: bf/tf · tee: bf/(2tf)
 *         web     I, channel: h/tw with h = d − 2tf − 2r (rolled: clear distance less the
 *                 fillets, B4.1b(b)); welded / no r: d − 2tf
 *         stem    tee: d/tw
 *         legD, legB  angle: d/t, b/t (full leg width, B4.1a case 3 / B4.1b case 12)
 *         wallH, wallB  rhs: (h − 3t)/t, (b − 3t)/t (flat width taken as h − 3t, B4.1b(d))
 *         Dt      chs: D/t
 *   ct.*  EN 1993-1-1 Table 5.2 c/t (c/t without ε; the code multiplies limits by ε):
 *         flange  I: c = (bf − tw − 2r)/2 outstand · channel: c = bf − tw · tee: c = (bf − tw)/2
 *         web     I: c = d − 2tf − 2r internal part · channel: c = d − 2tf
 *         stem    tee: c = d − tf outstand
 *         legD, legB, legMean  angle: h/t, b/t, (b + h)/(2t) (Table 5.2 sheet 3)
 *         wallH, wallB  rhs: c = h − 3t, b − 3t (Table 5.2 note for RHS)
 *         Dt      chs: d/t (Table 5.2 sheet 3 uses d/t ≤ 50ε² …)
 *   AvEnMajor, AvEnMinor  EN 6.2.6(3): rolled I (r > 0) A − 2·bf·tf + (tw + 2r)·tf,
 *         welded I (r = 0) hw·tw; channel A − 2·bf·tf + tw·tf; tee 0.9·(A − bf·tf);
 *         rhs A·h/(b + h) and A·b/(b + h); chs 2A/π; I/channel minor A − hw·tw.
 *         The η·hw·tw floor of (a) is the caller's (η is a code choice); `hw` is given.
 *   ho    distance between flange centroids, d − tf (I, channel)
 *   y0, z0  shear centre relative to the centroid along the major (y) and minor (z)
 *         principal directions; r0sq = y0² + z0² + (I_major + I_minor)/A and
 *         H = 1 − (y0² + z0²)/r0sq (AISC E4-9, E4-10 in 360-22 numbering, from memory).
 */
import type { Section, ShapeKind } from '../model/types.js';
import { anglePrincipalAxes, type AngleAxes } from './shapes/angle.js';
import { channelGeometry, type ChannelGeometry } from './shapes/channel.js';
import { teeGeometry, type TeeGeometry } from './shapes/tee.js';

export interface SlendernessRatios {
  flange?: number;
  web?: number;
  stem?: number;
  legD?: number;
  legB?: number;
  legMean?: number;
  wallH?: number;
  wallB?: number;
  Dt?: number;
}

export interface DesignGeometry {
  shape: ShapeKind;
  /** radii of gyration √(I/A) */
  rMajor: number;
  rMinor: number;
  bt: SlendernessRatios;
  ct: SlendernessRatios;
  AvEnMajor?: number;
  AvEnMinor?: number;
  /** EN web depth between flanges d − 2tf (I, channel) */
  hw?: number;
  /** AISC web height h (I, channel) = d − 2tf − 2r */
  h?: number;
  /** distance between flange centroids (I, channel) */
  ho?: number;
  y0: number;
  z0: number;
  r0sq: number;
  H: number;
  angle?: AngleAxes;
  channel?: ChannelGeometry;
  tee?: TeeGeometry;
}

export function designGeometry(section: Section): DesignGeometry {
  const p = section.props;
  const dm = section.dims;
  const out: DesignGeometry = {
    shape: section.shape,
    rMajor: Math.sqrt(p.I_major / p.A),
    rMinor: Math.sqrt(p.I_minor / p.A),
    bt: {},
    ct: {},
    y0: 0,
    z0: 0,
    r0sq: (p.I_major + p.I_minor) / p.A,
    H: 1,
  };
  const A = p.A;
  switch (section.shape) {
    case 'i': {
      const d = dm.d!, bf = dm.bf!, tf = dm.tf!, tw = dm.tw!, r = dm.r ?? 0;
      const hw = d - 2 * tf;
      out.hw = hw;
      out.h = hw - 2 * r;
      out.ho = d - tf;
      out.bt = { flange: bf / (2 * tf), web: out.h / tw };
      out.ct = { flange: (bf - tw - 2 * r) / 2 / tf, web: out.h / tw };
      out.AvEnMajor = r > 0 ? A - 2 * bf * tf + (tw + 2 * r) * tf : hw * tw;
      out.AvEnMinor = A - hw * tw;
      break;
    }
    case 'channel': {
      const d = dm.d!, bf = dm.bf!, tf = dm.tf!, tw = dm.tw!;
      const hw = d - 2 * tf;
      out.hw = hw;
      out.h = hw;
      out.ho = d - tf;
      out.bt = { flange: bf / tf, web: hw / tw };
      out.ct = { flange: (bf - tw) / tf, web: hw / tw };
      out.AvEnMajor = A - 2 * bf * tf + tw * tf;
      out.AvEnMinor = A - hw * tw;
      const g = channelGeometry(dm);
      out.channel = g;
      out.y0 = g.y0; // along y (minor-axis direction of bending), the axis of symmetry
      break;
    }
    case 'tee': {
      const d = dm.d!, bf = dm.bf!, tf = dm.tf!, tw = dm.tw!;
      out.bt = { flange: bf / (2 * tf), stem: d / tw };
      out.ct = { flange: (bf - tw) / 2 / tf, stem: (d - tf) / tw };
      out.AvEnMajor = 0.9 * (A - bf * tf);
      out.AvEnMinor = bf * tf;
      const g = teeGeometry(dm);
      out.tee = g;
      out.z0 = g.z0;
      break;
    }
    case 'angle': {
      const d = dm.d!, b = dm.b!, t = dm.t!;
      out.bt = { legD: d / t, legB: b / t };
      out.ct = { legD: d / t, legB: b / t, legMean: (b + d) / (2 * t) };
      out.AvEnMajor = d * t;
      out.AvEnMinor = b * t;
      const ax = anglePrincipalAxes(dm);
      out.angle = ax;
      out.y0 = ax.u0;
      out.z0 = ax.v0;
      break;
    }
    case 'rhs': {
      const h = dm.h!, b = dm.b!, t = dm.t!;
      out.bt = { wallH: (h - 3 * t) / t, wallB: (b - 3 * t) / t };
      out.ct = { ...out.bt };
      out.AvEnMajor = (A * h) / (b + h);
      out.AvEnMinor = (A * b) / (b + h);
      break;
    }
    case 'chs': {
      out.bt = { Dt: dm.D! / dm.t! };
      out.ct = { Dt: dm.D! / dm.t! };
      out.AvEnMajor = (2 * A) / Math.PI;
      out.AvEnMinor = (2 * A) / Math.PI;
      break;
    }
    default:
      break;
  }
  const s2 = out.y0 * out.y0 + out.z0 * out.z0;
  out.r0sq = s2 + (p.I_major + p.I_minor) / A;
  out.H = 1 - s2 / out.r0sq;
  return out;
}
