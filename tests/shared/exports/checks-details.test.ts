/**
 * The detailed-checks export's `details` column: every input and intermediate of a record
 * as `symbol=value unit` separated by `; `, in the model's unit system, and a row per axis
 * for checks made about each axis — so a checker can reproduce a capacity from the export
 * alone. Each capacity below is recomputed from the parsed `details` cell only, with the
 * code's equation written out; rtol 1e-5 (details carry 7 significant digits).
 */
import { describe, expect, it } from 'vitest';
import { aiscContext } from '../../../shared/design/aisc360/context.js';
import { aiscPlan } from '../../../shared/design/aisc360/member.js';
import { enPlan } from '../../../shared/design/en1993/member.js';
import { designGeometry } from '../../../shared/design/geometry.js';
import type { CheckRecord } from '../../../shared/design/types.js';
import { checksTable, detailsOf, toCsv } from '../../../shared/exports/index.js';
import { close, FT, HEB200, IN, IPE300, KIP, KSI, MPA, stations, W14X90, W18X50 } from '../design/helpers.js';
import { model } from '../design/model-helpers.js';

/** `symbol=value unit; …` → symbol → { value, unit } (text values kept as text). */
function parseDetails(cell: string): Map<string, { value: number; unit: string; text: string }> {
  const out = new Map<string, { value: number; unit: string; text: string }>();
  for (const part of cell.split('; ')) {
    const eq = part.indexOf('=');
    const symbol = part.slice(0, eq);
    const rest = part.slice(eq + 1);
    const m = /^(-?[\d.]+(?:e[-+]?\d+)?)(?: (.+))?$/i.exec(rest);
    out.set(symbol, m ? { value: Number(m[1]), unit: m[2] ?? '', text: rest } : { value: NaN, unit: '', text: rest });
  }
  return out;
}

const col = (header: string[], name: string) => header.indexOf(name);
const records = (recs: (CheckRecord | null)[]) => recs.filter((r): r is CheckRecord => r !== null);

