/**
 * AISC 360-22 Chapter G shear strength: G2.1 webs of I-shapes and channels (major axis),
 * G4 rectangular HSS, G5 round HSS, G6 minor-axis shear of I-shapes and channels. Members
 * without transverse stiffeners (kv = 5.34 for webs, 5 for HSS walls, 1.2 for flanges).
 * Tees and angles (G3) and solid bars are `not checked`.
 * A shear area given in `sections` (Av_major, Av_minor) replaces the code's area in the
 * nominal strength — Aw = d·tw (G2.1), 2·bf·tf (G6), 2·h·t (G4), Ag/2 (G5) — and the record
 * says so; the buckling coefficients still come from the section's dimensions. Where no
 * shear rule is implemented the given area is refused with that reason.
 */
import { inp, notCheckedHead } from '../record.js';
import type { DesignGeometry } from '../geometry.js';
import { AISC_FACTORS, factorInput, factorOn, type AiscFactor } from './factors.js';
import type { AiscContext, Capacity } from './context.js';

/** Web shear buckling coefficient Cv1 of G2.1(b) (Eqs. G2-3, G2-4). */
export function cv1(hOverTw: number, kv: number, E: number, Fy: number): number {
  const lim = 1.1 * Math.sqrt((kv * E) / Fy);
  return hOverTw <= lim ? 1 : lim / hOverTw;
}

/** Web shear buckling coefficient Cv2 of G2.2 (Eqs. G2-9 to G2-11). */
export function cv2(hOverTw: number, kv: number, E: number, Fy: number): number {
  const a = 1.1 * Math.sqrt((kv * E) / Fy);
  const b = 1.37 * Math.sqrt((kv * E) / Fy);
  if (hOverTw <= a) return 1;
  if (hOverTw <= b) return a / hOverTw;
  return (1.51 * kv * E) / (hOverTw * hOverTw * Fy);
}

/** The given shear area for an axis, or NaN. */
function givenAv(g: DesignGeometry, family: 'shear_major' | 'shear_minor'): number {
  return family === 'shear_major' ? g.AvGivenMajor : g.AvGivenMinor;
}

const GIVEN_NOTE = 'shear area Av given in sections used in place of the code\'s area';

/** Reason text for a shape without a shear rule, naming a given Av that cannot be used. */
function refused(g: DesignGeometry, family: 'shear_major' | 'shear_minor', reason: string): string {
  const av = givenAv(g, family);
  return Number.isNaN(av) ? reason : `${reason}; the given ${family === 'shear_major' ? 'Av_major' : 'Av_minor'} is therefore not used`;
}

function words(cx: AiscContext, f: AiscFactor): string {
  return cx.method === 'lrfd' ? `φv·Vn, φv = ${f.phi.toFixed(2)}` : `Vn/Ωv, Ωv = ${f.omega.toFixed(2)}`;
}

/** Shear along the web (local z). Lv: distance from maximum to zero shear for G5 (m). */
/** A given shear area that is not positive cannot be used: the reason, or null. */
function badGiven(g: DesignGeometry, family: 'shear_major' | 'shear_minor'): string | null {
  const av = givenAv(g, family);
  return Number.isNaN(av) || av > 0 ? null : `${family === 'shear_major' ? 'Av_major' : 'Av_minor'} given = ${av} is not positive: shear not evaluated`;
}

