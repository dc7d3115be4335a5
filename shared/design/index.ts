/**
 * Design checks of a whole model: every member, every strength combination (and service
 * combination for deflection), under the model's design code.
 *
 * checkModel keeps, for each member and check, the governing combination and builds the
 * full record only for it; checkMember gives all records of one member for one loading.
 * Strength loadings: the combinations with limit state `strength`; when the analysis has no
 * combinations at all, every load case (factor 1.0). Service loadings: combinations with
 * limit state `service`.
 */
import { stampVehicle } from '../moving/governing.js';
import type { DesignCode, Material, Member, Model, Section } from '../model/types.js';
import type { AnalysisResult, StationForces } from '../engine/types.js';
import type { StabilitySummary, StabilityWarning } from '../stability/types.js';
import { catalogueSection } from '../sections/index.js';
import { builtInMaterial } from '../materials/index.js';
import type { CheckFamily, CheckRecord, CheckStatus, DesignResult, MemberUtilisation } from './types.js';
import { designGeometry, type DesignGeometry } from './geometry.js';
import type { MemberPlan, MemberSetup } from './plan.js';
import { aiscContext } from './aisc360/context.js';
import { aiscPlan } from './aisc360/member.js';
import { enPlan } from './en1993/member.js';
import { notChecked } from './record.js';
import { cantileverTip, chordDeflection, deflectionRecord } from './deflection.js';
import { slendernessRecord } from './slenderness.js';
import { memberNetArea } from './net-area.js';
import { denoise, noiseCleaner, noiseFloor } from './noise.js';

export type { DesignResult } from './types.js';
export { generateCombinations } from './combinations.js';

export interface DesignOptions {
  /** loading indices to check for strength (default: strength combinations, else every case) */
  strengthLoadings?: number[];
  /** loading indices to check for deflection (default: service combinations) */
  serviceLoadings?: number[];
  /**
   * The run's stability summary (shared/stability): every record names its `method`; a
   * first-order stability warning of a combination goes to each member that is in compression
   * (N < 0 at any station) in that combination — its schedule row's warnings and its records.
   */
  stability?: StabilitySummary;
  /**
   * Keep at most this many records (default all): past it the records are dropped and
   * `recordsOmitted` is set — a large model's run keeps only its schedule rows, and holding
   * a hundred thousand records it will not store costs a third of the checks' time.
   */
  maxRecords?: number;
}

/** One line for a member's warnings from the stability warnings of its compressed combinations. */
function stabilityLine(ws: StabilityWarning[]): string {
  const fmt = (v: number) => (Number.isFinite(v) ? Number(v.toPrecision(3)).toString() : '∞');
  const en = ws.some((w) => w.reasons.some((r) => r.startsWith('en1993')));
  const limit = en ? 'αcr < 10 (EN 1993-1-1 5.2.1(3))' : 'sway amplifier 1/(1 − 1/αcr) > 1.5 (AISC 360-22 Chapter C)';
  return `stability: first-order forces in combination${ws.length > 1 ? 's' : ''} ${ws.map((w) => `${w.loading} (αcr = ${fmt(w.alphaCr)})`).join(', ')} `
    + `where ${limit} — sway effects understated; set analysis = second_order`;
}

/**
 * Remarks the analysis method adds to a record: under second order, member strength uses the
 * member's K (default 1) — AISC 360-22 C3 (direct analysis method), EN 1993-1-1 5.2.2(7)(b)
 * (system length once the sway imperfection is in the global analysis; clause from memory).
 */
function stampMethod(r: CheckRecord, s: StabilitySummary, member: Member): CheckRecord {
  r.analysis = s.method;
  if (s.analysis === 'second_order' && r.family === 'compression' && r.status !== 'not checked') {
    const k = member.kMajor === 1 && member.kMinor === 1 ? 'K = 1' : `K given by the member (k_major = ${member.kMajor}, k_minor = ${member.kMinor})`;
    const why = r.code === 'en1993-1-1'
      ? 'buckling length from the system length: second-order global analysis with sway imperfection (EN 1993-1-1 5.2.2(7)(b))'
      : r.code === 'none' ? '' : 'direct analysis method (AISC 360-22 C3)';
    if (why) r.note = r.note ? `${r.note}; ${k}: ${why}` : `${k}: ${why}`;
  }
  return r;
}

