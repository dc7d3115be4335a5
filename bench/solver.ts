/**
 * Solver benchmark on synthetic 3D building frames: a grid of nodes (6 freedoms each),
 * columns and beams along the grid lines with Euler–Bernoulli 12×12 element stiffness,
 * base nodes fixed. Prints ordering, symbolic, numeric, 20-case block solve, nnz(L) and
 * peak resident memory. Run: npx tsx bench/solver.ts [amd|nested-dissection|auto ...] [model index ...]
 * Wall times are per phase; `cpu ms` is the processor time of factorise + solve, which is the
 * fairer figure when other work shares the machine; `cpu refactor` is a refactorisation of the
 * same pattern (what second-order iterations and reruns after a section edit pay).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, realpathSync } from 'node:fs';
import { resolve } from 'node:path';
import { factorise, type SymmetricCsc } from '../shared/solver/index.js';

export interface FrameSpec {
  baysX: number;
  baysY: number;
  storeys: number;
}

/** Local stiffness of a 3D frame member (u, v, w, θx, θy, θz at each end), row-major 12×12. */
function memberStiffness(E: number, G: number, A: number, Iy: number, Iz: number, J: number, L: number): Float64Array {
  const k = new Float64Array(144);
  const set = (i: number, j: number, v: number): void => {
    k[i * 12 + j] = v;
    k[j * 12 + i] = v;
  };
  const ea = (E * A) / L;
  const gj = (G * J) / L;
  const z12 = (12 * E * Iz) / L ** 3, z6 = (6 * E * Iz) / L ** 2, z4 = (4 * E * Iz) / L, z2 = (2 * E * Iz) / L;
  const y12 = (12 * E * Iy) / L ** 3, y6 = (6 * E * Iy) / L ** 2, y4 = (4 * E * Iy) / L, y2 = (2 * E * Iy) / L;
  set(0, 0, ea); set(6, 6, ea); set(0, 6, -ea);
  set(3, 3, gj); set(9, 9, gj); set(3, 9, -gj);
  // bending in the x–y plane (v, θz)
  set(1, 1, z12); set(7, 7, z12); set(1, 7, -z12);
  set(1, 5, z6); set(1, 11, z6); set(7, 5, -z6); set(7, 11, -z6);
  set(5, 5, z4); set(11, 11, z4); set(5, 11, z2);
  // bending in the x–z plane (w, θy)
  set(2, 2, y12); set(8, 8, y12); set(2, 8, -y12);
  set(2, 4, -y6); set(2, 10, -y6); set(8, 4, y6); set(8, 10, y6);
  set(4, 4, y4); set(10, 10, y4); set(4, 10, y2);
  return k;
}

