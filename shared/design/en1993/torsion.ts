/**
 * EN 1993-1-1 6.2.7 torsion of closed hollow sections (RHS, CHS), St Venant torsion only
 * (warping neglected for closed hollow sections, 6.2.7(7)). At each station:
 *  τt = T/(2·Am·t) (Bredt; Am = (b − t)(h − t) for RHS, π(D − t)²/4 for CHS);
 *  (a) torsion: τt/(fy/(√3·γM0)) ≤ 1;
 *  (b) shear with torsion, 6.2.7(9) Eq. (6.28): V ≤ Vpl,T,Rd = [1 − τt/(fy/√3/γM0)]·Vpl,Rd
 *      for each axis;
 *  (c) the elastic criterion of 6.2.1(5) Eq. (6.1), conservatively with
 *      σ = |N|/A + |My|/Wel,y + |Mz|/Wel,z and τ = τt + |Vy|/Av,y + |Vz|/Av,z:
 *      √[(σ/(fy/γM0))² + 3(τ/(fy/γM0))²] ≤ 1.
 * The ratio is the largest of (a), (b), (c) over the stations. Open sections: not checked.
 */
import type { StationForces } from '../../engine/types.js';
import type { DesignGeometry } from '../geometry.js';
import { inp, type RecordHead } from '../record.js';

export interface TorsionPlan {
  applies: boolean;
  /** 2·Am·t */
  wt: number;
  fyd: number;
  A: number;
  Sy: number;
  Sz: number;
  VplY: number;
  VplZ: number;
  AvY: number;
  AvZ: number;
}

export function torsionPlan(g: DesignGeometry, fy: number, gammaM0: number, VplY: number, VplZ: number): TorsionPlan {
  const fyd = fy / gammaM0;
  let wt = 0;
  if (g.shape === 'rhs') wt = 2 * (g.b - g.t) * (g.h - g.t) * g.t;
  else if (g.shape === 'chs') wt = (2 * Math.PI * (g.D - g.t) ** 2 * g.t) / 4;
  const tauRd = fyd / Math.sqrt(3);
  return {
    applies: wt > 0 && VplY > 0 && VplZ > 0, wt, fyd, A: g.A, Sy: g.Smaj, Sz: g.Smin, VplY, VplZ,
    AvY: VplY / tauRd, AvZ: VplZ / tauRd,
  };
}

/** Scratch of the last torsionRatio call: governing station and its parts. */
export const torsionLast = { i: 0, a: 0, b: 0, c: 0 };

export function torsionRatio(p: TorsionPlan, sf: StationForces): number {
  const tauRd = p.fyd / Math.sqrt(3);
  let worst = 0;
  for (let i = 0; i < sf.x.length; i++) {
    const tt = Math.abs(sf.T[i]) / p.wt;
    const a = tt / tauRd;
    const red = 1 - a;
    const vy = Math.abs(sf.V_major[i]), vz = Math.abs(sf.V_minor[i]);
    const b = red <= 0 ? (vy > 0 || vz > 0 ? Infinity : 0) : Math.max(vy / (red * p.VplY), vz / (red * p.VplZ));
    const s = Math.abs(sf.N[i]) / p.A + Math.abs(sf.M_major[i]) / p.Sy + Math.abs(sf.M_minor[i]) / p.Sz;
    const tau = tt + vy / p.AvY + vz / p.AvZ;
    const c = Math.sqrt((s / p.fyd) ** 2 + 3 * (tau / p.fyd) ** 2);
    const r = Math.max(a, b, c);
    if (r > worst || i === 0) { worst = r; torsionLast.i = i; torsionLast.a = a; torsionLast.b = b; torsionLast.c = c; }
  }
  return worst;
}

export function torsionHead(p: TorsionPlan, sf: StationForces): RecordHead {
  torsionRatio(p, sf);
  const i = torsionLast.i;
  return {
    family: 'torsion', code: 'en1993-1-1', clause: '6.2.7', title: 'torsion, closed section',
    equation: 'max of τt/(fy/(√3γM0)) with τt = TEd/(2·Am·t); VEd/Vpl,T,Rd with Vpl,T,Rd = [1 − τt/(fy/√3/γM0)]·Vpl,Rd (6.28); '
      + '√[(σ/(fy/γM0))² + 3(τ/(fy/γM0))²] (6.1) with σ = |N|/A + |My|/Wel,y + |Mz|/Wel,z, τ = τt + |Vy|/Av,y + |Vz|/Av,z',
    inputs: [
      inp('TEd', 'torsional moment', Math.abs(sf.T[i]), 'moment'), inp('2·Am·t', 'torsional section modulus (Bredt)', p.wt, 'modulus'),
      inp('fy/γM0', 'design yield strength', p.fyd, 'stress'),
      inp('τt ratio', 'τt/(fy/√3/γM0)', torsionLast.a, 'ratio'), inp('shear ratio', 'VEd/Vpl,T,Rd (6.28)', torsionLast.b, 'ratio'),
      inp('(6.1)', 'elastic criterion, equivalent stress ratio', torsionLast.c, 'ratio'),
    ],
    quantity: 'ratio',
    note: 'St Venant torsion of a closed section; warping neglected (6.2.7(7))',
  };
}