/** Everything about a member the checks need, prepared once. */
interface Prepared {
  member: Member;
  setup: MemberSetup;
  /** null when the member cannot be checked at all (reason) */
  plan: MemberPlan | null;
  reason: string;
  geometry: DesignGeometry | null;
  sectionId: string;
  /** cantilever: node indices (tip, root) and unit axis */
  tip: number;
  root: number;
  axis: [number, number, number];
  deflectionLimit: number;
}

interface Context {
  code: DesignCode;
  prepared: Prepared[];
  strength: number[];
  service: number[];
}

function resolveSection(model: Model, id: string, cache: Map<string, Section | undefined>): Section | undefined {
  if (cache.has(id)) return cache.get(id);
  const s = model.sections.find((q) => q.id === id) ?? catalogueSection(id);
  cache.set(id, s);
  return s;
}

function resolveMaterial(model: Model, id: string, cache: Map<string, Material | undefined>): Material | undefined {
  if (cache.has(id)) return cache.get(id);
  const m = model.materials.find((q) => q.id === id) ?? builtInMaterial(id);
  cache.set(id, m);
  return m;
}

/** What prepare() reads of the whole model's connectivity (node numbers, member ends per node, supports). */
interface Topology {
  nodeIndex: Map<string, number>;
  degree: Int32Array;
  supported: Set<number>;
  nodes: Map<string, Model['nodes'][number]>;
}

/** Topologies of one-member preparations (the member page), by analysis then model. */
const topologies = new WeakMap<object, WeakMap<object, Topology>>();

function topologyOf(model: Model, analysis: AnalysisResult): Topology {
  const nodeIndex = new Map<string, number>();
  analysis.nodeIds.forEach((id, i) => nodeIndex.set(id, i));
  const degree = new Int32Array(analysis.nodeIds.length);
  for (const m of model.members) {
    const a = nodeIndex.get(m.start), b = nodeIndex.get(m.end);
    if (a !== undefined) degree[a]++;
    if (b !== undefined) degree[b]++;
  }
  const supported = new Set<number>();
  for (const s of model.supports) {
    const i = nodeIndex.get(s.node);
    if (i !== undefined && (s.restrained.some(Boolean) || s.springs.some((k) => k > 0))) supported.add(i);
  }
  return { nodeIndex, degree, supported, nodes: new Map(model.nodes.map((n) => [n.id, n])) };
}

/** The topology, kept between one-member preparations of the same model and analysis. */
function keptTopology(model: Model, analysis: AnalysisResult): Topology {
  let byModel = topologies.get(analysis);
  if (!byModel) topologies.set(analysis, (byModel = new WeakMap()));
  let t = byModel.get(model);
  if (!t) byModel.set(model, (t = topologyOf(model, analysis)));
  return t;
}