/** Global stiffness (lower triangle, CSC) of a building frame; returns the matrix and counts. */
export function buildFrame(spec: FrameSpec): { K: SymmetricCsc; members: number; freedoms: number } {
  const { baysX, baysY, storeys } = spec;
  const nx = baysX + 1, ny = baysY + 1, nz = storeys + 1;
  const node = (i: number, j: number, k: number): number => (k * ny + j) * nx + i;
  // freedoms: base nodes (k = 0) are fixed
  const dofOf = (nd: number): number => (nd < nx * ny ? -1 : (nd - nx * ny) * 6);
  const n = (nz - 1) * nx * ny * 6;
  const E = 210e9, G = 81e9;
  const beam = { A: 5.4e-3, Iy: 1.2e-4, Iz: 1.0e-5, J: 2.0e-7 };
  const column = { A: 1.1e-2, Iy: 2.5e-4, Iz: 8.0e-5, J: 1.0e-6 };
  const bay = 6, storey = 3.5;
  // local stiffness for each member direction, rotated to global (axis permutations)
  const rot = (axis: 0 | 1 | 2): number[][] =>
    axis === 0 ? [[1, 0, 0], [0, 1, 0], [0, 0, 1]] : axis === 1 ? [[0, 1, 0], [-1, 0, 0], [0, 0, 1]] : [[0, 0, 1], [0, 1, 0], [-1, 0, 0]];
  const globalK = (axis: 0 | 1 | 2, s: typeof beam, L: number): Float64Array => {
    const kl = memberStiffness(E, G, s.A, s.Iy, s.Iz, s.J, L);
    const R = rot(axis);
    const T = new Float64Array(144);
    for (let b = 0; b < 4; b++) for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) T[(b * 3 + i) * 12 + b * 3 + j] = R[i][j];
    const kg = new Float64Array(144);
    // kg = Tᵀ kl T
    const tmp = new Float64Array(144);
    for (let i = 0; i < 12; i++) for (let j = 0; j < 12; j++) {
      let s2 = 0;
      for (let m = 0; m < 12; m++) s2 += kl[i * 12 + m] * T[m * 12 + j];
      tmp[i * 12 + j] = s2;
    }
    for (let i = 0; i < 12; i++) for (let j = 0; j < 12; j++) {
      let s2 = 0;
      for (let m = 0; m < 12; m++) s2 += T[m * 12 + i] * tmp[m * 12 + j];
      kg[i * 12 + j] = s2;
    }
    return kg;
  };
  const kx = globalK(0, beam, bay), ky = globalK(1, beam, bay), kz = globalK(2, column, storey);
  const ends: Array<[number, number, Float64Array]> = [];
  for (let k = 0; k < nz; k++) for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) {
    if (k > 0 && i + 1 < nx) ends.push([node(i, j, k), node(i + 1, j, k), kx]);
    if (k > 0 && j + 1 < ny) ends.push([node(i, j, k), node(i, j + 1, k), ky]);
    if (k + 1 < nz) ends.push([node(i, j, k), node(i, j, k + 1), kz]);
  }
  // count entries per column (upper bound with duplicates), then assemble with a dense column map
  const cnt = new Int32Array(n + 1);
  for (const [a, b] of ends) {
    const da = dofOf(a), db = dofOf(b);
    for (const d1 of [da, db]) for (const d2 of [da, db]) {
      if (d1 < 0 || d2 < 0 || d2 > d1) continue;
      for (let c = 0; c < 6; c++) cnt[d2 + c + 1] += 6;
    }
  }
  for (let j = 0; j < n; j++) cnt[j + 1] += cnt[j];
  const rawRow = new Int32Array(cnt[n]);
  const rawVal = new Float64Array(cnt[n]);
  const fillp = cnt.slice(0, n);
  for (const [a, b, kg] of ends) {
    const dofs = [dofOf(a), dofOf(b)];
    for (let ea = 0; ea < 2; ea++) for (let eb = 0; eb < 2; eb++) {
      const d1 = dofs[ea], d2 = dofs[eb];
      if (d1 < 0 || d2 < 0 || d2 > d1) continue;
      for (let c = 0; c < 6; c++) for (let r = 0; r < 6; r++) {
        const row = d1 + r, col = d2 + c;
        const q = fillp[col]++;
        rawRow[q] = row;
        rawVal[q] = row >= col ? kg[(ea * 6 + r) * 12 + eb * 6 + c] : 0;
      }
    }
  }
  // sum duplicates and keep the lower triangle, rows ascending
  const colPtr = new Int32Array(n + 1);
  const rows: number[] = [];
  const vals: number[] = [];
  const acc = new Float64Array(n);
  const seen = new Int32Array(n).fill(-1);
  const list: number[] = [];
  for (let j = 0; j < n; j++) {
    list.length = 0;
    for (let p = cnt[j]; p < cnt[j + 1]; p++) {
      const r = rawRow[p];
      if (r < j) continue;
      if (seen[r] !== j) {
        seen[r] = j;
        acc[r] = 0;
        list.push(r);
      }
      acc[r] += rawVal[p];
    }
    list.sort((x, y) => x - y);
    for (const r of list) {
      rows.push(r);
      vals.push(acc[r]);
    }
    colPtr[j + 1] = rows.length;
  }
  return {
    K: { n, colPtr, rowIdx: Int32Array.from(rows), values: Float64Array.from(vals) },
    members: ends.length,
    freedoms: n,
  };
}


