/**
 * The AISC 360-22 plan of one member: capacities computed once, ratios per loading with
 * plain numbers, records on request. Cb from F1-1 per unbraced segment (segments of
 * length Lb from the start node; every segment uses Lb) unless the member gives cb;
 * Cb = 1.0 for cantilevers (F1). H1-1 is evaluated at every station with the axial force
 * and moments there and the flexural strength of the station's segment.
 */
import type { StationForces } from '../../engine/types.js';
import type { DesignGeometry } from '../geometry.js';
import { finish, interactionRecord, notChecked, type RecordHead } from '../record.js';
import type { CheckRecord } from '../types.js';
import { absMax, negligibleTorsion, segmentCount, type MemberPlan, type MemberSetup, type Slot } from '../plan.js';
import { cbF11, segmentMoments, SEG_MA, SEG_MB, SEG_MC, SEG_MMAX, SEG_SIZE, SEG_XMAX } from '../moment-diagram.js';
import type { AiscContext, Capacity } from './context.js';
import { tensionRuptureD2b, tensionYieldD2a } from './tension.js';
import { compressionE3, compressionE4 } from './compression.js';
import { designMoment, flexureAt, type FlexureCapacity } from './flexure.js';
import { flexureMajorI } from './flexure-i.js';
import { flexureMinorF6 } from './flexure-minor.js';
import { flexureF7, flexureF8 } from './flexure-hss.js';
import { flexureF11 } from './flexure-bar.js';
import { shearMajor, shearMinor } from './shear.js';
import { h1, h1Head } from './interaction.js';
import { notCheckedHead } from '../record.js';

/** Flexural strength; Lb = 0 (continuously braced) says in the record that LTB does not apply. */
function flexure(g: DesignGeometry, cx: AiscContext, axis: 'major' | 'minor', Lb: number): FlexureCapacity {
  const f = flexureOf(g, cx, axis, Lb);
  if (Lb === 0 && axis === 'major' && !Number.isNaN(f.Mcap)) {
    const said = 'lb = 0: continuously braced, lateral-torsional buckling does not apply (Lb = 0 ≤ Lp)';
    return { ...f, M1: Infinity, head: { ...f.head, note: f.head.note ? `${f.head.note}; ${said}` : said } };
  }
  return f;
}

function flexureOf(g: DesignGeometry, cx: AiscContext, axis: 'major' | 'minor', Lb: number): FlexureCapacity {
  const family = axis === 'major' ? 'bending_major' : 'bending_minor';
  const none = (clause: string, reason: string): FlexureCapacity => ({ head: notCheckedHead(family, cx.code, clause, `flexure, ${axis} axis`, reason), factor: 1, Mcap: NaN, M1: Infinity, ltb: '' });
  switch (g.shape) {
    case 'i': case 'channel': return axis === 'major' ? flexureMajorI(g, cx, Lb) : flexureMinorF6(g, cx);
    case 'rhs': return flexureF7(g, cx, axis, Lb);
    case 'chs': return flexureF8(g, cx, axis);
    case 'rect': case 'round': return flexureF11(g, cx, axis, Lb);
    case 'tee': return none('F9', 'tee in flexure: F9 not implemented');
    case 'angle': return none('F10', 'single angle in flexure: F10 not implemented');
    default: return none('F', 'custom section: flexural limit states need the shape, not evaluated');
  }
}

// detail slots written by evaluate and read by records
const D_NT = 0, D_NC = 2, D_MMIN = 4, D_VMAJ = 6, D_VMIN = 8, D_T = 10, D_CB = 12, D_MMAJ = 13, D_XMAJ = 14, D_H1I = 15;
const D_SIZE = 16;