function prepare(model: Model, analysis: AnalysisResult, only?: number): Context {
  const code = model.settings.designCode;
  const { nodeIndex, degree, supported, nodes } = only !== undefined ? keptTopology(model, analysis) : topologyOf(model, analysis);
  const sections = new Map<string, Section | undefined>();
  const materials = new Map<string, Material | undefined>();
  const plans = new Map<string, MemberPlan>();
  const geometries = new Map<string, DesignGeometry>();
  const prepared: Prepared[] = [];
  const sectionNets = new Map(model.sections.map((q) => [q.id, q.net]));
  // one member's page prepares that member alone (`prepared` stays sparse): nothing per call grows with the model
  const each = (member: Model['members'][number], mi: number) => {
    const L = analysis.memberLength(mi);
    const a = nodeIndex.get(member.start) ?? -1, b = nodeIndex.get(member.end) ?? -1;
    const freeA = a >= 0 && degree[a] === 1 && !supported.has(a);
    const freeB = b >= 0 && degree[b] === 1 && !supported.has(b);
    const cantilever = freeA !== freeB;
    const na = nodes.get(member.start), nb = nodes.get(member.end);
    const axis: [number, number, number] = na && nb && L > 0 ? [(nb.x - na.x) / L, (nb.y - na.y) / L, (nb.z - na.z) / L] : [1, 0, 0];
    const { net, source: netSource } = memberNetArea(member.id, member.section, member.net, sectionNets.get(member.section));
    const setup: MemberSetup = {
      id: member.id, length: L, truss: member.type === 'truss',
      LcMajor: member.kMajor * (member.lMajor ?? L), LcMinor: member.kMinor * (member.lMinor ?? L),
      Lb: member.lb ?? L, cb: member.cb, cantilever, net, netSource,
    };
    const p: Prepared = {
      member, setup, plan: null, reason: '', geometry: null, sectionId: member.section,
      tip: freeA ? a : b, root: freeA ? b : a, axis,
      deflectionLimit: member.deflectionLimit ?? model.settings.deflectionLimit,
    };
    prepared[mi] = p;
    if (code === 'none') { p.reason = 'no design code selected'; return; }
    const section = resolveSection(model, member.section, sections);
    const material = resolveMaterial(model, member.material, materials);
    if (!section) { p.reason = `section ${member.section} not found`; return; }
    let g0 = geometries.get(section.id);
    if (!g0) { g0 = designGeometry(section); geometries.set(section.id, g0); }
    p.geometry = g0;
    if (!material) { p.reason = `material ${member.material} not found`; return; }
    if (material.fy === undefined || !(material.fy > 0)) { p.reason = `material ${material.id} has no fy`; return; }
    if (member.sectionEnd !== undefined && member.sectionEnd !== member.section) { p.reason = 'tapered member: design checks of tapered members not implemented'; return; }
    // members with the same section, material, lengths and end conditions share a plan
    const key = `${member.section}|${member.material}|${setup.length}|${setup.truss}|${setup.LcMajor}|${setup.LcMinor}|${setup.Lb}|${setup.cb}|${cantilever}|${netSource}|${net.An}|${net.U}|${net.Ae}`;
    const shared = plans.get(key);
    if (shared) { p.plan = shared; return; }
    const g = p.geometry;
    let plan: MemberPlan;
    if (code === 'en1993-1-1') {
      plan = enPlan(g, {
        E: material.E, G: material.G, fy: material.fy, fu: material.fu,
        gammaM0: model.settings.gammaM0, gammaM1: model.settings.gammaM1, gammaM2: model.settings.gammaM2,
        hotFinished: /10210/.test(section.source ?? ''),
      }, setup);
    } else {
      plan = aiscPlan(g, aiscContext(code === 'aisc360-asd' ? 'asd' : 'lrfd', material.E, material.G, material.fy, material.fu), setup);
    }
    plans.set(key, plan);
    p.plan = plan;
  };
  if (only !== undefined) each(model.members[only], only);
  else model.members.forEach(each);
  const combos = analysis.loadings.map((l, i) => ({ l, i })).filter(({ l }) => l.kind === 'combination');
  const strength = combos.length
    ? combos.filter(({ l }) => l.limitState !== 'service').map(({ i }) => i)
    : analysis.loadings.map((l, i) => ({ l, i })).filter(({ l }) => l.kind === 'case').map(({ i }) => i);
  const service = combos.filter(({ l }) => l.limitState === 'service').map(({ i }) => i);
  return { code, prepared, strength, service };
}

/**
 * Largest slenderness of a member over both axes (0 without geometry): K·L/r in
 * compression (E2 user note), L/r in tension (D1 user note: unbraced lengths, no K).
 */
function slendernessOf(p: Prepared, tension = false): number {
  const g = p.geometry;
  if (!g || !(g.rmaj > 0) || !(g.rmin > 0)) return 0;
  if (tension) return Math.max((p.member.lMajor ?? p.setup.length) / g.rmaj, (p.member.lMinor ?? p.setup.length) / g.rmin);
  return Math.max(p.setup.LcMajor / g.rmaj, p.setup.LcMinor / g.rmin);
}

/** Station forces already cleaned of noise (noise.ts): any compression / any tension. */
function hasCompression(sf: StationForces): boolean {
  for (let i = 0; i < sf.N.length; i++) if (sf.N[i] < 0) return true;
  return false;
}
function hasTension(sf: StationForces): boolean {
  for (let i = 0; i < sf.N.length; i++) if (sf.N[i] > 0) return true;
  return false;
}

