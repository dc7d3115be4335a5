/**
 * The EN 1993-1-1 plan of one member: resistances computed once, ratios per loading with
 * plain numbers, records on request. Bending (6.2.5 with the 6.2.8 shear reduction) and
 * 6.2.9 are evaluated at every station; 6.3.2 per unbraced segment (segments of length Lb
 * from the start node, each with Lcr = Lb) with C1 from the segment's moment diagram, or
 * the member's given cb used as C1; 6.3.3 with the member's largest forces.
 * Cross-section class for 6.2.9, station by station: I/H and RHS from the actual stress
 * distribution of the web (Table 5.2 with α and ψ from N and My, stress-class.ts) and the
 * flanges in compression; other shapes the worst of the compression and bending classes
 * in compression (conservative), the bending class in tension. 6.3.3 uses the class for
 * the largest compression together with the largest moments of the loading (class 1–2
 * plastic, 3 elastic, 4 effective properties).
 */
import type { StationForces } from '../../engine/types.js';
import type { DesignGeometry } from '../geometry.js';
import { finish, inp, interactionRecord, notChecked, notCheckedHead, type RecordHead } from '../record.js';
import type { CheckRecord } from '../types.js';
import { absMax, negligibleTorsion, segmentCount, type MemberPlan, type MemberSetup, type Slot } from '../plan.js';
import { cbF11, isLinearSegment, segmentMoments, SEG_M0, SEG_M1, SEG_MA, SEG_MB, SEG_MC, SEG_MMAX, SEG_MS, SEG_SIZE, SEG_XMAX } from '../moment-diagram.js';
import type { EnContext, Resistance } from './context.js';
import { enClass, type EnClass } from './classification.js';
import { effectiveScope, effectiveSection } from './effective.js';
import { lastWeb, stationClass, stressClassPlan, webAlpha, webPsi } from './stress-class.js';
import { tensionGross, tensionNet } from './tension.js';
import { compressionResistance } from './compression.js';
import { flexuralBuckling } from './buckling.js';
import { bendingResistance, momentWithShear, type EnBending } from './bending.js';
import { shearResistance } from './shear.js';
import { torsionHead, torsionLast, torsionPlan, torsionRatio } from './torsion.js';
import { axialBendingHead, axialBendingLast, axialBendingPlan, axialBendingRatio } from './axial-bending.js';
import { c1Linear, ltbHead, ltbMb, ltbPlan, ltbResistance } from './ltb.js';
import { annexB, cmB3, interactionHead, type InteractionFactors, type InteractionInput } from './interaction.js';

const D_NT = 0, D_NC = 2, D_T = 4, D_C1 = 6, D_MLT = 7, D_XLT = 8, D_CHILT = 9, D_IMAJ = 10, D_IMIN = 11, D_I629 = 12, D_MY = 13, D_XMY = 14, D_MZ = 15, D_XMZ = 16;
const D_SIZE = 17;

/** C1 of a segment read by segmentMoments: linear diagrams by ψ, others by the F1-1 quarter-point expression, ≤ 2.7. */
export function c1FromSegment(seg: Float64Array): number {
  if (!(seg[SEG_MMAX] > 0)) return 1;
  if (isLinearSegment(seg)) {
    const m0 = seg[SEG_M0], m1 = seg[SEG_M1];
    const big = Math.abs(m0) >= Math.abs(m1) ? m0 : m1;
    const small = Math.abs(m0) >= Math.abs(m1) ? m1 : m0;
    return c1Linear(big === 0 ? 1 : small / big);
  }
  const c = cbF11(seg[SEG_MMAX], seg[SEG_MA], seg[SEG_MB], seg[SEG_MC]);
  return c > 2.7 ? 2.7 : c;
}