export function shearMajor(g: DesignGeometry, cx: AiscContext, Lv: number): Capacity {
  const { E, Fy } = cx;
  const bad = badGiven(g, 'shear_major');
  if (bad) return { capacity: NaN, head: notCheckedHead('shear_major', cx.code, 'G', 'shear', bad) };
  if (g.shape === 'i' || g.shape === 'channel') {
    const hTw = g.hw / g.tw;
    const given = !Number.isNaN(g.AvGivenMajor);
    const Aw = given ? g.AvGivenMajor : g.d * g.tw;
    const rolledI = g.shape === 'i' && g.rolled && hTw <= 2.24 * Math.sqrt(E / Fy);
    const f = rolledI ? AISC_FACTORS.shearRolledI : AISC_FACTORS.shear;
    const kv = 5.34;
    const C = rolledI ? 1 : cv1(hTw, kv, E, Fy);
    const Vn = 0.6 * Fy * Aw * C;
    return {
      capacity: factorOn(cx.method, f) * Vn,
      head: {
        family: 'shear_major', code: cx.code, clause: rolledI ? 'G2.1(a)' : 'G2.1(b)', title: 'shear, web',
        equation: `${words(cx, f)}; Vn = 0.6·Fy·Aw·Cv1 (Eq. G2-1), ${given ? 'Aw = Av given' : 'Aw = d·tw'}; ` + (rolledI ? 'rolled I with h/tw ≤ 2.24√(E/Fy): Cv1 = 1.0' : 'Cv1 from Eqs. G2-3/G2-4, kv = 5.34 (no stiffeners)'),
        inputs: [inp('Fy', 'yield stress', Fy, 'stress'), inp('d', 'depth', g.d, 'section_dim'), inp('tw', 'web thickness', g.tw, 'section_dim'), inp('Aw', given ? 'shear area (Av given)' : 'web area', Aw, 'area'), inp('h/tw', 'web slenderness', hTw, 'ratio'), inp('Cv1', 'web shear strength coefficient', C, 'ratio'), inp('Vn', 'nominal shear strength', Vn, 'force'), factorInput(cx.method, f, 'v')],
        quantity: 'force',
        ...(given ? { note: GIVEN_NOTE } : {}),
      },
    };
  }
  if (g.shape === 'rhs') return shearG4(g, cx, 'shear_major', g.h);
  if (g.shape === 'chs') return shearG5(g, cx, 'shear_major', Lv);
  return { capacity: NaN, head: notCheckedHead('shear_major', cx.code, g.shape === 'tee' || g.shape === 'angle' ? 'G3' : 'G', 'shear', refused(g, 'shear_major', `${g.shape} section: shear ${g.shape === 'tee' || g.shape === 'angle' ? 'G3' : '(not covered by G2, G4, G5)'} not implemented`)) };
}

/** Shear along local y (parallel to the flanges). */
export function shearMinor(g: DesignGeometry, cx: AiscContext, Lv: number): Capacity {
  const { E, Fy } = cx;
  const bad = badGiven(g, 'shear_minor');
  if (bad) return { capacity: NaN, head: notCheckedHead('shear_minor', cx.code, 'G', 'shear, minor axis', bad) };
  if (g.shape === 'i' || g.shape === 'channel') {
    const b = g.shape === 'i' ? g.bf / 2 : g.bf;
    const f = AISC_FACTORS.shear;
    const C = cv2(b / g.tf, 1.2, E, Fy);
    const given = !Number.isNaN(g.AvGivenMinor);
    const Av = given ? g.AvGivenMinor : 2 * g.bf * g.tf;
    const Vn = 0.6 * Fy * Av * C;
    return {
      capacity: factorOn(cx.method, f) * Vn,
      head: {
        family: 'shear_minor', code: cx.code, clause: 'G6', title: 'shear, flanges (minor axis)',
        equation: `${words(cx, f)}; Vn = 0.6·Fy·Av·Cv2, ${given ? 'Av = Av given' : 'Av = 2·bf·tf (bf·tf per flange, two flanges)'} (Eq. G6-1), Cv2 from G2.2 with h/tw = b/tf, kv = 1.2`,
        inputs: [inp('Fy', 'yield stress', Fy, 'stress'), inp('bf', 'flange width', g.bf, 'section_dim'), inp('tf', 'flange thickness', g.tf, 'section_dim'), inp('Av', given ? 'shear area (given)' : 'shear area 2·bf·tf', Av, 'area'), inp('b/tf', 'flange slenderness', b / g.tf, 'ratio'), inp('Cv2', 'shear buckling coefficient', C, 'ratio'), inp('Vn', 'nominal shear strength', Vn, 'force'), factorInput(cx.method, f, 'v')],
        quantity: 'force',
        ...(given ? { note: GIVEN_NOTE } : {}),
      },
    };
  }
  if (g.shape === 'rhs') return shearG4(g, cx, 'shear_minor', g.b);
  if (g.shape === 'chs') return shearG5(g, cx, 'shear_minor', Lv);
  return { capacity: NaN, head: notCheckedHead('shear_minor', cx.code, 'G', 'shear, minor axis', refused(g, 'shear_minor', `${g.shape} section: minor-axis shear not implemented`)) };
}

