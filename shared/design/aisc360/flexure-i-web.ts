/**
 * AISC 360-22 F4 (doubly symmetric I-shaped members with noncompact webs, major axis) and
 * F5 (slender webs), for doubly symmetric I-shapes (Sxc = Sxt = Sx, hc = h, Iyc/Iy = 0.5):
 *  F4: Myc = Fy·Sx; Mp = min(Fy·Zx, 1.6·Fy·Sx); Rpc = Mp/Myc − (Mp/Myc − 1)(λ − λpw)/(λrw − λpw)
 *      ≤ Mp/Myc (F4-9b, Iyc/Iy > 0.23; λ = hc/tw, λpw = 3.76√(E/Fy), λrw = 5.70√(E/Fy));
 *      compression flange yielding Mn = Rpc·Myc (F4-1);
 *      LTB: FL = 0.7Fy (F4-6a), rt = bf/√(12(1 + aw/6)) (F4-11), aw = hc·tw/(bf·tf) (F4-12),
 *      Lp = 1.1·rt·√(E/Fy) (F4-7), Lr = 1.95·rt·(E/FL)·√(J/(Sx·ho) + √((J/(Sx·ho))² + 6.76(FL/E)²)) (F4-8);
 *      Lp < Lb ≤ Lr: Mn = Cb[Rpc·Myc − (Rpc·Myc − FL·Sx)(Lb − Lp)/(Lr − Lp)] ≤ Rpc·Myc (F4-2);
 *      Lb > Lr: Mn = Fcr·Sx ≤ Rpc·Myc, Fcr = Cb·π²E/(Lb/rt)²·√(1 + 0.078·J/(Sx·ho)·(Lb/rt)²) (F4-3, F4-5);
 *      flange local buckling: noncompact Mn = Rpc·Myc − (Rpc·Myc − FL·Sx)(λf − λpf)/(λrf − λpf) (F4-13),
 *      slender Mn = 0.9·E·kc·Sx/λf² (F4-14); tension flange yielding (F4.4) does not apply (Sxt = Sxc).
 *  F5: Rpg = 1 − aw/(1200 + 300aw)·(hc/tw − 5.7√(E/Fy)) ≤ 1 (F5-6), aw ≤ 10;
 *      compression flange yielding Mn = Rpg·Fy·Sx (F5-1);
 *      LTB Mn = Rpg·Fcr·Sx (F5-2): Lp = 1.1·rt·√(E/Fy), Lr = π·rt·√(E/(0.7Fy)) (F5-5);
 *      Lp < Lb ≤ Lr: Fcr = Cb[Fy − 0.3Fy(Lb − Lp)/(Lr − Lp)] ≤ Fy (F5-3); Lb > Lr: Fcr = Cb·π²E/(Lb/rt)² ≤ Fy (F5-4);
 *      flange local buckling Mn = Rpg·Fcr·Sx (F5-7): noncompact Fcr = Fy − 0.3Fy(λf − λpf)/(λrf − λpf) (F5-8),
 *      slender Fcr = 0.9·E·kc/λf² (F5-9); tension flange yielding (F5.4) does not apply.
 *  Outside F5 (not checked): h/tw > 260 or aw > 10 (F13.2 limits for unstiffened webs).
 */
import { inp } from '../record.js';
import type { DesignGeometry } from '../geometry.js';
import { AISC_FACTORS, factorOn } from './factors.js';
import { flexureClassOf, kcOf, type ElementRatio } from './classification.js';
import type { AiscContext } from './context.js';
import type { FlexureCapacity } from './flexure.js';

