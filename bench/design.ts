/**
 * Design-check throughput: member-combination checks per second on a 10 × 10 bay,
 * 30-storey frame (10,230 members) with 30 strength combinations. The analysis is stood
 * in by a table of 64 precomputed station-force patterns (so the figure is the checks'
 * own speed, not the engine's force recovery); `checkModel` does everything else as in a
 * run: plans per member, evaluation of every member for every combination, full records of
 * the governing combinations, schedule rows.
 *
 * Usage: `import { benchDesign } from './design.js'; console.log(benchDesign())`, or run
 * this file directly with tsx.
 */
import type { DesignCode, Member, Model, Section } from '../shared/model/types.js';
import type { AnalysisResult, Loading, StationForces } from '../shared/engine/types.js';
import { checkModel } from '../shared/design/index.js';

function sec(id: string, shape: Section['shape'], dims: Section['dims'], p: Partial<Section['props']>): Section {
  const props = { A: 0, I_major: 0, I_minor: 0, J: 0, Cw: 0, S_major: 0, S_minor: 0, Z_major: 0, Z_minor: 0, Av_major: 0, Av_minor: 0, depth: 0, ...p };
  return { id, shape, dims, props, given: [] };
}

/** Demo sections (metre units; properties of IPE 300, HEB 300 and an RHS 200x100x8). */
const SECTIONS: Section[] = [
  sec('BEAM', 'i', { d: 0.3, bf: 0.15, tf: 0.0107, tw: 0.0071, r: 0.015 }, { A: 5381e-6, I_major: 8356e-8, I_minor: 603.8e-8, J: 20.12e-8, Cw: 125.9e-9, S_major: 557.1e-6, S_minor: 80.5e-6, Z_major: 628.4e-6, Z_minor: 125.2e-6 }),
  sec('COL', 'i', { d: 0.3, bf: 0.3, tf: 0.019, tw: 0.011, r: 0.027 }, { A: 14910e-6, I_major: 25170e-8, I_minor: 8563e-8, J: 185e-8, Cw: 1688e-9, S_major: 1678e-6, S_minor: 570.9e-6, Z_major: 1869e-6, Z_minor: 870.1e-6 }),
  sec('EDGE', 'rhs', { h: 0.2, b: 0.1, t: 0.008 }, { A: 4350e-6, I_major: 2065e-8, I_minor: 690e-8, J: 1700e-8, S_major: 206e-6, S_minor: 138e-6, Z_major: 257e-6, Z_minor: 157e-6 }),
];

export function buildDesignFrame(code: DesignCode, bays = 10, storeys = 30, bay = 6, storey = 3.5): Model {
  const n = bays + 1;
  const nodes: Model['nodes'] = [];
  const id = (i: number, j: number, k: number) => `N${i}_${j}_${k}`;
  for (let k = 0; k <= storeys; k++) for (let j = 0; j < n; j++) for (let i = 0; i < n; i++) nodes.push({ id: id(i, j, k), x: i * bay, y: j * bay, z: k * storey });
  const members: Member[] = [];
  const base = { material: 'S355', type: 'frame' as const, roll: 0, releaseStart: 'fixed' as const, releaseEnd: 'fixed' as const, kMajor: 1, kMinor: 1 };
  for (let k = 0; k < storeys; k++) {
    for (let j = 0; j < n; j++) for (let i = 0; i < n; i++) members.push({ ...base, id: `C${members.length}`, start: id(i, j, k), end: id(i, j, k + 1), section: 'COL' });
    for (let j = 0; j < n; j++) for (let i = 0; i < bays; i++) members.push({ ...base, id: `B${members.length}`, start: id(i, j, k + 1), end: id(i + 1, j, k + 1), section: j === 0 || j === bays ? 'EDGE' : 'BEAM' });
    for (let j = 0; j < bays; j++) for (let i = 0; i < n; i++) members.push({ ...base, id: `B${members.length}`, start: id(i, j, k + 1), end: id(i, j + 1, k + 1), section: 'BEAM' });
  }
  const supports: Model['supports'] = [];
  for (let j = 0; j < n; j++) for (let i = 0; i < n; i++) supports.push({ node: id(i, j, 0), restrained: [true, true, true, true, true, true], springs: [0, 0, 0, 0, 0, 0] });
  return {
    settings: { title: 'bench', units: 'metric', verticalAxis: 'Z', designCode: code, combinationRule: 'table', deflectionLimit: 360, gammaM0: 1, gammaM1: 1, gammaM2: 1.25, stations: 11, analysis: 'first_order', bucklingModes: 0, modes: 0, stabilityWarning: true },
    inferred: { verticalAxisInferred: false, planeFrame: null, defaulted: [] },
    nodes, supports,
    materials: [{ id: 'S355', E: 210e9, G: 80.77e9, nu: 0.3, fy: 355e6, fu: 490e6, density: 7850, alpha: 1.2e-5 }],
    sections: SECTIONS, members,
    cases: [{ id: 'D', category: 'dead', title: 'D', selfWeight: 1, mass: false }],
    nodeLoads: [], memberLoads: [], settlements: [], combinations: [], vehicles: [], lanes: [], movingLoads: [], resultPoints: [],
  };
}