/** The slenderness warning: compression limit if ever compressed, tension limit if ever in tension, else none. */
function slendernessFor(p: Prepared, code: DesignCode, compressionLoading: string | null, tensionLoading: string | null): CheckRecord | null {
  const compression = compressionLoading !== null;
  if (!compression && tensionLoading === null) return null;
  const sl = slendernessOf(p, !compression);
  if (!(sl > 0)) return null;
  return slendernessRecord(p.member.id, code, sl, compression, compression ? compressionLoading : tensionLoading!);
}

const MAX_SLOTS = 32;

export function checkModel(model: Model, analysis: AnalysisResult, options: DesignOptions = {}): DesignResult {
  const t0 = performance.now();
  const ctx = prepare(model, analysis);
  const strength = options.strengthLoadings ?? ctx.strength;
  const service = options.serviceLoadings ?? ctx.service;
  const clean = noiseCleaner(noiseFloor(model, analysis, strength));
  const ids = analysis.loadings.map((l) => l.id);
  const stability = options.stability;
  const warned = new Map<string, StabilityWarning>((stability?.warnings ?? []).map((w) => [w.loading, w]));
  const members: MemberUtilisation[] = [];
  const records: CheckRecord[] = [];
  const counts = { pass: 0, fail: 0, notChecked: 0 };
  const ratio = new Float64Array(MAX_SLOTS);
  const xo = new Float64Array(MAX_SLOTS);
  const gov = new Float64Array(MAX_SLOTS);
  const govL = new Int32Array(MAX_SLOTS);
  const nanL = new Int32Array(MAX_SLOTS);
  const defl = new Float64Array(2);
  const pick = new Int32Array(MAX_SLOTS);
  const want = new Uint8Array(MAX_SLOTS);
  let evaluations = 0;
  let evaluationMs = 0;
  const maxRecords = options.maxRecords ?? Infinity;
  let omitted = false;
  // station forces of the evaluation loop in one reused buffer when the analysis offers it
  const scratch: StationForces = {
    x: new Float64Array(0), N: new Float64Array(0), V_major: new Float64Array(0), V_minor: new Float64Array(0), T: new Float64Array(0),
    M_major: new Float64Array(0), M_minor: new Float64Array(0), d_major: new Float64Array(0), d_minor: new Float64Array(0),
  };
  const forcesOf = analysis.memberForcesInto
    ? (mi: number, li: number) => analysis.memberForcesInto!(mi, li, scratch)
    : (mi: number, li: number) => analysis.memberForces(mi, li);
  // the governing loadings' records read their forces within one iteration (records keep numbers, not arrays)
  const forRecords: StationForces = { ...scratch };
  const recordForcesOf = analysis.memberForcesInto
    ? (mi: number, li: number) => analysis.memberForcesInto!(mi, li, forRecords)
    : (mi: number, li: number) => analysis.memberForces(mi, li);

  for (let mi = 0; mi < ctx.prepared.length; mi++) {
    const p = ctx.prepared[mi];
    const memberRecords: CheckRecord[] = [];
    const warnings: string[] = [];
    const memberWarned: StabilityWarning[] = [];
    const sectionMaterial = { section: p.member.section, material: p.member.material };
    if (!p.plan) {
      memberRecords.push(notChecked(p.member.id, 'combined', ctx.code, '', 'design checks', p.reason));
    } else {
      const plan = p.plan;
      const n = plan.slots.length;
      gov.fill(-1, 0, n);
      govL.fill(-1, 0, n);
      nanL.fill(-1, 0, n);
      const te0 = performance.now();
      let compression = false;
      let compressionLoading = -1;
      let tensionLoading = -1;
      for (let k = 0; k < strength.length; k++) {
        const li = strength[k];
        const sf = clean(forcesOf(mi, li));
        plan.evaluate(sf, ratio, xo);
        evaluations++;
        for (let s = 0; s < n; s++) {
          const r = ratio[s];
          if (r !== r) { if (nanL[s] < 0) nanL[s] = li; }
          else if (r > gov[s] || govL[s] < 0) { if (r >= 0 || govL[s] < 0) { gov[s] = r; govL[s] = li; } }
        }
        if (!compression && hasCompression(sf)) { compression = true; compressionLoading = li; }
        if (warned.size) {
          const w = warned.get(ids[li]);
          if (w && !memberWarned.includes(w) && hasCompression(sf)) memberWarned.push(w);
        }
        if (tensionLoading < 0 && hasTension(sf)) tensionLoading = li;
      }
      evaluationMs += performance.now() - te0;
      // records of the governing loadings: each loading evaluated once, only its slots built
      // a known failure outranks a not-checked loading of the same check; otherwise not checked outranks pass
      for (let s = 0; s < n; s++) pick[s] = gov[s] > 1 ? govL[s] : nanL[s] >= 0 ? nanL[s] : gov[s] >= 0 ? govL[s] : -1;
      for (let s = 0; s < n; s++) {
        const li = pick[s];
        if (li < 0) continue;
        for (let t = 0; t < n; t++) want[t] = pick[t] === li ? 1 : 0;
        const sfl = clean(recordForcesOf(mi, li));
        const recs = plan.records(sfl, ids[li], want, p.member.id);
        for (let t = 0; t < n; t++) {
          if (pick[t] !== li) continue;
          pick[t] = -1;
          const r = recs[t];
          if (r) memberRecords.push(analysis.moving ? stampVehicle(analysis, mi, li, sfl, r) : r);
        }
      }
      // slenderness (warning only) and bracing warning
      const rec = slendernessFor(p, ctx.code, compression ? ids[compressionLoading] : null, tensionLoading >= 0 ? ids[tensionLoading] : null);
      if (rec) {
        memberRecords.push(rec);
        if (rec.status === 'fail') warnings.push(rec.note ?? '');
      }
      if (compression && p.member.lMajor === undefined && p.member.lMinor === undefined && p.member.lb === undefined) {
        warnings.push('member in compression with no bracing defined (l_major, l_minor, lb not given): member length used for buckling');
      }
      // deflection
      if (service.length && p.setup.length > 0) {
        let worst = -1, worstL = -1, worstX = 0;
        for (const li of service) {
          let delta: number, x: number;
          if (p.setup.cantilever) {
            delta = cantileverTip(analysis.displacements(li), p.tip, p.root, p.axis[0], p.axis[1], p.axis[2]);
            x = p.tip === p.root ? 0 : p.setup.length;
          } else {
            chordDeflection(forcesOf(mi, li), defl);
            delta = defl[0]; x = defl[1];
          }
          if (delta > worst) { worst = delta; worstL = li; worstX = x; }
        }
        if (worstL >= 0) {
          const rec = deflectionRecord(p.member.id, ctx.code, ids[worstL], worst, worstX, p.setup.length, p.deflectionLimit, p.setup.cantilever);
          memberRecords.push(analysis.moving ? stampVehicle(analysis, mi, worstL, analysis.memberForces(mi, worstL), rec) : rec);
        }
      }
    }
    if (stability) {
      const line = memberWarned.length ? stabilityLine(memberWarned) : '';
      if (line) warnings.unshift(line);
      for (const r of memberRecords) {
        stampMethod(r, stability, p.member);
        if (line && r.family !== 'deflection') r.stability = line;
      }
    }
    const u = utilisation(p, memberRecords, warnings, sectionMaterial);
    members.push(u);
    if (u.status === 'pass') counts.pass++; else if (u.status === 'fail') counts.fail++; else counts.notChecked++;
    if (!omitted) {
      for (const r of memberRecords) records.push(r);
      if (records.length > maxRecords) { omitted = true; records.length = 0; }
    }
  }
  return { code: ctx.code, members, records, ...(omitted ? { recordsOmitted: true } : {}), counts, diagnostics: { evaluations, milliseconds: performance.now() - t0, evaluationMilliseconds: evaluationMs } };
}