export function enPlan(g: DesignGeometry, cx: EnContext, m: MemberSetup): MemberPlan {
  const code = 'en1993-1-1' as const;
  const tg = tensionGross(g, cx);
  const tn = tensionNet(g, cx, m.net, m.netSource);
  const nc = compressionResistance(g, cx);
  const fb = flexuralBuckling(g, cx, m.LcMajor, m.LcMinor);
  const openMono = g.shape === 'channel' || g.shape === 'tee';
  const slots: Slot[] = [{ family: 'tension', key: '6.2.3(2)a' }, { family: 'tension', key: '6.2.3(2)b' }, { family: 'compression', key: '6.2.4' }, { family: 'compression', key: '6.3.1' }];
  const tfb: Resistance | null = openMono
    ? { capacity: NaN, head: notCheckedHead('compression', code, '6.3.1.4', 'torsional-flexural buckling', `${g.shape}: torsional and torsional-flexural buckling (6.3.1.4) not implemented`) }
    : null;
  if (tfb) slots.push({ family: 'compression', key: '6.3.1.4' });
  const frame = !m.truss;
  const iFrame = slots.length;
  const bMaj = bendingResistance(g, cx, 'major');
  const bMin = bendingResistance(g, cx, 'minor');
  const vMaj = shearResistance(g, cx, 'major');
  const vMin = shearResistance(g, cx, 'minor');
  // 6.2.9: class per station (see above); resistances for each class
  const clsBend = g.hasDims ? Math.max(enClass(g, cx.fy, 'major'), g.shape === 'tee' ? 1 : enClass(g, cx.fy, 'minor')) as EnClass : 4;
  const clsComb = g.hasDims ? Math.max(clsBend, enClass(g, cx.fy, 'compression')) as EnClass : 4;
  const combScope = !g.hasDims || g.shape === 'angle' || g.shape === 'tee' || Number.isNaN(bMaj.Mc) || Number.isNaN(bMin.Mc);
  const eff = g.hasDims ? effectiveSection(g, cx.fy) : null;
  const scp = stressClassPlan(g, cx.fy);
  // numerical noise is removed before the plan sees the forces (shared/design/noise.ts): any Mz acts
  const clsAt = (Ni: number, My: number, Mz: number): EnClass => scp.applies ? stationClass(scp, -Ni, My, Mz > 0) : Ni < 0 ? clsComb : clsBend;
  const fyM0 = cx.fy / cx.gammaM0;
  const NRd = g.A * fyM0;
  const ab12 = axialBendingPlan(g, 1, NRd, g.Zmaj * fyM0, g.Zmin * fyM0);
  const ab3 = axialBendingPlan(g, 3, NRd, g.Smaj * fyM0, g.Smin * fyM0);
  const ab4C = eff ? axialBendingPlan(g, 4, eff.Aeff * fyM0, eff.major.W * fyM0, eff.minor.W * fyM0) : null;
  const ab4T = eff ? axialBendingPlan(g, 4, NRd, eff.major.W * fyM0, eff.minor.W * fyM0) : null;
  const abFor = (cl: EnClass, Ni: number) => cl <= 2 ? ab12 : cl === 3 ? ab3 : Ni < 0 ? ab4C : ab4T;
  const noEff = effectiveScope(g) ?? '';
  const ltb = ltbPlan(g, cx, bMaj, m.Lb, m.cantilever);
  if (frame) {
    slots.push({ family: 'bending_major', key: '6.2.5 major' }, { family: 'bending_minor', key: '6.2.5 minor' },
      { family: 'shear_major', key: '6.2.6 major' }, { family: 'shear_minor', key: '6.2.6 minor' }, { family: 'combined', key: '6.2.9' });
    if (ltb.applies) slots.push({ family: 'bending_major', key: '6.3.2' });
    slots.push({ family: 'combined', key: '6.3.3' }, { family: 'torsion', key: '6.2.7' });
  }
  const iLtb = ltb.applies ? iFrame + 5 : -1;
  const i633 = iFrame + (ltb.applies ? 6 : 5);
  const iTor = i633 + 1;
  const nSeg = frame ? segmentCount(m.length, m.Lb) : 1;
  const seg = new Float64Array(SEG_SIZE);
  const d = new Float64Array(D_SIZE);
  const tThreshold = negligibleTorsion(g, cx.fy);
  const tor = torsionPlan(g, cx.fy, cx.gammaM0, vMaj.capacity, vMin.capacity);
  const c1Source = m.cb !== undefined ? 'given cb used as C1' : 'from the moment diagram';
  const ltbNaN = ltb.applies && Number.isNaN(ltb.Mcr1);
  const ii: InteractionInput = {
    NEd: 0, MyEd: 0, MzEd: 0, NRk: g.A * cx.fy, MyRk: g.Zmaj * cx.fy, MzRk: g.Zmin * cx.fy, chiY: fb.chiYA, chiZ: fb.chiZA, chiLT: 1,
    lambdaY: fb.lambdaYA, lambdaZ: fb.lambdaZA, Cmy: 1, Cmz: 1, CmLT: 1, gammaM1: cx.gammaM1, plastic: true,
    iSection: g.shape === 'i', susceptible: g.shape === 'i' || g.shape === 'channel',
  };
  const fac: InteractionFactors = { kyy: 0, kyz: 0, kzy: 0, kzz: 0, r61: 0, r62: 0 };
  const chiBuf = new Float64Array(1);
  const r633NaN = combScope || Number.isNaN(fb.capacity) || ltbNaN;
  let cls633: EnClass = 1;
  /** 6.3.3 resistances for the class of the loading; false when class 4 has no effective section */
  function set633(cl: EnClass): boolean {
    cls633 = cl;
    if (cl <= 2) { ii.NRk = g.A * cx.fy; ii.MyRk = g.Zmaj * cx.fy; ii.MzRk = g.Zmin * cx.fy; ii.plastic = true; }
    else if (cl === 3) { ii.NRk = g.A * cx.fy; ii.MyRk = g.Smaj * cx.fy; ii.MzRk = g.Smin * cx.fy; ii.plastic = false; }
    else if (eff) { ii.NRk = eff.Aeff * cx.fy; ii.MyRk = eff.major.W * cx.fy; ii.MzRk = eff.minor.W * cx.fy; ii.plastic = false; }
    else return false;
    const e4 = cl === 4;
    ii.chiY = e4 ? fb.chiY : fb.chiYA; ii.chiZ = e4 ? fb.chiZ : fb.chiZA;
    ii.lambdaY = e4 ? fb.lambdaY : fb.lambdaYA; ii.lambdaZ = e4 ? fb.lambdaZ : fb.lambdaZA;
    return true;
  }

  function evaluate(sf: StationForces, ratio: Float64Array, xo: Float64Array): void {
    const xs = sf.x;
    const n = xs.length;
    let nt = 0, xt = 0, ncm = 0, xc = 0;
    for (let i = 0; i < n; i++) {
      const v = sf.N[i];
      if (v > nt) { nt = v; xt = xs[i]; } else if (-v > ncm) { ncm = -v; xc = xs[i]; }
    }
    d[D_NT] = nt; d[D_NT + 1] = xt; d[D_NC] = ncm; d[D_NC + 1] = xc;
    ratio[0] = ratioOf(tg.capacity, nt); xo[0] = xt;
    ratio[1] = ratioOf(tn.capacity, nt); xo[1] = xt;
    ratio[2] = ratioOf(nc.capacity, ncm); xo[2] = xc;
    ratio[3] = ratioOf(fb.capacity, ncm); xo[3] = xc;
    if (tfb) { ratio[4] = ncm === 0 ? -1 : NaN; xo[4] = xc; }
    if (!frame) return;
    // bending with shear, and 6.2.9, station by station
    let rMaj = 0, iMaj = 0, rMin = 0, iMin = 0, r629 = 0, i629 = 0, nan629 = false, any629 = false, anyMy = false, anyMz = false;
    const VplMaj = vMaj.capacity, VplMin = vMin.capacity;
    for (let i = 0; i < n; i++) {
      const My = sf.M_major[i] < 0 ? -sf.M_major[i] : sf.M_major[i];
      const Mz = sf.M_minor[i] < 0 ? -sf.M_minor[i] : sf.M_minor[i];
      if (My > 0) {
        anyMy = true;
        const V = sf.V_major[i] < 0 ? -sf.V_major[i] : sf.V_major[i];
        const r = My / (VplMaj === VplMaj ? momentWithShear(bMaj, V, VplMaj) : bMaj.Mc);
        if (r > rMaj) { rMaj = r; iMaj = i; }
      }
      if (Mz > 0) {
        anyMz = true;
        const V = sf.V_minor[i] < 0 ? -sf.V_minor[i] : sf.V_minor[i];
        const r = Mz / (VplMin === VplMin ? momentWithShear(bMin, V, VplMin) : bMin.Mc);
        if (r > rMin) { rMin = r; iMin = i; }
      }
      if (!nan629) {
        const Ni = sf.N[i];
        if (Ni !== 0 || My > 0 || Mz > 0) any629 = true;
        // outside scope: not checked when bending acts (axial force alone is 6.2.3 / 6.2.4)
        if (combScope) { if (My > 0 || Mz > 0) nan629 = true; }
        else {
          const cl = clsAt(Ni, My, Mz);
          const ab = abFor(cl, Ni);
          if (!ab) { if (Ni !== 0 || My > 0 || Mz > 0) nan629 = true; }
          else {
            const r = axialBendingRatio(ab, Ni < 0 ? -Ni : Ni, My, Mz);
            if (r > r629) { r629 = r; i629 = i; }
          }
        }
      }
    }
    d[D_IMAJ] = iMaj; d[D_IMIN] = iMin; d[D_I629] = i629;
    ratio[iFrame] = Number.isNaN(bMaj.Mc) ? (anyMy ? NaN : -1) : rMaj; xo[iFrame] = xs[iMaj];
    ratio[iFrame + 1] = Number.isNaN(bMin.Mc) ? (anyMz ? NaN : -1) : rMin; xo[iFrame + 1] = xs[iMin];
    absMax(sf.V_major, xs, d, D_T);
    ratio[iFrame + 2] = ratioOf(vMaj.capacity, d[D_T]); xo[iFrame + 2] = d[D_T + 1];
    absMax(sf.V_minor, xs, d, D_T);
    ratio[iFrame + 3] = ratioOf(vMin.capacity, d[D_T]); xo[iFrame + 3] = d[D_T + 1];
    ratio[iFrame + 4] = nan629 ? NaN : combScope || !any629 ? -1 : r629; xo[iFrame + 4] = xs[i629];
    // lateral-torsional buckling by segment
    let chiMin = 1;
    let wholeInSeg = false; // seg holds the whole member's M_major diagram
    if (ltb.applies) {
      let rL = 0, xL = 0, c1Gov = 1, mGov = 0;
      if (!ltbNaN) {
        const L = m.length;
        for (let s = 0; s < nSeg; s++) {
          const a = nSeg === 1 ? 0 : s * m.Lb;
          const b = nSeg === 1 ? L : Math.min(L, a + m.Lb);
          segmentMoments(xs, sf.M_major, a, b, seg);
          const c1 = m.cb !== undefined ? m.cb : c1FromSegment(seg);
          const Mb = ltbMb(ltb, c1, chiBuf);
          if (chiBuf[0] < chiMin) chiMin = chiBuf[0];
          const r = seg[SEG_MMAX] === 0 ? 0 : seg[SEG_MMAX] / Mb;
          if (s === 0 || r > rL) { rL = r; xL = seg[SEG_XMAX]; c1Gov = c1; mGov = seg[SEG_MMAX]; }
        }
        wholeInSeg = nSeg === 1;
      }
      d[D_C1] = c1Gov; d[D_MLT] = mGov; d[D_XLT] = xL; d[D_CHILT] = chiMin;
      ratio[iLtb] = ltbNaN ? (anyMy ? NaN : -1) : rL; xo[iLtb] = xL;
    }
    // 6.3.3
    absMax(sf.M_major, xs, d, D_MY);
    absMax(sf.M_minor, xs, d, D_MZ);
    if (ncm === 0) { ratio[i633] = -1; xo[i633] = 0; }
    else if (r633NaN || nan629 || (Number.isNaN(bMaj.Mc) && d[D_MY] > 0) || !set633(clsAt(-ncm, d[D_MY], d[D_MZ]))) { ratio[i633] = NaN; xo[i633] = xc; }
    else {
      if (!wholeInSeg) segmentMoments(xs, sf.M_major, 0, m.length, seg);
      ii.Cmy = cmB3(seg[SEG_M0], seg[SEG_M1], seg[SEG_MS], isLinearSegment(seg));
      ii.CmLT = ii.Cmy;
      if (anyMz) {
        segmentMoments(xs, sf.M_minor, 0, m.length, seg);
        ii.Cmz = cmB3(seg[SEG_M0], seg[SEG_M1], seg[SEG_MS], isLinearSegment(seg));
      } else ii.Cmz = 1;
      ii.NEd = ncm; ii.MyEd = d[D_MY]; ii.MzEd = d[D_MZ]; ii.chiLT = ltb.applies ? chiMin : 1;
      const f = annexB(ii, fac);
      ratio[i633] = f.r61 > f.r62 ? f.r61 : f.r62; xo[i633] = d[D_MY] > 0 ? d[D_XMY] : xc;
    }
    absMax(sf.T, xs, d, D_T);
    if (d[D_T] > tThreshold && tor.applies) { ratio[iTor] = torsionRatio(tor, sf); xo[iTor] = xs[torsionLast.i]; }
    else { ratio[iTor] = d[D_T] > tThreshold ? NaN : -1; xo[iTor] = d[D_T + 1]; }
  }

  const ratio = new Float64Array(slots.length);
  const xo = new Float64Array(slots.length);

  // LTB record heads depend only on C1: computed once per plan (and C1 value)
  const ltbAt = new Map<number, { head: RecordHead; Mb: number }>();
  function ltbAtC1(c1: number): { head: RecordHead; Mb: number } {
    let h = ltbAt.get(c1);
    if (!h) {
      h = { head: ltbHead(ltb, c1, c1Source), Mb: ltbResistance(ltb, c1).Mb };
      if (ltbAt.size > 64) ltbAt.clear();
      ltbAt.set(c1, h);
    }
    return h;
  }

  function rec(id: string, combination: string, head: RecordHead, capacity: number, demand: number, x: number): CheckRecord {
    return Number.isNaN(capacity) ? notChecked(id, head.family, code, head.clause, head.title, head.note ?? '', combination) : finish(head, id, combination, capacity, demand, x);
  }

  function bendRecord(id: string, combination: string, sf: StationForces, b: EnBending, v: Resistance, i: number, M: Float64Array, V: Float64Array): CheckRecord {
    const Vi = Math.abs(V[i]);
    const cap = Number.isNaN(b.Mc) ? NaN : Number.isNaN(v.capacity) ? b.Mc : momentWithShear(b, Vi, v.capacity);
    const rho = ((2 * Vi) / v.capacity - 1) ** 2;
    const head = cap < b.Mc ? {
      ...b.head, clause: '6.2.8', note: `VEd = ${(Vi / 1e3).toPrecision(4)} kN > 0.5·Vpl,Rd: moment resistance reduced`,
      inputs: [...b.head.inputs, inp('VEd', 'shear force at this station', Vi, 'force'), inp('Vpl,Rd', 'plastic shear resistance (6.18)', v.capacity, 'force'),
        inp('ρ', '(2VEd/Vpl,Rd − 1)² (6.29)', Math.min(1, rho), 'ratio'),
        ...(b.iWeb ? [inp('Wpl,y', 'plastic modulus', b.Wpl, 'modulus'), inp('Aw', 'hw·tw', b.Aw, 'area'), inp('tw', 'web thickness', b.tw, 'section_dim')] : []),
        inp('MV,Rd', 'reduced moment resistance', cap, 'moment')],
    } : b.head;
    return rec(id, combination, head, cap, Math.abs(M[i]), sf.x[i]);
  }

  function records(sf: StationForces, combination: string, want?: ArrayLike<number>, member?: string): (CheckRecord | null)[] {
    evaluate(sf, ratio, xo);
    const id = member ?? m.id;
    const out: (CheckRecord | null)[] = new Array(slots.length).fill(null);
    if (!want || want[0]) out[0] = rec(id, combination, tg.head, tg.capacity, d[D_NT], d[D_NT + 1]);
    if (!want || want[1]) out[1] = rec(id, combination, tn.head, tn.capacity, d[D_NT], d[D_NT + 1]);
    if (!want || want[2]) out[2] = rec(id, combination, nc.head, nc.capacity, d[D_NC], d[D_NC + 1]);
    if (!want || want[3]) out[3] = rec(id, combination, fb.head, fb.capacity, d[D_NC], d[D_NC + 1]);
    if (tfb && (!want || want[4])) out[4] = rec(id, combination, tfb.head, NaN, 0, 0);
    if (!frame) return out;
    const xs = sf.x;
    if (!want || want[iFrame]) out[iFrame] = bendRecord(id, combination, sf, bMaj, vMaj, d[D_IMAJ], sf.M_major, sf.V_major);
    if (!want || want[iFrame + 1]) out[iFrame + 1] = bendRecord(id, combination, sf, bMin, vMin, d[D_IMIN], sf.M_minor, sf.V_minor);
    if (!want || want[iFrame + 2]) out[iFrame + 2] = rec(id, combination, vMaj.head, vMaj.capacity, maxAbs(sf.V_major), xo[iFrame + 2]);
    if (!want || want[iFrame + 3]) out[iFrame + 3] = rec(id, combination, vMin.head, vMin.capacity, maxAbs(sf.V_minor), xo[iFrame + 3]);
    if (!want || want[iFrame + 4]) {
      if (Number.isNaN(ratio[iFrame + 4])) {
        out[iFrame + 4] = notChecked(id, 'combined', code, '6.2.9', 'bending and axial force, cross-section', !combScope && noEff ? `${noEff} (class 4 under this loading)` : `${g.shape} section: a component resistance is not checked`, combination);
      } else {
        const i = d[D_I629];
        const Ni = sf.N[i];
        const My = Math.abs(sf.M_major[i]), Mz = Math.abs(sf.M_minor[i]);
        const cl = clsAt(Ni, My, Mz);
        const h = axialBendingHead(abFor(cl, Ni)!, Math.abs(Ni), My, Mz);
        h.inputs = [...h.inputs, inp('class', 'cross-section class at this station (Table 5.2)', cl, 'ratio')];
        if (scp.applies) {
          lastWeb.alpha = webAlpha(scp, -Ni, My); lastWeb.psi = webPsi(scp, -Ni, My);
          h.inputs.push(inp('α', 'compressed fraction of the web, plastic (Table 5.2)', lastWeb.alpha, 'ratio'),
            inp('ψ', Number.isNaN(lastWeb.psi) ? 'web wholly in tension' : 'web edge stress ratio σ2/σ1, elastic (Table 5.2)', Number.isNaN(lastWeb.psi) ? 'n/a' : lastWeb.psi, Number.isNaN(lastWeb.psi) ? 'text' : 'ratio'));
        }
        const form = axialBendingLast.form;
        out[iFrame + 4] = form === 'major' || form === 'minor'
          ? finish({ ...h, quantity: 'moment' }, id, combination, form === 'major' ? axialBendingLast.MNy : axialBendingLast.MNz, form === 'major' ? My : Mz, xs[i])
          : interactionRecord(h, id, combination, ratio[iFrame + 4], xs[i]);
      }
    }
    if (ltb.applies && (!want || want[iLtb])) {
      if (ltbNaN) out[iLtb] = rec(id, combination, ltb.head, NaN, 0, 0);
      else { const h = ltbAtC1(d[D_C1]); out[iLtb] = finish(h.head, id, combination, h.Mb, d[D_MLT], d[D_XLT]); }
    }
    const r633 = ratio[i633];
    if ((!want || want[i633]) && r633 !== -1) {
      if (Number.isNaN(r633)) out[i633] = notChecked(id, 'combined', code, '6.3.3', 'member buckling, bending and axial compression', 'a component resistance (class, buckling or LTB) is not checked for this member', combination);
      else {
        const h = interactionHead(ii, annexB(ii));
        h.inputs.push(inp('class', 'class for the largest NEd with the largest moments (Table 5.2)', cls633, 'ratio'));
        if (cls633 === 4) h.equation += '; class 4: NRk = Aeff·fy, My,Rk = Weff,y·fy, Mz,Rk = Weff,z·fy, ΔM = eN·NEd = 0 (doubly symmetric)';
        out[i633] = interactionRecord(h, id, combination, r633, xo[i633]);
      }
    }
    if ((!want || want[iTor]) && ratio[iTor] >= 0) out[iTor] = interactionRecord(torsionHead(tor, sf), id, combination, ratio[iTor], xo[iTor]);
    if ((!want || want[iTor]) && Number.isNaN(ratio[iTor])) out[iTor] = notChecked(id, 'torsion', code, '6.2.7', 'torsion', `torsion present (|T| up to ${(d[D_T] / 1e3).toPrecision(3)} kNm): 6.2.7 not implemented`, combination);
    return out;
  }

  return { member: m.id, slots, evaluate, records };
}

/** demand/capacity; a capacity outside scope gives NaN (not checked) with demand, −1 (not applicable) without. */
function ratioOf(cap: number, demand: number): number {
  return demand === 0 ? (cap !== cap ? -1 : 0) : cap !== cap ? NaN : demand / cap;
}

function maxAbs(v: Float64Array): number {
  let m = 0;
  for (let i = 0; i < v.length; i++) { const a = Math.abs(v[i]); if (a > m) m = a; }
  return m;
}
