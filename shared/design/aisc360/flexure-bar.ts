/**
 * AISC 360-22 F11: rectangular and round solid bars. Yielding Mn = Mp = Fy·Z ≤ 1.6·Fy·S
 * (F11-1). Lateral-torsional buckling of rectangular bars bent about the major axis
 * (depth h > width b): with λ = Lb·d/t² (d depth, t width), no LTB for λ ≤ 0.08E/Fy;
 * Mn = Cb[1.52 − 0.274·λ·Fy/E]·My ≤ Mp for λ ≤ 1.9E/Fy (F11-2); Mn = Fcr·Sx ≤ Mp,
 * Fcr = 1.9E·Cb/λ otherwise (F11-3, F11-4).
 */
import { inp } from '../record.js';
import type { DesignGeometry } from '../geometry.js';
import { AISC_FACTORS, factorOn } from './factors.js';
import type { AiscContext } from './context.js';
import type { FlexureCapacity } from './flexure.js';

export function flexureF11(g: DesignGeometry, cx: AiscContext, axis: 'major' | 'minor', Lb: number): FlexureCapacity {
  const { E, Fy } = cx;
  const family = axis === 'major' ? 'bending_major' : 'bending_minor';
  const factor = factorOn(cx.method, AISC_FACTORS.flexure);
  const Z = axis === 'major' ? g.Zmaj : g.Zmin;
  const S = axis === 'major' ? g.Smaj : g.Smin;
  const Mp = Math.min(Fy * Z, 1.6 * Fy * S);
  const words = ['yielding Mn = Mp = Fy·Z ≤ 1.6·Fy·S (Eq. F11-1)'];
  const inputs = [inp('Fy', 'yield stress', Fy, 'stress'), inp('E', 'elastic modulus', E, 'stress'), inp('Z', 'plastic modulus', Z, 'modulus'), inp('S', 'elastic modulus', S, 'modulus'), inp('Mp', 'plastic moment', Mp, 'moment')];
  let M1 = Infinity;
  let ltb = 'not applicable';
  if (g.shape === 'rect' && axis === 'major' && g.h > g.b) {
    const lam = (Lb * g.h) / (g.b * g.b);
    const My = Fy * S;
    inputs.push(inp('Lb', 'unbraced length', Lb, 'length'), inp('Lb·d/t²', 'bar slenderness', lam, 'ratio'));
    if (lam <= (0.08 * E) / Fy) ltb = 'Lb·d/t² ≤ 0.08E/Fy: no lateral-torsional buckling';
    else if (lam <= (1.9 * E) / Fy) {
      M1 = (1.52 - 0.274 * lam * (Fy / E)) * My;
      ltb = 'Mn = Cb[1.52 − 0.274(Lb·d/t²)(Fy/E)]·My ≤ Mp (Eq. F11-2)';
    } else {
      M1 = ((1.9 * E) / lam) * S;
      ltb = 'Mn = Fcr·Sx ≤ Mp, Fcr = 1.9E·Cb/(Lb·d/t²) (Eqs. F11-3, F11-4)';
    }
    words.push(`lateral-torsional buckling: ${ltb}`);
  }
  const phiWords = cx.method === 'lrfd' ? `φb·Mn, φb = ${AISC_FACTORS.flexure.phi}` : `Mn/Ωb, Ωb = ${AISC_FACTORS.flexure.omega}`;
  return {
    factor, Mcap: Mp, M1, ltb,
    head: { family, code: cx.code, clause: 'F11', title: `flexure, ${axis} axis`, equation: `${phiWords}; ${words.join('; ')}`, inputs, quantity: 'moment' },
  };
}