/** The member's schedule row from its governing records. */
function utilisation(p: Prepared, recs: CheckRecord[], warnings: string[], sm: { section: string; material: string }): MemberUtilisation {
  let best: CheckRecord | null = null;
  let anyNotChecked = false;
  const families: Partial<Record<CheckFamily, number | null>> = {};
  const familyStatus: Partial<Record<CheckFamily, CheckStatus>> = {};
  for (const r of recs) {
    const f = r.family;
    if (r.status === 'not checked') {
      familyStatus[f] = familyStatus[f] === 'fail' ? 'fail' : 'not checked';
      if (!(f in families)) families[f] = null;
    } else {
      const prev = families[f];
      if (prev === undefined || prev === null || (r.ratio ?? 0) > prev) families[f] = r.ratio;
      if (r.status === 'fail') familyStatus[f] = 'fail';
      else if (familyStatus[f] === undefined) familyStatus[f] = 'pass';
    }
    if (f === 'slenderness') continue;
    if (r.status === 'not checked') { anyNotChecked = true; continue; }
    if (!best || (r.ratio ?? 0) > (best.ratio ?? 0)) best = r;
  }
  const ratio = best ? best.ratio : null;
  let status: CheckStatus;
  if (ratio !== null && ratio > 1) status = 'fail';
  else if (anyNotChecked || ratio === null) status = 'not checked';
  else status = 'pass';
  const firstNc = recs.find((r) => r.status === 'not checked');
  const shown = status === 'not checked' && firstNc && !best ? firstNc : best;
  return {
    member: p.member.id,
    group: p.member.group ?? '',
    section: sm.section,
    material: sm.material,
    length: p.setup.length,
    ratio,
    check: shown ? shown.title : '',
    clause: shown ? shown.clause : '',
    combination: shown ? shown.combination : '',
    status,
    families,
    familyStatus,
    warnings: status === 'not checked' && firstNc?.note ? [...warnings, `not checked: ${firstNc.note}`] : warnings,
    ...(shown?.vehiclePosition !== undefined ? { vehiclePosition: shown.vehiclePosition } : {}),
    ...(shown?.envelope ? { envelope: shown.envelope } : {}),
  };
}