export function flexureWebF4F5(g: DesignGeometry, cx: AiscContext, Lb: number, flange: ElementRatio, web: ElementRatio, nc: (clause: string, reason: string) => FlexureCapacity): FlexureCapacity {
  const { E, Fy } = cx;
  const factor = factorOn(cx.method, AISC_FACTORS.flexure);
  const slenderWeb = flexureClassOf(web) === 'slender';
  const clause = slenderWeb ? 'F5' : 'F4';
  const lam = web.ratio;
  const Sx = g.Smaj;
  const aw = (g.hw * g.tw) / (g.bf * g.tf);
  if (slenderWeb && (lam > 260 || aw > 10)) return nc('F5', `slender web h/tw = ${lam.toFixed(1)}${lam > 260 ? ' > 260' : ''}${aw > 10 ? `, aw = ${aw.toFixed(2)} > 10` : ''}: outside F5 / F13.2 for webs without stiffeners`);
  const rt = g.bf / Math.sqrt(12 * (1 + aw / 6));
  const Lp = 1.1 * rt * Math.sqrt(E / Fy);
  const FL = 0.7 * Fy;
  const fl = flexureClassOf(flange);
  const lf = flange.ratio;
  const kc = kcOf(g);
  let Mcap: number, M1 = Infinity, ltb = 'Lb ≤ Lp', Lr: number, R: number, rName: string, flb = '';
  if (!slenderWeb) {
    const Myc = Fy * Sx;
    const Mp = Math.min(Fy * g.Zmaj, 1.6 * Fy * Sx);
    R = Math.min(Mp / Myc, Mp / Myc - (Mp / Myc - 1) * ((lam - web.lambdaP) / (web.lambdaR - web.lambdaP)));
    rName = 'Rpc (F4-9b)';
    const RM = R * Myc;
    const jr = g.J / (Sx * g.ho);
    Lr = 1.95 * rt * (E / FL) * Math.sqrt(jr + Math.sqrt(jr * jr + 6.76 * (FL / E) ** 2));
    Mcap = RM;
    if (Lb > Lp && Lb <= Lr) {
      M1 = RM - (RM - FL * Sx) * ((Lb - Lp) / (Lr - Lp));
      ltb = 'Lp < Lb ≤ Lr: Mn = Cb[Rpc·Myc − (Rpc·Myc − FL·Sx)(Lb − Lp)/(Lr − Lp)] ≤ Rpc·Myc (F4-2)';
    } else if (Lb > Lr) {
      const s = Lb / rt;
      M1 = ((Math.PI * Math.PI * E) / (s * s)) * Math.sqrt(1 + 0.078 * jr * s * s) * Sx;
      ltb = 'Lb > Lr: Mn = Fcr·Sx ≤ Rpc·Myc, Fcr = Cb·π²E/(Lb/rt)²·√(1 + 0.078·J/(Sx·ho)·(Lb/rt)²) (F4-3, F4-5)';
    }
    if (fl === 'noncompact') {
      Mcap = Math.min(Mcap, RM - (RM - FL * Sx) * ((lf - flange.lambdaP) / (flange.lambdaR - flange.lambdaP)));
      flb = '; flange local buckling Mn = Rpc·Myc − (Rpc·Myc − FL·Sx)(λ − λpf)/(λrf − λpf) (F4-13)';
    } else if (fl === 'slender') {
      Mcap = Math.min(Mcap, (0.9 * E * kc * Sx) / (lf * lf));
      flb = '; flange local buckling Mn = 0.9·E·kc·Sx/λ² (F4-14)';
    }
  } else {
    R = Math.min(1, 1 - (aw / (1200 + 300 * aw)) * (lam - 5.7 * Math.sqrt(E / Fy)));
    rName = 'Rpg (F5-6)';
    Lr = Math.PI * rt * Math.sqrt(E / FL);
    Mcap = R * Fy * Sx;
    if (Lb > Lp && Lb <= Lr) {
      M1 = R * (Fy - 0.3 * Fy * ((Lb - Lp) / (Lr - Lp))) * Sx;
      ltb = 'Lp < Lb ≤ Lr: Mn = Rpg·Fcr·Sx, Fcr = Cb[Fy − 0.3Fy(Lb − Lp)/(Lr − Lp)] ≤ Fy (F5-2, F5-3)';
    } else if (Lb > Lr) {
      M1 = R * ((Math.PI * Math.PI * E) / (Lb / rt) ** 2) * Sx;
      ltb = 'Lb > Lr: Mn = Rpg·Fcr·Sx, Fcr = Cb·π²E/(Lb/rt)² ≤ Fy (F5-2, F5-4)';
    }
    if (fl === 'noncompact') {
      Mcap = Math.min(Mcap, R * (Fy - 0.3 * Fy * ((lf - flange.lambdaP) / (flange.lambdaR - flange.lambdaP))) * Sx);
      flb = '; flange local buckling Mn = Rpg·Fcr·Sx, Fcr = Fy − 0.3Fy(λ − λpf)/(λrf − λpf) (F5-7, F5-8)';
    } else if (fl === 'slender') {
      Mcap = Math.min(Mcap, R * ((0.9 * E * kc) / (lf * lf)) * Sx);
      flb = '; flange local buckling Mn = Rpg·Fcr·Sx, Fcr = 0.9·E·kc/λ² (F5-7, F5-9)';
    }
  }
  const phiWords = cx.method === 'lrfd' ? `φb·Mn, φb = ${AISC_FACTORS.flexure.phi}` : `Mn/Ωb, Ωb = ${AISC_FACTORS.flexure.omega}`;
  return {
    factor, Mcap, M1, ltb,
    head: {
      family: 'bending_major', code: cx.code, clause, title: 'flexure, major axis',
      equation: `${phiWords}; compression flange yielding Mn = ${slenderWeb ? 'Rpg·Fy·Sx (F5-1)' : 'Rpc·Myc (F4-1)'}; lateral-torsional buckling: ${ltb}${flb}`,
      inputs: [
        inp('Fy', 'yield stress', Fy, 'stress'), inp('E', 'elastic modulus', E, 'stress'), inp('Sx', 'elastic modulus, major', Sx, 'modulus'), inp('Zx', 'plastic modulus, major', g.Zmaj, 'modulus'),
        inp('h/tw', `web slenderness (${slenderWeb ? 'slender' : 'noncompact'}, Table B4.1b case 15)`, lam, 'ratio'), inp('aw', 'hc·tw/(bf·tf) (F4-12)', aw, 'ratio'),
        inp(rName.split(' ')[0], `web plastification / bending strength reduction factor ${rName}`, R, 'ratio'),
        inp('bf/2tf', 'flange slenderness', lf, 'ratio'), inp('flange', 'flange class (Table B4.1b)', fl, 'text'),
        inp('rt', 'radius of gyration of the compression flange (F4-11)', rt, 'section_dim'), inp('Lb', 'unbraced length', Lb, 'length'),
        inp('Lp', `limiting length (${slenderWeb ? 'F4-7, F5' : 'F4-7'})`, Lp, 'length'), inp('Lr', `limiting length (${slenderWeb ? 'F5-5' : 'F4-8'})`, Lr, 'length'),
        ...(slenderWeb ? [] : [inp('FL', 'nominal stress limit 0.7Fy (F4-6a)', FL, 'stress'), inp('J', 'torsion constant', g.J, 'inertia'), inp('ho', 'distance between flange centroids', g.ho, 'section_dim')]),
      ],
      quantity: 'moment',
    },
  };
}