/**
 * Long 3D box truss: `panels` bays of four chords with rings and face diagonals, pin-jointed
 * (3 freedoms per node, axial stiffness EA/L only), end rings pinned.
 */
export function buildTruss(panels: number): { K: SymmetricCsc; members: number; freedoms: number } {
  const E = 210e9, A = 2e-3, bay = 2, width = 1.5;
  const corners: Array<[number, number]> = [[0, 0], [width, 0], [width, width], [0, width]];
  const nodes = (panels + 1) * 4;
  const xyz = (nd: number): [number, number, number] => {
    const p = Math.floor(nd / 4);
    const [y, z] = corners[nd % 4];
    return [p * bay, y, z];
  };
  const fixed = (nd: number): boolean => nd < 4 || nd >= panels * 4;
  const index = new Int32Array(nodes).fill(-1);
  let n = 0;
  for (let nd = 0; nd < nodes; nd++) if (!fixed(nd)) { index[nd] = n; n += 3; }
  const bars: Array<[number, number]> = [];
  for (let p = 0; p <= panels; p++) {
    for (let c = 0; c < 4; c++) {
      const a = p * 4 + c;
      bars.push([a, p * 4 + ((c + 1) % 4)]); // ring
      if (p < panels) {
        bars.push([a, a + 4]); // chord
        bars.push([a, (p + 1) * 4 + ((c + 1) % 4)]); // face diagonal
      }
    }
  }
  const t: Array<[number, number, number]> = [];
  for (const [a, b] of bars) {
    const pa = xyz(a), pb = xyz(b);
    const d = [pb[0] - pa[0], pb[1] - pa[1], pb[2] - pa[2]];
    const L = Math.hypot(d[0], d[1], d[2]);
    const k = (E * A) / L;
    const c = d.map((x) => x / L);
    for (const [na, nb, sign] of [[a, a, 1], [b, b, 1], [b, a, -1]] as const) {
      if (index[na] < 0 || index[nb] < 0) continue;
      for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) {
        const row = index[na] + i, col = index[nb] + j;
        if (row >= col) t.push([row, col, sign * k * c[i] * c[j]]);
        else if (na !== nb) t.push([col, row, sign * k * c[i] * c[j]]);
      }
    }
  }
  return { K: tripletsToLower(n, t), members: bars.length, freedoms: n };
}

function tripletsToLower(n: number, t: Array<[number, number, number]>): SymmetricCsc {
  t.sort((x, y) => x[1] - y[1] || x[0] - y[0]);
  const colPtr = new Int32Array(n + 1);
  const rows: number[] = [];
  const vals: number[] = [];
  for (let q = 0; q < t.length; ) {
    const [i, j] = t[q];
    let v = 0;
    while (q < t.length && t[q][0] === i && t[q][1] === j) v += t[q++][2];
    rows.push(i);
    vals.push(v);
    colPtr[j + 1] = rows.length;
  }
  for (let j = 0; j < n; j++) colPtr[j + 1] = Math.max(colPtr[j + 1], colPtr[j]);
  return { n, colPtr, rowIdx: Int32Array.from(rows), values: Float64Array.from(vals) };
}

export interface SolverBenchRow {
  model: string;
  members: number;
  freedoms: number;
  ordering: string;
  orderingMs: number;
  symbolicMs: number;
  numericMs: number;
  solveMs: number;
  /** processor time of factorisation + solve (the machine may be shared), and of each */
  cpuMs: number;
  cpuFactorMs: number;
  cpuSolveMs: number;
  /** processor time of a refactorisation of the same pattern (ordering and analysis reused, same memory) */
  cpuRefactoriseMs: number;
  nnzL: number;
  gflops: number;
  residual: number;
  peakRssMb: number;
}

export interface SolverBenchModel {
  name: string;
  build: () => { K: SymmetricCsc; members: number; freedoms: number };
}

export const solverBenchModels: SolverBenchModel[] = [
  { name: 'frame 5×5×10', build: () => buildFrame({ baysX: 5, baysY: 5, storeys: 10 }) },
  { name: 'frame 10×10×30', build: () => buildFrame({ baysX: 10, baysY: 10, storeys: 30 }) },
  { name: 'frame 20×20×40', build: () => buildFrame({ baysX: 20, baysY: 20, storeys: 40 }) },
  { name: 'box truss 1250 bays', build: () => buildTruss(1250) },
];