/** G4: Vn = 0.6·Fy·Aw·Cv2, Aw = 2·h·t with h = outside depth − 3t, kv = 5. */
export function shearG4(g: DesignGeometry, cx: AiscContext, family: 'shear_major' | 'shear_minor', outside: number): Capacity {
  const { E, Fy } = cx;
  const f = AISC_FACTORS.shear;
  const h = outside - 3 * g.t;
  const given = !Number.isNaN(givenAv(g, family));
  const Aw = given ? givenAv(g, family) : 2 * h * g.t;
  const C = cv2(h / g.t, 5, E, Fy);
  const Vn = 0.6 * Fy * Aw * C;
  return {
    capacity: factorOn(cx.method, f) * Vn,
    head: {
      family, code: cx.code, clause: 'G4', title: 'shear, HSS walls',
      equation: `${words(cx, f)}; Vn = 0.6·Fy·Aw·Cv2 (Eq. G4-1), ${given ? 'Aw = Av given' : 'Aw = 2·h·t'}, h = outside − 3t, Cv2 from G2.2 with kv = 5`,
      inputs: [inp('Fy', 'yield stress', Fy, 'stress'), inp('h', 'flat wall depth', h, 'section_dim'), inp('t', 'wall thickness', g.t, 'section_dim'), inp('Aw', given ? 'shear area (Av given)' : 'shear area', Aw, 'area'), inp('Cv2', 'shear buckling coefficient', C, 'ratio'), inp('Vn', 'nominal shear strength', Vn, 'force'), factorInput(cx.method, f, 'v')],
      quantity: 'force',
      ...(given ? { note: GIVEN_NOTE } : {}),
    },
  };
}

/** G5: Vn = Fcr·Ag/2, Fcr = max(1.60E/(√(Lv/D)(D/t)^1.25), 0.78E/(D/t)^1.5) ≤ 0.6Fy. */
export function shearG5(g: DesignGeometry, cx: AiscContext, family: 'shear_major' | 'shear_minor', Lv: number): Capacity {
  const { E, Fy } = cx;
  const f = AISC_FACTORS.shear;
  const Dt = g.D / g.t;
  const Fcr = Math.min(0.6 * Fy, Math.max((1.6 * E) / (Math.sqrt(Lv / g.D) * Math.pow(Dt, 1.25)), (0.78 * E) / Math.pow(Dt, 1.5)));
  const given = !Number.isNaN(givenAv(g, family));
  const Av = given ? givenAv(g, family) : g.A / 2;
  const Vn = Fcr * Av;
  return {
    capacity: factorOn(cx.method, f) * Vn,
    head: {
      family, code: cx.code, clause: 'G5', title: 'shear, round HSS',
      equation: `${words(cx, f)}; Vn = Fcr·Av, ${given ? 'Av = Av given' : 'Av = Ag/2'} (Eq. G5-1), Fcr = max(1.60E/(√(Lv/D)(D/t)^(5/4)), 0.78E/(D/t)^(3/2)) ≤ 0.6Fy (Eqs. G5-2a, G5-2b)`,
      inputs: [inp('Fy', 'yield stress', Fy, 'stress'), inp('D/t', 'wall slenderness', Dt, 'ratio'), inp('Lv', 'shear span (member length, conservative)', Lv, 'length'), inp('Fcr', 'critical stress', Fcr, 'stress'), inp('Av', given ? 'shear area (given)' : 'shear area Ag/2', Av, 'area'), inp('Vn', 'nominal shear strength', Vn, 'force'), factorInput(cx.method, f, 'v')],
      quantity: 'force',
      ...(given ? { note: GIVEN_NOTE } : {}),
    },
  };
}