describe('details column', () => {
  it('writes symbol=value unit separated by "; " in the model unit system, text values kept and ";" inside them made ","', () => {
    const s = detailsOf([
      { symbol: 'Fy', name: 'yield', value: 50 * KSI, quantity: 'stress' },
      { symbol: 'U', name: 'shear lag', value: 0.9, quantity: 'ratio' },
      { symbol: 'assumed', name: 'a', value: 'An = Ag; U = 1', quantity: 'text' },
    ], 'us', 10 * FT);
    expect(s).toBe('Fy=50 ksi; U=0.9; assumed=An = Ag, U = 1; x=10 ft');
  });

  it('AISC E3 W14x90, Lc,major = 30 ft, Lc,minor = 15 ft: one row per axis, each φcPn recomputed from its details alone (Fe = π²E/(Lc/r)², Fcr = 0.658^(Fy/Fe)·Fy or 0.877Fe, φcPn = 0.90·Fcr·Ag; Eqs. E3-1 to E3-4)', () => {
    const L = 30 * FT;
    const g = designGeometry(W14X90());
    const cx = aiscContext('lrfd', 29000 * KSI, 11200 * KSI, 50 * KSI, 65 * KSI);
    const plan = aiscPlan(g, cx, { id: 'C1', length: L, truss: true, LcMajor: L, LcMinor: L / 2, Lb: L, cantilever: false });
    const recs = records(plan.records(stations(L, { N: () => -500 * KIP }), 'U1'));
    const t = checksTable(model([], [], [], [], { units: 'us', designCode: 'aisc360-lrfd' }), { members: [], records: recs });
    const rows = t.rows.filter((r) => r[col(t.header, 'clause')] === 'E3');
    expect(rows.map((r) => r[col(t.header, 'check')])).toEqual(['flexural buckling, major axis', 'flexural buckling, minor axis']);
    const e3 = recs.find((r) => r.clause === 'E3')!;
    for (const row of rows) {
      const d = parseDetails(String(row[col(t.header, 'details')]));
      const axis = String(row[col(t.header, 'check')]).includes('major') ? 'major' : 'minor';
      const Fy = d.get('Fy')!.value, E = d.get('E')!.value, Ag = d.get('Ag')!.value;
      expect(d.get('Fy')!.unit).toBe('ksi');
      expect(d.get('Ag')!.unit).toBe('in2');
      const Lc = d.get(`Lc,${axis}`)!.value * 12; // ft → in
      const r = d.get(`r_${axis}`)!.value;
      const Fe = (Math.PI ** 2 * E) / (Lc / r) ** 2;
      expect(close(Fe, d.get('Fe')!.value, 1e-5)).toBe(true);
      const Fcr = Fy / Fe <= 2.25 ? 0.658 ** (Fy / Fe) * Fy : 0.877 * Fe;
      expect(close(Fcr, d.get('Fcr')!.value, 1e-5)).toBe(true);
      const phiPn = d.get('φc')!.value * Fcr * Ag; // kips
      expect(close(phiPn, Number(row[col(t.header, 'capacity')]), 1e-5)).toBe(true);
      expect(close(Number(row[col(t.header, 'ratio')]), 500 / phiPn, 1e-5)).toBe(true);
    }
    // the governing axis is the record's: its ratio is the largest of the per-axis rows
    const ratios = rows.map((r) => Number(r[col(t.header, 'ratio')]));
    expect(close(Math.max(...ratios), e3.ratio!, 1e-9)).toBe(true);
    expect(toCsv(t).split('\r\n')[0]).toBe('member,combination,check,clause,demand,capacity,ratio,status,note,unit,details');
  });

  it('EN 6.3.1 HE 200 B S235, Lcr = 4 m: a row for χy and one for χz, Nb,Rd recomputed from λ̄, Φ, χ in details alone (Φ = 0.5[1 + α(λ̄ − 0.2) + λ̄²], χ = 1/(Φ + √(Φ² − λ̄²)), Nb,Rd = χ·A·fy/γM1; 6.47, 6.49)', () => {
    const L = 4;
    const g = designGeometry(HEB200());
    const cx = { E: 210e9, G: 80.77e9, fy: 235 * MPA, fu: 360 * MPA, gammaM0: 1, gammaM1: 1, gammaM2: 1.25, hotFinished: false };
    const plan = enPlan(g, cx, { id: 'C1', length: L, truss: true, LcMajor: L, LcMinor: L, Lb: L, cantilever: false });
    const recs = records(plan.records(stations(L, { N: () => -600e3 }), 'U1'));
    const t = checksTable(model([], [], [], []), { members: [], records: recs });
    const rows = t.rows.filter((r) => r[col(t.header, 'clause')] === '6.3.1');
    expect(rows).toHaveLength(2);
    for (const row of rows) {
      const d = parseDetails(String(row[col(t.header, 'details')]));
      const y = String(row[col(t.header, 'check')]).includes('major');
      const lam = d.get(y ? 'λ̄y' : 'λ̄z')!.value, alpha = d.get(y ? 'αy' : 'αz')!.value;
      const Phi = 0.5 * (1 + alpha * (lam - 0.2) + lam * lam);
      expect(close(Phi, d.get(y ? 'Φy' : 'Φz')!.value, 1e-5)).toBe(true);
      const chi = Math.min(1, 1 / (Phi + Math.sqrt(Phi * Phi - lam * lam)));
      expect(close(chi, d.get(y ? 'χy' : 'χz')!.value, 1e-5)).toBe(true);
      // λ̄ = √(A·fy/Ncr), Ncr = π²EI/Lcr² (6.50), A mm², fy MPa, E MPa, I mm4, Lcr m
      const A = d.get('A')!.value, fy = d.get('fy')!.value, E = d.get('E')!.value, I = d.get(y ? 'Iy' : 'Iz')!.value, Lcr = d.get(y ? 'Lcr,y' : 'Lcr,z')!.value * 1000;
      expect(close(Math.sqrt((A * fy) / ((Math.PI ** 2 * E * I) / Lcr ** 2)), lam, 1e-5)).toBe(true);
      const NbRd = (chi * A * fy) / d.get('γM1')!.value / 1e3; // kN
      expect(close(NbRd, Number(row[col(t.header, 'capacity')]), 1e-5)).toBe(true);
    }
  });

  it('AISC D2(a), D2(b) with An and U, G2.1 and F2 in the inelastic LTB range recomputed from details alone (φtFyAg; φtFuUAn; φv·0.6FyAwCv1; Cb[Mp − (Mp − 0.7FySx)(Lb − Lp)/(Lr − Lp)] ≤ Mp; Eqs. D2-1, D2-2, D3-1, G2-1, F2-2)', () => {
    const L = 12 * FT;
    const g = designGeometry(W18X50());
    const cx = aiscContext('lrfd', 29000 * KSI, 11200 * KSI, 50 * KSI, 65 * KSI);
    const plan = aiscPlan(g, cx, { id: 'B1', length: L, truss: false, LcMajor: L, LcMinor: L, Lb: L, cantilever: false, net: { An: 12 * IN * IN, U: 0.9 }, netSource: 'member B1' });
    // uniform load on a simple span with axial tension: M = wx(L − x)/2, V = w(L/2 − x)
    const w = 3 * KIP / FT;
    const recs = records(plan.records(stations(L, { N: () => 50 * KIP, M_major: (x) => (w * x * (L - x)) / 2, V_major: (x) => w * (L / 2 - x) }), 'U1'));
    const t = checksTable(model([], [], [], [], { units: 'us', designCode: 'aisc360-lrfd' }), { members: [], records: recs });
    const get = (clause: string) => {
      const row = t.rows.find((r) => r[col(t.header, 'clause')] === clause)!;
      return { d: parseDetails(String(row[col(t.header, 'details')])), capacity: Number(row[col(t.header, 'capacity')]) };
    };
    const a = get('D2(a)');
    expect(close(a.d.get('φt')!.value * a.d.get('Fy')!.value * a.d.get('Ag')!.value, a.capacity, 1e-5)).toBe(true);
    const b = get('D2(b)');
    expect(close(b.d.get('φt')!.value * b.d.get('Fu')!.value * b.d.get('U')!.value * b.d.get('An')!.value, b.capacity, 1e-5)).toBe(true);
    const v = get('G2.1(a)');
    expect(close(v.d.get('φv')!.value * 0.6 * v.d.get('Fy')!.value * v.d.get('Aw')!.value * v.d.get('Cv1')!.value, v.capacity, 1e-5)).toBe(true);
    const f = get('F2');
    const Fy = f.d.get('Fy')!.value, Zx = f.d.get('Zx')!.value, Sx = f.d.get('Sx')!.value, Lb = f.d.get('Lb')!.value, Lp = f.d.get('Lp')!.value, Lr = f.d.get('Lr')!.value, Cb = f.d.get('Cb')!.value;
    expect(Lb > Lp && Lb <= Lr).toBe(true);
    const Mp = Fy * Zx;
    const Mn = Math.min(Mp, Cb * (Mp - (Mp - 0.7 * Fy * Sx) * ((Lb - Lp) / (Lr - Lp)))) / 12; // kip-in → kip-ft
    expect(close(f.d.get('φb')!.value * Mn, f.capacity, 1e-5)).toBe(true);
  });

  it('EN 6.3.2.3 IPE 300 S235, L = 5 m recomputed from details alone (Mcr = C1·π²EIz/L²·√(Iw/Iz + L²GIt/(π²EIz)), λ̄LT = √(Wy·fy/Mcr), ΦLT, χLT = 1/(ΦLT + √(ΦLT² − βλ̄LT²)) ≤ 1/λ̄LT², Mb,Rd = χLT·Wy·fy/γM1; 6.55–6.57)', () => {
    const L = 5;
    const cx = { E: 210e9, G: 80.77e9, fy: 235 * MPA, fu: 360 * MPA, gammaM0: 1, gammaM1: 1, gammaM2: 1.25, hotFinished: false };
    const plan = enPlan(designGeometry(IPE300()), cx, { id: 'B', length: L, truss: false, LcMajor: L, LcMinor: L, Lb: L, cantilever: false });
    const recs = records(plan.records(stations(L, { M_major: (x) => 50e3 * (1 - x / L) }), 'U1'));
    const t = checksTable(model([], [], [], []), { members: [], records: recs });
    const row = t.rows.find((r) => r[col(t.header, 'clause')] === '6.3.2.3')!;
    const d = parseDetails(String(row[col(t.header, 'details')]));
    const v = (k: string) => d.get(k)!.value;
    // units: E, G MPa; Iz, It mm4; Iw mm6; L m; Wy mm3; fy MPa → N·mm
    const E = v('E'), G = v('G'), Iz = v('Iz'), Iw = v('Iw'), It = v('It'), Lmm = v('L') * 1000;
    const Mcr = v('C1') * (Math.PI ** 2 * E * Iz) / Lmm ** 2 * Math.sqrt(Iw / Iz + (Lmm ** 2 * G * It) / (Math.PI ** 2 * E * Iz)) / 1e6; // kNm
    expect(close(Mcr, v('Mcr'), 1e-5)).toBe(true);
    const lam = Math.sqrt((v('Wy') * v('fy')) / 1e6 / Mcr);
    expect(close(lam, v('λ̄LT'), 1e-5)).toBe(true);
    const Phi = 0.5 * (1 + v('αLT') * (lam - v('λ̄LT,0')) + v('β') * lam * lam);
    const chi = Math.min(1, 1 / lam ** 2, 1 / (Phi + Math.sqrt(Phi * Phi - v('β') * lam * lam)));
    expect(close(chi, v('χLT'), 1e-5)).toBe(true);
    expect(close((chi * v('Wy') * v('fy')) / v('γM1') / 1e6, Number(row[col(t.header, 'capacity')]), 1e-5)).toBe(true);
  });

  it('a record about one axis keeps one row whose details list its inputs and the position x', () => {
    const L = 4;
    const g = designGeometry(HEB200());
    const cx = { E: 210e9, G: 80.77e9, fy: 235 * MPA, fu: 360 * MPA, gammaM0: 1, gammaM1: 1, gammaM2: 1.25, hotFinished: false };
    const plan = enPlan(g, cx, { id: 'T1', length: L, truss: true, LcMajor: L, LcMinor: L, Lb: L, cantilever: false });
    const recs = records(plan.records(stations(L, { N: () => 300e3 }), 'U1'));
    const t = checksTable(model([], [], [], []), { members: [], records: recs });
    const row = t.rows.find((r) => r[col(t.header, 'clause')] === '6.2.3(2)a')!;
    const d = parseDetails(String(row[col(t.header, 'details')]));
    // Npl,Rd = A·fy/γM0 (6.6) from details: 7808 mm² · 235 MPa / 1.0 = 1834.9 kN
    expect(close((d.get('A')!.value * d.get('fy')!.value) / d.get('γM0')!.value / 1e3, Number(row[col(t.header, 'capacity')]), 1e-5)).toBe(true);
    expect(d.get('x')!.unit).toBe('m');
  });
});