const cpuMs = (): number => {
  const c = process.cpuUsage();
  return (c.user + c.system) / 1000;
};

/** Runs the solver on each synthetic model, prints a table, returns one row per model and ordering. */
export function benchSolver(
  orderings: Array<'auto' | 'amd' | 'nested-dissection'> = ['auto'],
  models = solverBenchModels,
  print = true,
): SolverBenchRow[] {
  const out: SolverBenchRow[] = [];
  let peak = process.memoryUsage().rss;
  for (const { name, build } of models) {
    const { K, members, freedoms } = build();
    for (const ordering of orderings) {
      const c0 = cpuMs();
      const f = factorise(K, { ordering });
      peak = Math.max(peak, process.memoryUsage().rss);
      const nrhs = 20;
      const B = new Float64Array(freedoms * nrhs);
      for (let q = 0; q < nrhs; q++) for (let i = 0; i < freedoms; i++) B[q * freedoms + i] = Math.sin(i * (q + 1) * 0.37) * 1e3;
      const c1 = cpuMs();
      const t = performance.now();
      const X = f.solve(B, nrhs);
      const solveMs = performance.now() - t;
      const cpu = cpuMs() - c0;
      const cpuSolve = cpuMs() - c1;
      const c2 = cpuMs();
      f.refactorise(K.values);
      const cpuRefactorise = cpuMs() - c2;
      peak = Math.max(peak, process.memoryUsage().rss);
      out.push({
        model: name,
        members,
        freedoms,
        ordering: f.ordering,
        orderingMs: f.timings.ordering,
        symbolicMs: f.timings.symbolic,
        numericMs: f.timings.numeric,
        solveMs,
        cpuMs: cpu,
        cpuFactorMs: cpu - cpuSolve,
        cpuSolveMs: cpuSolve,
        cpuRefactoriseMs: cpuRefactorise,
        nnzL: f.nnzFactor,
        gflops: f.flops / f.timings.numeric / 1e6,
        residual: relativeResidual(K, X, B, nrhs),
        peakRssMb: peak / 2 ** 20,
      });
    }
  }
  if (print) printTable(out);
  return out;
}

/** max over right-hand sides of ‖K x − b‖∞ / (‖K‖∞‖x‖∞ + ‖b‖∞) */
export function relativeResidual(K: SymmetricCsc, X: Float64Array, B: Float64Array, nrhs: number): number {
  const { n, colPtr, rowIdx, values } = K;
  let worst = 0;
  const r = new Float64Array(n);
  const rowSum = new Float64Array(n);
  for (let j = 0; j < n; j++) for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
    const i = rowIdx[p];
    rowSum[i] += Math.abs(values[p]);
    if (i !== j) rowSum[j] += Math.abs(values[p]);
  }
  let normK = 0;
  for (let i = 0; i < n; i++) normK = Math.max(normK, rowSum[i]);
  for (let q = 0; q < nrhs; q++) {
    const x = X.subarray(q * n, (q + 1) * n);
    const b = B.subarray(q * n, (q + 1) * n);
    r.set(b);
    for (let j = 0; j < n; j++) for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
      const i = rowIdx[p];
      r[i] -= values[p] * x[j];
      if (i !== j) r[j] -= values[p] * x[i];
    }
    let rn = 0, xn = 0, bn = 0;
    for (let i = 0; i < n; i++) {
      rn = Math.max(rn, Math.abs(r[i]));
      xn = Math.max(xn, Math.abs(x[i]));
      bn = Math.max(bn, Math.abs(b[i]));
    }
    worst = Math.max(worst, rn / (normK * xn + bn));
  }
  return worst;
}