/** 64 station-force patterns: axial force, end moments and a span load, both axes. */
function patterns(L: number): StationForces[] {
  const out: StationForces[] = [];
  for (let p = 0; p < 64; p++) {
    const s = 11;
    const x = new Float64Array(s);
    const f = () => new Float64Array(s);
    const sf: StationForces = { x, N: f(), V_major: f(), V_minor: f(), T: f(), M_major: f(), M_minor: f(), d_major: f(), d_minor: f() };
    const N = ((p % 7) - 4) * 150e3, w = 4e3 + 2e3 * (p % 5), m0 = -((p % 3) * 20e3), m1 = ((p % 4) - 2) * 15e3, wz = 300 * (p % 3);
    for (let i = 0; i < s; i++) {
      const xi = (L * i) / (s - 1);
      x[i] = xi;
      sf.N[i] = N;
      sf.M_major[i] = (w * xi * (L - xi)) / 2 + m0 + ((m1 - m0) * xi) / L;
      sf.V_major[i] = w * (L / 2 - xi) + (m1 - m0) / L;
      sf.M_minor[i] = (wz * xi * (L - xi)) / 2;
      sf.V_minor[i] = wz * (L / 2 - xi);
    }
    out.push(sf);
  }
  return out;
}

export function standIn(model: Model, combinations: number): AnalysisResult {
  const nodeIds = model.nodes.map((n) => n.id);
  const pos = new Map(model.nodes.map((n) => [n.id, n]));
  const len = Float64Array.from(model.members, (m) => {
    const a = pos.get(m.start)!, b = pos.get(m.end)!;
    return Math.hypot(b.x - a.x, b.y - a.y, b.z - a.z);
  });
  const byLength = new Map<number, StationForces[]>();
  const table = Array.from(len, (L) => { let t = byLength.get(L); if (!t) { t = patterns(L); byLength.set(L, t); } return t; });
  const loadings: Loading[] = [{ id: 'D', kind: 'case', limitState: null, terms: [{ caseIndex: 0, factor: 1 }] }];
  for (let c = 0; c < combinations; c++) loadings.push({ id: `U${c + 1}`, kind: 'combination', limitState: 'strength', terms: [{ caseIndex: 0, factor: 1 + c / 10 }] });
  return {
    nodeIds, memberIds: model.members.map((m) => m.id), loadings,
    displacements: () => new Float64Array(nodeIds.length * 6), reactions: () => new Float64Array(nodeIds.length * 6), supportedNodes: [],
    memberForces: (m, l) => table[m][(m * 31 + l * 7) & 63],
    memberLength: (m) => len[m],
    diagnostics: { nodes: nodeIds.length, members: len.length, freedoms: 0, cases: 1, nnzK: 0, nnzFactor: 0, timings: {}, equilibrium: [] },
  };
}

export interface DesignBench {
  code: DesignCode;
  members: number;
  combinations: number;
  evaluations: number;
  /** wall-clock time of the best run */
  milliseconds: number;
  /** CPU time (user + system, all threads of the process) of that run */
  cpuMilliseconds: number;
  /** evaluations per second of wall-clock time */
  checksPerSecond: number;
  /** evaluations per second of CPU time (meaningful on a loaded machine) */
  checksPerCpuSecond: number;
  /** evaluations per second of the evaluation loop alone (wall clock) */
  evaluationChecksPerSecond: number;
  counts: { pass: number; fail: number; notChecked: number };
}

/** Member-combination checks per second for each design code (best of `repeat` runs). */
export function benchDesign(options: { combinations?: number; repeat?: number; codes?: DesignCode[] } = {}): DesignBench[] {
  const combinations = options.combinations ?? 30;
  const repeat = options.repeat ?? 3;
  const out: DesignBench[] = [];
  for (const code of options.codes ?? (['en1993-1-1', 'aisc360-lrfd'] as DesignCode[])) {
    const model = buildDesignFrame(code);
    const analysis = standIn(model, combinations);
    let best = Infinity, bestCpu = Infinity, bestEval = Infinity, last = checkModel(model, analysis);
    for (let r = 0; r < repeat; r++) {
      const c0 = process.cpuUsage();
      const t = performance.now();
      last = checkModel(model, analysis);
      best = Math.min(best, performance.now() - t);
      const c = process.cpuUsage(c0);
      bestCpu = Math.min(bestCpu, (c.user + c.system) / 1000);
      bestEval = Math.min(bestEval, last.diagnostics.evaluationMilliseconds);
    }
    const ev = last.diagnostics.evaluations;
    out.push({ code, members: model.members.length, combinations, evaluations: ev, milliseconds: best, cpuMilliseconds: bestCpu, checksPerSecond: ev / (best / 1000), checksPerCpuSecond: ev / (bestCpu / 1000), evaluationChecksPerSecond: ev / (bestEval / 1000), counts: last.counts });
  }
  return out;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  for (const r of benchDesign()) {
    console.log(`design ${r.code}: ${r.members} members × ${r.combinations} combinations = ${r.evaluations} checks in ${r.milliseconds.toFixed(0)} ms wall, ${r.cpuMilliseconds.toFixed(0)} ms CPU → ${Math.round(r.checksPerSecond).toLocaleString('en-US')} member-combination checks/s wall, ${Math.round(r.checksPerCpuSecond).toLocaleString('en-US')}/s CPU; evaluation loop alone ${Math.round(r.evaluationChecksPerSecond).toLocaleString('en-US')}/s (pass ${r.counts.pass}, fail ${r.counts.fail}, not checked ${r.counts.notChecked})`);
  }
}