export function aiscPlan(g: DesignGeometry, cx: AiscContext, m: MemberSetup): MemberPlan {
  const ty = tensionYieldD2a(g, cx);
  const tr = tensionRuptureD2b(g, cx, m.net, m.netSource);
  const e3 = compressionE3(g, cx, m.LcMajor, m.LcMinor);
  const e4 = compressionE4(g, cx, m.LcMinor, m.LcMajor, m.LcMinor);
  const slots: Slot[] = [{ family: 'tension', key: 'D2(a)' }, { family: 'tension', key: 'D2(b)' }, { family: 'compression', key: 'E3' }];
  if (e4) slots.push({ family: 'compression', key: 'E4' });
  const iE4 = e4 ? 3 : -1;
  const axialCaps: Capacity[] = e4 ? [ty, tr, e3, e4] : [ty, tr, e3];
  const PcT = Number.isNaN(tr.capacity) ? ty.capacity : Math.min(ty.capacity, tr.capacity);
  const PcC = e4 ? Math.min(e3.capacity, e4.capacity) : e3.capacity; // NaN if either is NaN
  const frame = !m.truss;
  const fMaj = frame ? flexure(g, cx, 'major', m.Lb) : null;
  const fMin = frame ? flexure(g, cx, 'minor', m.Lb) : null;
  const vMaj = frame ? shearMajor(g, cx, m.length) : null;
  const vMin = frame ? shearMinor(g, cx, m.length) : null;
  const iMaj = slots.length;
  if (frame) {
    slots.push({ family: 'bending_major', key: 'bending_major' }, { family: 'bending_minor', key: 'bending_minor' },
      { family: 'shear_major', key: 'shear_major' }, { family: 'shear_minor', key: 'shear_minor' },
      { family: 'combined', key: 'H1' }, { family: 'torsion', key: 'torsion' });
  }
  const nSeg = frame ? segmentCount(m.length, m.Lb) : 1;
  const segCap = new Float64Array(nSeg);
  const seg = new Float64Array(SEG_SIZE);
  const d = new Float64Array(D_SIZE);
  const McyDesign = fMin && !Number.isNaN(fMin.Mcap) ? designMoment(fMin, 1) : NaN;
  const tThreshold = negligibleTorsion(g, cx.Fy);
  const cbFixed = m.cb !== undefined ? m.cb : m.cantilever ? 1 : undefined;
  const cbSource = m.cb !== undefined ? 'given' : m.cantilever ? 'cantilever, free end unbraced: 1.0 (F1)' : 'Eq. F1-1 from the moment diagram';

  function evaluate(sf: StationForces, ratio: Float64Array, xo: Float64Array): void {
    const xs = sf.x;
    const n = xs.length;
    // axial
    let nt = 0, xt = 0, nc = 0, xc = 0;
    for (let i = 0; i < n; i++) {
      const v = sf.N[i];
      if (v > nt) { nt = v; xt = xs[i]; } else if (-v > nc) { nc = -v; xc = xs[i]; }
    }
    d[D_NT] = nt; d[D_NT + 1] = xt; d[D_NC] = nc; d[D_NC + 1] = xc;
    ratio[0] = nt === 0 ? 0 : nt / ty.capacity; xo[0] = xt;
    ratio[1] = nt === 0 ? (Number.isNaN(tr.capacity) ? -1 : 0) : nt / tr.capacity; xo[1] = xt;
    ratio[2] = nc === 0 ? (Number.isNaN(e3.capacity) ? -1 : 0) : nc / e3.capacity; xo[2] = xc;
    if (iE4 > 0) { ratio[iE4] = nc === 0 ? (Number.isNaN(e4!.capacity) ? -1 : 0) : nc / e4!.capacity; xo[iE4] = xc; }
    if (!frame) return;
    // major-axis flexure by unbraced segment
    const L = m.length;
    let rMaj = 0, xMaj = 0, cbGov = 1, mGov = 0, mAny = false;
    const nanMaj = Number.isNaN(fMaj!.Mcap);
    for (let s = 0; s < nSeg; s++) {
      const a = nSeg === 1 ? 0 : s * m.Lb;
      const b = nSeg === 1 ? L : Math.min(L, a + m.Lb);
      segmentMoments(xs, sf.M_major, a, b, seg);
      const cb = cbFixed !== undefined ? cbFixed : cbF11(seg[SEG_MMAX], seg[SEG_MA], seg[SEG_MB], seg[SEG_MC]);
      const cap = nanMaj ? NaN : designMoment(fMaj!, cb);
      segCap[s] = cap;
      if (seg[SEG_MMAX] !== 0) mAny = true;
      const r = seg[SEG_MMAX] === 0 ? 0 : seg[SEG_MMAX] / cap;
      if (s === 0 || r > rMaj) { rMaj = r; xMaj = seg[SEG_XMAX]; cbGov = cb; mGov = seg[SEG_MMAX]; }
    }
    d[D_CB] = cbGov; d[D_MMAJ] = mGov; d[D_XMAJ] = xMaj;
    ratio[iMaj] = nanMaj ? (mAny ? NaN : -1) : rMaj; xo[iMaj] = xMaj;
    absMax(sf.M_minor, xs, d, D_MMIN);
    ratio[iMaj + 1] = d[D_MMIN] === 0 ? (Number.isNaN(McyDesign) ? -1 : 0) : d[D_MMIN] / McyDesign; xo[iMaj + 1] = d[D_MMIN + 1];
    absMax(sf.V_major, xs, d, D_VMAJ);
    ratio[iMaj + 2] = d[D_VMAJ] === 0 ? (Number.isNaN(vMaj!.capacity) ? -1 : 0) : d[D_VMAJ] / vMaj!.capacity; xo[iMaj + 2] = d[D_VMAJ + 1];
    absMax(sf.V_minor, xs, d, D_VMIN);
    ratio[iMaj + 3] = d[D_VMIN] === 0 ? (Number.isNaN(vMin!.capacity) ? -1 : 0) : d[D_VMIN] / vMin!.capacity; xo[iMaj + 3] = d[D_VMIN + 1];
    // H1-1 at every station
    let rH = 0, iH = 0, nan = false;
    for (let i = 0; i < n; i++) {
      const N = sf.N[i];
      const Mx = sf.M_major[i] < 0 ? -sf.M_major[i] : sf.M_major[i];
      const My = sf.M_minor[i] < 0 ? -sf.M_minor[i] : sf.M_minor[i];
      const Pc = N >= 0 ? PcT : PcC;
      let sIdx = nSeg === 1 ? 0 : Math.floor(xs[i] / m.Lb);
      if (sIdx >= nSeg) sIdx = nSeg - 1;
      const Mcx = segCap[sIdx];
      if ((N !== 0 && Number.isNaN(Pc)) || (Mx !== 0 && Number.isNaN(Mcx)) || (My !== 0 && Number.isNaN(McyDesign))) { nan = true; break; }
      const r = h1(N < 0 ? -N : N, Pc, Mx, Mx === 0 ? 1 : Mcx, My, My === 0 ? 1 : McyDesign);
      if (r > rH) { rH = r; iH = i; }
    }
    d[D_H1I] = iH;
    ratio[iMaj + 4] = nan ? NaN : rH; xo[iMaj + 4] = xs[iH];
    absMax(sf.T, xs, d, D_T);
    ratio[iMaj + 5] = d[D_T] > tThreshold ? NaN : -1; xo[iMaj + 5] = d[D_T + 1];
  }

  const ratio = new Float64Array(slots.length);
  const xo = new Float64Array(slots.length);

  // record heads that depend only on Cb: computed once per plan (and Cb value)
  const minorAt = fMin ? flexureAt(fMin, 1, '') : null;
  const majorAt = new Map<number, Capacity>();
  function majorHead(cb: number): Capacity {
    let c = majorAt.get(cb);
    if (!c) {
      c = flexureAt(fMaj!, cb, cbSource);
      if (majorAt.size > 64) majorAt.clear();
      majorAt.set(cb, c);
    }
    return c;
  }

  function capRecord(id: string, combination: string, c: Capacity, demand: number, x: number): CheckRecord {
    return Number.isNaN(c.capacity) ? notChecked(id, c.head.family, cx.code, c.head.clause, c.head.title, c.head.note ?? '', combination) : finish(c.head, id, combination, c.capacity, demand, x);
  }

  function records(sf: StationForces, combination: string, want?: ArrayLike<number>, member?: string): (CheckRecord | null)[] {
    evaluate(sf, ratio, xo);
    const id = member ?? m.id;
    const out: (CheckRecord | null)[] = new Array(slots.length).fill(null);
    if (!want || want[0] !== 0) out[0] = capRecord(id, combination, axialCaps[0], d[D_NT], d[D_NT + 1]);
    if (!want || want[1] !== 0) out[1] = capRecord(id, combination, axialCaps[1], d[D_NT], d[D_NT + 1]);
    if (!want || want[2] !== 0) out[2] = capRecord(id, combination, axialCaps[2], d[D_NC], d[D_NC + 1]);
    if (e4 && (!want || want[iE4] !== 0)) out[iE4] = capRecord(id, combination, e4, d[D_NC], d[D_NC + 1]);
    if (!frame) return out;
    if (!want || want[iMaj] !== 0) out[iMaj] = capRecord(id, combination, majorHead(d[D_CB]), d[D_MMAJ], d[D_XMAJ]);
    if (!want || want[iMaj + 1] !== 0) out[iMaj + 1] = capRecord(id, combination, minorAt!, d[D_MMIN], d[D_MMIN + 1]);
    if (!want || want[iMaj + 2] !== 0) out[iMaj + 2] = capRecord(id, combination, vMaj!, d[D_VMAJ], d[D_VMAJ + 1]);
    if (!want || want[iMaj + 3] !== 0) out[iMaj + 3] = capRecord(id, combination, vMin!, d[D_VMIN], d[D_VMIN + 1]);
    // H1
    const rH = ratio[iMaj + 4];
    if (!(!want || want[iMaj + 4] !== 0)) { /* not wanted */ } else if (Number.isNaN(rH)) {
      out[iMaj + 4] = notChecked(id, 'combined', cx.code, 'H1', 'axial force and flexure', 'a component strength (axial or flexural) is not checked for this member', combination);
    } else {
      const i = d[D_H1I];
      const N = sf.N[i];
      const Mx = Math.abs(sf.M_major[i]);
      const My = Math.abs(sf.M_minor[i]);
      let sIdx = nSeg === 1 ? 0 : Math.floor(sf.x[i] / m.Lb);
      if (sIdx >= nSeg) sIdx = nSeg - 1;
      const head: RecordHead = h1Head(cx.code, Math.abs(N), N >= 0 ? PcT : PcC, Mx, segCap[sIdx], My, McyDesign, N >= 0);
      out[iMaj + 4] = interactionRecord(head, id, combination, rH, sf.x[i]);
    }
    // torsion
    if ((!want || want[iMaj + 5] !== 0) && Number.isNaN(ratio[iMaj + 5])) {
      out[iMaj + 5] = notChecked(id, 'torsion', cx.code, 'H3', 'torsion', `torsion present (|T| up to ${(d[D_T] / 1e3).toPrecision(3)} kNm): H3 not implemented`, combination);
    }
    return out;
  }

  return { member: m.id, slots, evaluate, records };
}