function printTable(rows: SolverBenchRow[]): void {
  const head = ['model', 'members', 'freedoms', 'ordering', 'order ms', 'symb ms', 'numeric ms', '20-rhs ms', 'cpu ms', 'cpu factor', 'cpu solve', 'cpu refactor', 'nnz(L)', 'GFLOP/s wall', 'residual', 'peak MB'];
  const lines = rows.map((r) => [
    r.model, String(r.members), String(r.freedoms), r.ordering, r.orderingMs.toFixed(0), r.symbolicMs.toFixed(0),
    r.numericMs.toFixed(0), r.solveMs.toFixed(0), r.cpuMs.toFixed(0), r.cpuFactorMs.toFixed(0), r.cpuSolveMs.toFixed(0), r.cpuRefactoriseMs.toFixed(0), String(r.nnzL), r.gflops.toFixed(2), r.residual.toExponential(1), r.peakRssMb.toFixed(0),
  ]);
  const widths = head.map((h, c) => Math.max(h.length, ...lines.map((l) => l[c].length)));
  const fmt = (cells: string[]): string => cells.map((c, i) => c.padStart(widths[i])).join('  ');
  console.log(fmt(head));
  for (const l of lines) console.log(fmt(l));
}

/** A line of issue 14's targets table: the target, what was measured, met or not, and for a gap its measured cause. */
export interface TargetRow {
  target: string;
  measured: string;
  /** null: not measured in this run (the reason is in `cause`) */
  met: boolean | null;
  cause: string;
}

/** The side-by-side tool against CHOLMOD (../shared/perf/run.sh beside the project). */
export const PERF_SCRIPT = resolve(process.cwd(), '../shared/perf/run.sh');

/** Per-phase figures of one side of a pair (ms, page faults), as ../shared/perf/pair.mts prints them. */
interface PairSide {
  analyze_ms: number;
  factor_ms: number;
  solve_ms: number;
  faults_solve: number;
  /** the project's ordering + factorisation; CHOLMOD reports analysis and factor apart */
  faults_factorise?: number;
  faults_analyze?: number;
  faults_factor?: number;
  flops: number;
  nnz_L: number;
}

/** One matrix side by side: medians of the per-pair ratios and of each side's phase times. */
export interface SideBySideMatrix {
  name: string;
  pairs: number;
  /** load average (1, 5, 15 min) before each pair */
  loads: string[];
  ratio: Record<'analyze' | 'factor' | 'solve' | 'total' | 'nnz_L' | 'flops', number>;
  /** medians of per-pair CPU-time ratios (user + system): ordering + factor, solve, all; less disturbed by other work than wall time */
  cpuRatio: Record<'analyzeFactor' | 'solve' | 'total', number>;
  product: Record<'analyze' | 'factor' | 'solve' | 'faultsSolve' | 'faultsFactorise' | 'flops' | 'nnzL', number>;
  cholmod: Record<'analyze' | 'factor' | 'solve' | 'faultsSolve' | 'faultsFactorise' | 'flops' | 'nnzL', number>;
}

export interface SideBySide {
  /** where the figures came from: the run.sh command or the file of its JSON lines */
  source: string;
  /** the BLAS behind CHOLMOD (libblas.so.3 resolved), which its dense kernels run on */
  blas: string;
  matrices: Map<string, SideBySideMatrix>;
}

/** lower median, as ../shared/perf/pair.mts takes it */
function median(v: number[]): number {
  const s = v.filter((x) => Number.isFinite(x)).sort((a, b) => a - b);
  return s.length ? s[Math.floor((s.length - 1) / 2)] : NaN;
}