/**
 * All records of one member for one loading: strength checks (and the slenderness
 * warning) for a strength loading or a case; the deflection check for a service loading.
 */
export function checkMember(model: Model, analysis: AnalysisResult, memberIndex: number, loadingIndex: number, options: Pick<DesignOptions, 'stability'> = {}): CheckRecord[] {
  const out = memberRecordsOf(model, analysis, memberIndex, loadingIndex);
  const s = options.stability;
  if (!s) return out;
  const w = s.warnings.find((q) => q.loading === analysis.loadings[loadingIndex].id);
  const compressed = () => hasCompression(denoise(analysis.memberForces(memberIndex, loadingIndex), noiseFloor(model, analysis, [loadingIndex])));
  const line = w && analysis.loadings[loadingIndex].limitState !== 'service' && compressed() ? stabilityLine([w]) : '';
  for (const r of out) {
    stampMethod(r, s, model.members[memberIndex]);
    if (line) r.stability = line;
  }
  return out;
}

function memberRecordsOf(model: Model, analysis: AnalysisResult, memberIndex: number, loadingIndex: number): CheckRecord[] {
  const member = model.members[memberIndex];
  const loading = analysis.loadings[loadingIndex];
  if (!member) throw new Error(`checkMember: member index ${memberIndex} does not exist`);
  if (!loading) throw new Error(`checkMember: loading index ${loadingIndex} does not exist`);
  const ctx = prepare(model, analysis, memberIndex);
  const p = ctx.prepared[memberIndex];
  if (!p.plan) return [notChecked(member.id, 'combined', ctx.code, '', 'design checks', p.reason, loading.id)];
  if (loading.limitState === 'service') {
    const d = new Float64Array(2);
    if (p.setup.cantilever) {
      const delta = cantileverTip(analysis.displacements(loadingIndex), p.tip, p.root, p.axis[0], p.axis[1], p.axis[2]);
      return [deflectionRecord(member.id, ctx.code, loading.id, delta, p.setup.length, p.setup.length, p.deflectionLimit, true)];
    }
    chordDeflection(analysis.memberForces(memberIndex, loadingIndex), d);
    return [deflectionRecord(member.id, ctx.code, loading.id, d[0], d[1], p.setup.length, p.deflectionLimit, false)];
  }
  const sf = denoise(analysis.memberForces(memberIndex, loadingIndex), noiseFloor(model, analysis, [...ctx.strength, loadingIndex]));
  const out = p.plan.records(sf, loading.id, undefined, member.id).filter((r): r is CheckRecord => r !== null)
    .map((r) => (analysis.moving ? stampVehicle(analysis, memberIndex, loadingIndex, sf, r) : r));
  const sl = slendernessFor(p, ctx.code, hasCompression(sf) ? loading.id : null, hasTension(sf) ? loading.id : null);
  if (sl) out.push(sl);
  return out;
}