/** Medians per matrix of the pair lines (JSON, kind 'pair') that run.sh prints on stdout. */
export function summarisePairs(lines: string[]): Map<string, SideBySideMatrix> {
  type Cpu = { cpu_factorise_ms: number; cpu_solve_ms: number; cpu_analyze_ms: number; cpu_factor_ms: number };
  const by = new Map<string, Array<{ loadavg_before: string; product: PairSide & Cpu; cholmod: PairSide & Cpu; ratio: Record<string, number> }>>();
  for (const line of lines) {
    if (!line.startsWith('{')) continue;
    let j: { kind?: string; name?: string; ratio?: unknown };
    try {
      j = JSON.parse(line);
    } catch {
      continue;
    }
    if (j.kind !== 'pair' || !j.ratio || !j.name) continue;
    if (!by.has(j.name)) by.set(j.name, []);
    by.get(j.name)!.push(j as never);
  }
  const out = new Map<string, SideBySideMatrix>();
  for (const [name, ps] of by) {
    const r = (k: string) => median(ps.map((p) => p.ratio[k]));
    const side = (pick: (p: (typeof ps)[number]) => PairSide) => ({
      analyze: median(ps.map((p) => pick(p).analyze_ms)),
      factor: median(ps.map((p) => pick(p).factor_ms)),
      solve: median(ps.map((p) => pick(p).solve_ms)),
      faultsSolve: median(ps.map((p) => pick(p).faults_solve)),
      faultsFactorise: median(ps.map((p) => { const x = pick(p); return x.faults_factorise ?? (x.faults_analyze ?? NaN) + (x.faults_factor ?? NaN); })),
      flops: median(ps.map((p) => pick(p).flops)),
      nnzL: median(ps.map((p) => pick(p).nnz_L)),
    });
    out.set(name, {
      name,
      pairs: ps.length,
      loads: ps.map((p) => p.loadavg_before),
      ratio: { analyze: r('analyze'), factor: r('factor'), solve: r('solve'), total: r('total'), nnz_L: r('nnz_L'), flops: r('flops') },
      cpuRatio: {
        analyzeFactor: r('cpu_analyze_plus_factor'),
        solve: r('cpu_solve'),
        total: median(ps.map((p) => (p.product.cpu_factorise_ms + p.product.cpu_solve_ms) / (p.cholmod.cpu_analyze_ms + p.cholmod.cpu_factor_ms + p.cholmod.cpu_solve_ms))),
      },
      product: side((p) => p.product),
      cholmod: side((p) => p.cholmod),
    });
  }
  return out;
}

/** The BLAS that libblas.so.3 resolves to (CHOLMOD's dense kernels), or 'unknown'. */
export function cholmodBlas(): string {
  for (const p of ['/usr/lib/x86_64-linux-gnu/libblas.so.3', '/usr/lib/aarch64-linux-gnu/libblas.so.3', '/usr/lib/libblas.so.3']) {
    try {
      const real = realpathSync(p);
      return /openblas/i.test(real) ? `OpenBLAS (${real})` : `${real} (not OpenBLAS: reference BLAS makes CHOLMOD several times slower at 10k and above; install libopenblas0-serial)`;
    } catch {
      // next
    }
  }
  return 'unknown';
}

/** matrices and pairs for run.sh: BENCH_PERF_SPECS, else these (frame_150k with --all) */
export function perfSpecs(all: boolean): string[] {
  const env = process.env.BENCH_PERF_SPECS?.trim();
  if (env) return env.split(/\s+/);
  return ['frame_1k:5', 'pratt_10k:5', 'frame_10k:5', 'frame_50k:3', ...(all ? ['frame_150k:1'] : [])];
}

/**
 * The solver against CHOLMOD on the same matrices: the JSON lines of a saved run.sh output
 * (BENCH_PERF_JSONL=file), else a run of ../shared/perf/run.sh (its progress on stderr). A
 * string says why there are no figures.
 */
export function sideBySide(specs: string[]): SideBySide | string {
  const saved = process.env.BENCH_PERF_JSONL;
  if (saved) {
    if (!existsSync(saved)) return `BENCH_PERF_JSONL=${saved} does not exist`;
    return { source: saved, blas: cholmodBlas(), matrices: summarisePairs(readFileSync(saved, 'utf8').split('\n')) };
  }
  if (!existsSync(PERF_SCRIPT)) return `${PERF_SCRIPT} is absent: the side-by-side figures against CHOLMOD need it`;
  console.log(`\nsolver against CHOLMOD: ${PERF_SCRIPT} ${specs.join(' ')} (minutes; progress below)`);
  const r = spawnSync('bash', [PERF_SCRIPT, ...specs], { cwd: process.cwd(), encoding: 'utf8', stdio: ['ignore', 'pipe', 'inherit'], maxBuffer: 1 << 28 });
  if (r.status !== 0) return `${PERF_SCRIPT} failed (exit ${r.status ?? r.signal}): no side-by-side figures`;
  return { source: `${PERF_SCRIPT} ${specs.join(' ')}`, blas: cholmodBlas(), matrices: summarisePairs(r.stdout.split('\n')) };
}

const x2 = (v: number): string => `${v.toFixed(2)}×`;

/** "analysis +a, factor +b, solve +c ms over CHOLMOD (medians): <largest> dominates" */
function excess(m: SideBySideMatrix): string {
  const parts: Array<[string, number]> = [
    ['analysis', m.product.analyze - m.cholmod.analyze],
    ['factor', m.product.factor - m.cholmod.factor],
    ['solve', m.product.solve - m.cholmod.solve],
  ];
  const worst = parts.reduce((a, b) => (b[1] > a[1] ? b : a));
  const f = (v: number) => `${v >= 0 ? '+' : ''}${v.toFixed(v > -10 && v < 10 ? 1 : 0)}`;
  return `median ms over CHOLMOD: ${parts.map(([k, v]) => `${k} ${f(v)}`).join(', ')} → the ${worst[0]} dominates`
    + ` (product ${m.product.analyze.toFixed(1)} / ${m.product.factor.toFixed(1)} / ${m.product.solve.toFixed(1)}, CHOLMOD ${m.cholmod.analyze.toFixed(1)} / ${m.cholmod.factor.toFixed(1)} / ${m.cholmod.solve.toFixed(1)} ms);`
    + ` page faults in ordering + factor / solve: product ${m.product.faultsFactorise.toFixed(0)} / ${m.product.faultsSolve.toFixed(0)}, CHOLMOD ${m.cholmod.faultsFactorise.toFixed(0)} / ${m.cholmod.faultsSolve.toFixed(0)}`;
}

/** GFLOP/s of the substitution: 2 passes × 2 flops × nnz(L) × load cases */
function solveRate(nnzL: number, ms: number, nrhs: number): number {
  return (4 * nnzL * nrhs) / ms / 1e6;
}

/**
 * Issue 14's solver targets against the side-by-side figures: block solve ≤ 1.5× at 10k, 50k
 * and 150k; frame_1k total ≤ 1.2×, pratt_10k total ≤ 2×; factor ≤ 1.0× at 50k and 150k.
 */
export function solverTargets(side: SideBySide | string, nrhs = 20): TargetRow[] {
  const rows: TargetRow[] = [];
  const want: Array<[string, 'solve' | 'total' | 'factor', number, string]> = [
    ['frame_10k', 'solve', 1.5, 'block solve (20 cases) ≤ 1.5× CHOLMOD, frame_10k'],
    ['frame_50k', 'solve', 1.5, 'block solve (20 cases) ≤ 1.5× CHOLMOD, frame_50k'],
    ['frame_150k', 'solve', 1.5, 'block solve (20 cases) ≤ 1.5× CHOLMOD, frame_150k'],
    ['frame_1k', 'total', 1.2, 'total ≤ 1.2× CHOLMOD, frame_1k'],
    ['pratt_10k', 'total', 2.0, 'total ≤ 2× CHOLMOD, pratt_10k'],
    ['frame_50k', 'factor', 1.0, 'factor ≤ 1.0× CHOLMOD, frame_50k'],
    ['frame_150k', 'factor', 1.0, 'factor ≤ 1.0× CHOLMOD, frame_150k'],
  ];
  for (const [name, phase, limit, target] of want) {
    if (typeof side === 'string') {
      rows.push({ target, measured: '–', met: null, cause: `not measured: ${side}` });
      continue;
    }
    const m = side.matrices.get(name);
    if (!m) {
      rows.push({ target, measured: '–', met: null, cause: `not measured: ${name} was not among the matrices run (BENCH_PERF_SPECS, or --all for frame_150k)` });
      continue;
    }
    const v = m.ratio[phase];
    const met = v <= limit;
    const cpu = phase === 'solve' ? m.cpuRatio.solve : phase === 'total' ? m.cpuRatio.total : m.cpuRatio.analyzeFactor;
    const cpuLabel = phase === 'factor' ? 'CPU time of ordering + factor' : 'CPU time';
    const measured = `${x2(v)} (median of ${m.pairs} pair${m.pairs === 1 ? '' : 's'}${Number.isFinite(cpu) ? `; ${cpuLabel} ${x2(cpu)}` : ''})`;
    let cause = '';
    if (!met || cpu > limit) {
      if (phase === 'total') cause = excess(m);
      else if (phase === 'solve') {
        const pr = solveRate(m.product.nnzL, m.product.solve, nrhs);
        const cr = solveRate(m.cholmod.nnzL, m.cholmod.solve, nrhs);
        cause = `substitution rate ${pr.toFixed(1)} GFLOP/s against CHOLMOD's ${cr.toFixed(1)} (nnz(L) ${x2(m.ratio.nnz_L)} of CHOLMOD's): 128-bit SIMD kernels`
          + ` against its BLAS${side.blas.startsWith('OpenBLAS') ? ' (OpenBLAS, 256-bit with fused multiply-add)' : ''}; page faults in the solve ${m.product.faultsSolve.toFixed(0)} against ${m.cholmod.faultsSolve.toFixed(0)}`;
      } else {
        const pr = m.product.flops / m.product.factor / 1e6;
        const cr = m.cholmod.flops / m.cholmod.factor / 1e6;
        cause = `factor rate ${pr.toFixed(1)} GFLOP/s against CHOLMOD's ${cr.toFixed(1)} with ${x2(m.ratio.flops)} its operations: the dense kernels (128-bit SIMD) are slower than its BLAS`;
      }
    }
    if (Number.isFinite(cpu) && cpu <= limit !== met) {
      cause = `${cause ? `${cause}; ` : ''}the CPU-time ratio says ${cpu <= limit ? 'met' : 'not met'}: the wall figure moved with the machine's load`;
    }
    rows.push({ target, measured, met, cause });
  }
  return rows;
}

/** Prints the side-by-side medians per matrix (what the targets are read from). */
export function printSideBySide(side: SideBySide | string): void {
  if (typeof side === 'string') {
    console.log(`\nsolver against CHOLMOD: ${side}`);
    return;
  }
  console.log(`\nsolver against CHOLMOD (medians of per-pair ratios, project / CHOLMOD; ${side.source}; CHOLMOD's BLAS: ${side.blas})`);
  console.log(`  ${'matrix'.padEnd(12)}${'pairs'.padStart(6)}${'analysis'.padStart(10)}${'factor'.padStart(8)}${'solve'.padStart(8)}${'total'.padStart(8)}${'nnz(L)'.padStart(8)}${'flops'.padStart(8)}  ${'CPU: an+fa'.padStart(10)}${'solve'.padStart(7)}${'total'.padStart(7)}  load average before the pairs`);
  for (const m of side.matrices.values()) {
    const f = (v: number, w = 8) => v.toFixed(2).padStart(w);
    console.log(`  ${m.name.padEnd(12)}${String(m.pairs).padStart(6)}${f(m.ratio.analyze, 10)}${f(m.ratio.factor)}${f(m.ratio.solve)}${f(m.ratio.total)}${f(m.ratio.nnz_L)}${f(m.ratio.flops)}  ${f(m.cpuRatio.analyzeFactor, 10)}${f(m.cpuRatio.solve, 7)}${f(m.cpuRatio.total, 7)}  ${[...new Set(m.loads.map((l) => l.split(' ')[0]))].join(', ')}`);
  }
}

const isMain = process.argv[1] !== undefined && import.meta.url === new URL(`file://${process.argv[1]}`).href;
if (isMain) {
  const args = process.argv.slice(2) as Array<'auto' | 'amd' | 'nested-dissection'>;
  const sizes = args.filter((a) => /^\d+$/.test(a)).map(Number);
  const orderings = args.filter((a) => !/^\d+$/.test(a));
  const models = sizes.length > 0 ? sizes.map((i) => solverBenchModels[i]) : solverBenchModels;
  benchSolver(orderings.length > 0 ? orderings : ['auto'], models);
}
