/**
 * The lowest eigenpairs of K φ = λ B φ: K symmetric positive definite (the engine's stiffness,
 * factorised once with the project's sparse solver), B symmetric — the mass matrix
 * (semidefinite) for natural modes, or −K_G (indefinite) for elastic critical load factors.
 *
 * Both methods work with shift-invert on the factorisation of K: the operator A = K⁻¹B, whose
 * largest eigenvalues μ = 1/λ are the wanted ones, is self-adjoint in the K inner product
 * (also when B is indefinite), so everything is K-orthonormal and the projected problems are
 * small dense symmetric ones (ml-matrix). No Sturm sequence check; no dense solve of the whole
 * matrix; per step one block solve and a few sparse products.
 *
 * - Block Lanczos (default): blocks of min(n, 3) vectors (a repeated eigenvalue up to that
 *   multiplicity is found), full reorthogonalisation (twice), projected matrix H = Vᵀ B V.
 *   A Ritz pair (θ, x) is converged when ‖A x − θ x‖_K ≤ 1e-6·|θ| (its eigenvalue error is
 *   then of order 1e-12·|θ|); the basis holds at most 3n + 60 vectors, after which subspace
 *   iteration continues from the best Ritz vectors. Lanczos converges at both ends of the
 *   spectrum, so negative μ (B indefinite) do not hold back the positive ones.
 * - Subspace iteration: q = min(2n, n + 8) vectors (the usual rule), Rayleigh–Ritz after every
 *   block solve; converged when every wanted μ changed by at most 1e-8 (relative) between two
 *   iterations. It finds the μ of largest magnitude, of either sign: a converged negative μ
 *   that ranks above the wanted ones is locked (every later block is made K-orthogonal to it)
 *   so that it leaves the subspace free for the wanted ones.
 *
 * Only positive μ are wanted (λ > 0: for buckling, a load factor in the direction of the
 * loading). The residual ‖Kφ − λBφ‖ / ‖Kφ‖ of every pair is reported.
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { instabilityAt } from '../engine/instability.js';
import { factorise as defaultFactorise } from '../engine/solverBridge.js';
import type { LinearSystem } from '../engine/system.js';
import { type FactorOptions, type Factorisation, SingularMatrixError, type SymmetricCsc } from '../solver/types.js';

export interface EigenOptions {
  /** default 'lanczos' (falls back on subspace iteration from its Ritz vectors if its basis fills up) */
  method?: 'lanczos' | 'subspace';
  /** Lanczos: Ritz residual ‖A x − θ x‖_K ≤ tolerance·|θ|; default 1e-6 (eigenvalue error of order its square) */
  tolerance?: number;
  /** Lanczos: vectors per block; default min(n, 3) (repeated eigenvalues up to that multiplicity) */
  block?: number;
  /** Lanczos: largest basis; default 3n + 60 */
  maxBasis?: number;
  /** subspace iteration: vectors in the subspace; default min(2n, n + 8), at most the size of the problem */
  subspace?: number;
  /** subspace iteration: largest relative change of a wanted eigenvalue between two iterations; default 1e-8 */
  subspaceTolerance?: number;
  /** subspace iteration: default 300 */
  maxIterations?: number;
  /**
   * starting vectors (column-major, N each), e.g. the eigenvectors of a similar problem solved
   * before: Lanczos starts from them (topped up with pseudo-random vectors to a full block),
   * subspace iteration puts them first. Default: pseudo-random vectors only.
   */
  start?: Float64Array;
}

export interface EigenResult {
  /** the lowest positive λ found, ascending (at most n) */
  values: Float64Array;
  /** eigenvectors, column after column (nEq each), normalised to φᵀ B φ = 1 */
  vectors: Float64Array;
  /** ‖Kφ − λBφ‖ / ‖Kφ‖ per pair */
  residuals: Float64Array;
  iterations: number;
  converged: boolean;
  /** right-hand sides solved with the factorisation */
  solves: number;
  /** unwanted (negative λ) pairs locked out of the subspace */
  locked: number;
  /** which method gave the result */
  method: 'lanczos' | 'subspace' | 'lanczos+subspace';
}

/** y = S x for a symmetric lower-CSC S and q vectors stored row by row (x[i*q + c]). */
export function symmetricProductRows(S: SymmetricCsc, x: Float64Array, q: number, y: Float64Array): void {
  const { n, colPtr, rowIdx, values } = S;
  y.fill(0, 0, n * q);
  for (let j = 0; j < n; j++) {
    const xj = j * q;
    for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
      const i = rowIdx[p], v = values[p];
      if (v === 0) continue;
      const xi = i * q;
      if (i === j) {
        for (let c = 0; c < q; c++) y[xj + c] += v * x[xj + c];
      } else {
        for (let c = 0; c < q; c++) {
          y[xi + c] += v * x[xj + c];
          y[xj + c] += v * x[xi + c];
        }
      }
    }
  }
}

/** Y = S X for column-major blocks (X[c*n + i]). */
export function symmetricProduct(S: SymmetricCsc, X: Float64Array, q: number): Float64Array {
  const n = S.n;
  const xr = new Float64Array(n * q), yr = new Float64Array(n * q);
  for (let c = 0; c < q; c++) for (let i = 0; i < n; i++) xr[i * q + c] = X[c * n + i];
  symmetricProductRows(S, xr, q, yr);
  const Y = new Float64Array(n * q);
  for (let c = 0; c < q; c++) for (let i = 0; i < n; i++) Y[c * n + i] = yr[i * q + c];
  return Y;
}

/** Rows per chunk of the dense block kernels (a chunk of every vector stays in cache). */
const CHUNK = 1024;

/** Aᵀ B for column-major n × qa and n × qb blocks: a qa × qb dense matrix (row-major). */
function innerProducts(A: Float64Array, qa: number, B: Float64Array, qb: number, n: number): Float64Array {
  const out = new Float64Array(qa * qb);
  for (let i0 = 0; i0 < n; i0 += CHUNK) {
    const i1 = Math.min(n, i0 + CHUNK);
    for (let a = 0; a < qa; a++) {
      const ao = a * n;
      for (let b = 0; b < qb; b++) {
        const bo = b * n;
        let s = 0;
        for (let i = i0; i < i1; i++) s += A[ao + i] * B[bo + i];
        out[a * qb + b] += s;
      }
    }
  }
  return out;
}

/** W −= X C for column-major n × q X, row-major q × r C and column-major n × r W. */
function subtractProduct(W: Float64Array, X: Float64Array, q: number, C: Float64Array, r: number, n: number): void {
  for (let i0 = 0; i0 < n; i0 += CHUNK) {
    const i1 = Math.min(n, i0 + CHUNK);
    for (let c = 0; c < r; c++) {
      const wo = c * n;
      for (let k = 0; k < q; k++) {
        const z = C[k * r + c];
        if (z === 0) continue;
        const xo = k * n;
        for (let i = i0; i < i1; i++) W[wo + i] -= z * X[xo + i];
      }
    }
  }
}

/** X Z for a column-major n × q block X and a row-major q × r matrix Z: n × r, column-major. */
function combine(X: Float64Array, q: number, Z: Float64Array, r: number, n: number): Float64Array {
  const out = new Float64Array(n * r);
  const neg = Z.map((v) => -v);
  subtractProduct(out, X, q, neg, r, n);
  return out;
}

/** Deterministic pseudo-random numbers in [−1, 1) (xorshift32): the same start every run. */
function randomFill(out: Float64Array, from: number, to: number, seed: number): void {
  let s = (seed * 2654435761) >>> 0 || 1;
  for (let i = from; i < to; i++) {
    s ^= s << 13; s >>>= 0;
    s ^= s >>> 17;
    s ^= s << 5; s >>>= 0;
    out[i] = s / 2147483648 - 1;
  }
}

interface Ritz {
  /** μ per Ritz vector, in the order of the columns of Z */
  mu: Float64Array;
  /** q × r, row-major: Ritz vectors = Xb Z, K-orthonormal */
  Z: Float64Array;
  r: number;
}

/**
 * Rayleigh–Ritz: Br z = μ Kr z with Kr (Gram matrix of the block in the K product) possibly
 * singular (a block with dependent columns, e.g. B of lower rank than q): directions whose
 * scaled Gram eigenvalue is below 1e-10 are dropped.
 */
function rayleighRitz(Kr: Float64Array, Br: Float64Array, q: number): Ritz {
  const s = new Float64Array(q);
  for (let i = 0; i < q; i++) s[i] = Kr[i * q + i] > 0 ? 1 / Math.sqrt(Kr[i * q + i]) : 0;
  const kr = new Matrix(q, q), br = new Matrix(q, q);
  for (let i = 0; i < q; i++) {
    for (let j = 0; j < q; j++) {
      kr.set(i, j, 0.5 * (Kr[i * q + j] + Kr[j * q + i]) * s[i] * s[j]);
      br.set(i, j, 0.5 * (Br[i * q + j] + Br[j * q + i]) * s[i] * s[j]);
    }
  }
  const ek = new EigenvalueDecomposition(kr, { assumeSymmetric: true });
  const d = ek.realEigenvalues, V = ek.eigenvectorMatrix;
  const dMax = Math.max(...d);
  const keep: number[] = [];
  for (let i = 0; i < q; i++) if (d[i] > 1e-10 * dMax) keep.push(i);
  const r = keep.length;
  // T = S V_keep D_keep^(-1/2): Tᵀ Kr T = I
  const T = new Matrix(q, r);
  keep.forEach((k, c) => {
    const f = 1 / Math.sqrt(d[k]);
    for (let i = 0; i < q; i++) T.set(i, c, V.get(i, k) * f);
  });
  const C = T.transpose().mmul(br).mmul(T);
  const ec = new EigenvalueDecomposition(C, { assumeSymmetric: true });
  const TW = T.mmul(ec.eigenvectorMatrix);
  const Z = new Float64Array(q * r);
  for (let i = 0; i < q; i++) for (let c = 0; c < r; c++) Z[i * r + c] = TW.get(i, c) * s[i];
  return { mu: Float64Array.from(ec.realEigenvalues), Z, r };
}

/**
 * The n lowest positive eigenvalues λ of K φ = λ B φ and their vectors. `fact` is the
 * factorisation of K; K itself is used for deflation and residuals only.
 */
export function lowestEigenpairs(
  fact: Factorisation, K: SymmetricCsc, B: SymmetricCsc, n: number, options: EigenOptions = {},
): EigenResult {
  const N = K.n;
  if (B.n !== N) throw new Error(`eigen: B is ${B.n}×${B.n} but K is ${N}×${N}`);
  if (!(Number.isInteger(n) && n >= 1)) throw new Error(`eigen: number of eigenpairs ${n} must be a positive integer`);
  if (N === 0) {
    return {
      values: new Float64Array(0), vectors: new Float64Array(0), residuals: new Float64Array(0),
      iterations: 0, converged: true, solves: 0, locked: 0, method: 'lanczos',
    };
  }
  n = Math.min(n, N);
  if ((options.method ?? 'lanczos') === 'subspace') return subspaceIteration(fact, K, B, n, options, options.start);
  const lz = blockLanczos(fact, K, B, n, options);
  if (lz.converged) return lz;
  // the basis filled up first: subspace iteration from the best Ritz vectors
  const si = subspaceIteration(fact, K, B, n, options, lz.start);
  return { ...si, iterations: lz.iterations + si.iterations, solves: lz.solves + si.solves, method: 'lanczos+subspace' };
}

function subspaceIteration(
  fact: Factorisation, K: SymmetricCsc, B: SymmetricCsc, n: number, options: EigenOptions, start?: Float64Array,
): EigenResult {
  const N = K.n;
  const q = Math.min(N, Math.max(n, Math.floor(options.subspace ?? Math.min(2 * n, n + 8))));
  const tol = options.subspaceTolerance ?? 1e-8;
  const maxIt = options.maxIterations ?? 300;
  const maxLocked = 4 * q + 2 * n;

  // locked (unwanted) eigenvectors, K-orthonormal, with K Φ and B Φ
  const lockedPhi: Float64Array[] = [], lockedK: Float64Array[] = [], lockedB: Float64Array[] = [];
  const deflate = (X: Float64Array, Y: Float64Array, cols: number) => {
    for (let l = 0; l < lockedPhi.length; l++) {
      const phi = lockedPhi[l], kphi = lockedK[l], bphi = lockedB[l];
      for (let c = 0; c < cols; c++) {
        const o = c * N;
        let dot = 0;
        for (let i = 0; i < N; i++) dot += kphi[i] * X[o + i];
        if (dot === 0) continue;
        for (let i = 0; i < N; i++) { X[o + i] -= dot * phi[i]; Y[o + i] -= dot * bphi[i]; }
      }
    }
  };

  let X: Float64Array = new Float64Array(N * q);
  randomFill(X, 0, N * q, 1);
  if (start) X.set(start.subarray(0, Math.min(start.length, N * q)));
  let Y: Float64Array = symmetricProduct(B, X, q);
  let seed = 2;
  let prevPos: number[] = [], prevNeg: number[] = [];
  let iterations = 0, solves = 0, converged = false;
  let ritzMu = new Float64Array(0), cols = q;
  for (; iterations < maxIt;) {
    iterations++;
    const Xb = fact.solve(Y, cols);
    solves += cols;
    const Kr = innerProducts(Xb, cols, Y, cols, N);
    const Yb = symmetricProduct(B, Xb, cols);
    const Br = innerProducts(Xb, cols, Yb, cols, N);
    const rr = rayleighRitz(Kr, Br, cols);
    // order by |μ|, largest first
    const order = Array.from({ length: rr.r }, (_, i) => i).sort((a, b) => Math.abs(rr.mu[b]) - Math.abs(rr.mu[a]));
    const Zs = new Float64Array(cols * rr.r);
    for (let i = 0; i < cols; i++) order.forEach((k, c) => { Zs[i * rr.r + c] = rr.Z[i * rr.r + k]; });
    ritzMu = Float64Array.from(order, (k) => rr.mu[k]);
    X = combine(Xb, cols, Zs, rr.r, N);
    Y = combine(Yb, cols, Zs, rr.r, N);
    cols = rr.r;

    const muMax = Math.max(1e-300, ...Array.from(ritzMu, Math.abs));
    const pos: number[] = [], neg: number[] = [];
    ritzMu.forEach((m, i) => { if (m > 1e-12 * muMax) pos.push(i); else if (m < -1e-12 * muMax) neg.push(i); });
    const same = (a: number, b: number | undefined) => b !== undefined && Math.abs(a - b) <= tol * Math.abs(a);
    const wanted = pos.slice(0, n);
    const wantedDone = wanted.every((i, k) => same(ritzMu[i], prevPos[k]));
    // a rank-deficient B (dropped directions) holds fewer positive pairs than asked for
    if (wantedDone && (wanted.length === n || cols < q || pos.length + neg.length < cols)) { converged = true; break; }

    // lock converged negative pairs that rank above the wanted ones
    const smallestWanted = wanted.length === n ? ritzMu[wanted[n - 1]] : 0;
    const lockNow = neg.filter((i, k) => Math.abs(ritzMu[i]) >= smallestWanted && same(ritzMu[i], prevNeg[k]));
    prevPos = pos.map((i) => ritzMu[i]);
    prevNeg = neg.map((i) => ritzMu[i]);
    if (lockNow.length && lockedPhi.length + lockNow.length <= maxLocked) {
      const keep: number[] = [];
      for (let c = 0; c < cols; c++) {
        if (!lockNow.includes(c)) { keep.push(c); continue; }
        const phi = X.slice(c * N, (c + 1) * N);
        lockedPhi.push(phi);
        lockedK.push(symmetricProduct(K, phi, 1));
        lockedB.push(Y.slice(c * N, (c + 1) * N));
      }
      const X2 = new Float64Array(N * q), Y2 = new Float64Array(N * q);
      keep.forEach((c, k) => { X2.set(X.subarray(c * N, (c + 1) * N), k * N); Y2.set(Y.subarray(c * N, (c + 1) * N), k * N); });
      X = X2; Y = Y2;
      cols = keep.length;
      prevNeg = [];
    }
    if (cols < q) {
      // refill with fresh vectors (they are dropped again if B has no room for them)
      const X2 = new Float64Array(N * q);
      X2.set(X.subarray(0, cols * N));
      randomFill(X2, cols * N, q * N, seed++);
      const fresh = symmetricProduct(B, X2.subarray(cols * N), q - cols);
      const Y2 = new Float64Array(N * q);
      Y2.set(Y.subarray(0, cols * N));
      Y2.set(fresh, cols * N);
      X = X2; Y = Y2;
      cols = q;
    }
    if (lockedPhi.length) deflate(X, Y, cols);
  }

  // the wanted pairs: positive μ, largest first → λ = 1/μ ascending
  const muMax = Math.max(...Array.from(ritzMu, Math.abs));
  const picked: number[] = [];
  for (let i = 0; i < ritzMu.length && picked.length < n; i++) if (ritzMu[i] > 1e-12 * muMax) picked.push(i);
  picked.sort((a, b) => ritzMu[b] - ritzMu[a]);
  const Xp = new Float64Array(N * picked.length);
  picked.forEach((c, k) => Xp.set(X.subarray(c * N, (c + 1) * N), k * N));
  return {
    ...finish(K, B, Xp, picked.map((c) => ritzMu[c])), iterations, converged, solves, locked: lockedPhi.length, method: 'subspace',
  };
}

/**
 * The engine's stiffness factorised once with the project's sparse solver (or the one given);
 * a singular K (a mechanism) becomes the engine's InstabilityError naming node and freedom.
 */
export function factoriseSystem(
  sys: LinearSystem, options: { solver?: FactorOptions; factorise?: (K: SymmetricCsc, opts: FactorOptions) => Factorisation } = {},
): Factorisation {
  const opts: FactorOptions = { ordering: 'auto', pivotTolerance: 1e-10, ...options.solver };
  try {
    return (options.factorise ?? defaultFactorise)(sys.pat.K, opts);
  } catch (err) {
    if (err instanceof SingularMatrixError) {
      const g = sys.eqDof[err.index];
      throw instabilityAt(sys.mesh.nodeNames[Math.floor(g / 6)], g % 6);
    }
    throw err;
  }
}

/** K-normalised vectors X with their μ → λ = 1/μ, vectors scaled to φᵀBφ = 1, true residuals. */
function finish(K: SymmetricCsc, B: SymmetricCsc, X: Float64Array, mu: number[]): { values: Float64Array; vectors: Float64Array; residuals: Float64Array } {
  const N = K.n, m = mu.length;
  const values = new Float64Array(m), vectors = new Float64Array(N * m), residuals = new Float64Array(m);
  mu.forEach((u, k) => {
    values[k] = 1 / u;
    // φᵀ K φ = 1, so φᵀ B φ = μ: scale to φᵀ B φ = 1
    const f = 1 / Math.sqrt(u);
    for (let i = 0; i < N; i++) vectors[k * N + i] = X[k * N + i] * f;
  });
  if (m > 0) {
    const KX = symmetricProduct(K, vectors, m), BX = symmetricProduct(B, vectors, m);
    for (let k = 0; k < m; k++) {
      let r2 = 0, k2 = 0;
      for (let i = 0; i < N; i++) {
        const kv = KX[k * N + i];
        r2 += (kv - values[k] * BX[k * N + i]) ** 2;
        k2 += kv * kv;
      }
      residuals[k] = Math.sqrt(r2 / Math.max(k2, 1e-300));
    }
  }
  return { values, vectors, residuals };
}

/** Eigen-decomposition of a small symmetric matrix (row-major p × p): values and vectors (columns). */
function symmetricEigen(G: Float64Array, p: number): { d: number[]; V: Matrix } {
  const m = new Matrix(p, p);
  for (let i = 0; i < p; i++) for (let j = 0; j < p; j++) m.set(i, j, 0.5 * (G[i * p + j] + G[j * p + i]));
  const e = new EigenvalueDecomposition(m, { assumeSymmetric: true });
  return { d: e.realEigenvalues, V: e.eigenvectorMatrix };
}

/**
 * K-orthonormal basis of the block W (column-major N × p, K W given as KW): W U D^(-1/2) over the
 * directions whose K-norm² exceeds `floor`; R = D^(1/2) Uᵀ (r × p, row-major) with W ≈ V R.
 */
function orthonormalise(W: Float64Array, KW: Float64Array, p: number, N: number, floor: number): { V: Float64Array; R: Float64Array; r: number } {
  const { d, V: U } = symmetricEigen(innerProducts(W, p, KW, p, N), p);
  const keep: number[] = [];
  for (let i = 0; i < p; i++) if (d[i] > floor) keep.push(i);
  const r = keep.length;
  const T = new Float64Array(p * r), R = new Float64Array(r * p);
  keep.forEach((k, c) => {
    const s = Math.sqrt(d[k]);
    for (let i = 0; i < p; i++) { T[i * r + c] = U.get(i, k) / s; R[c * p + i] = U.get(i, k) * s; }
  });
  return { V: combine(W, p, T, r, N), R, r };
}

/**
 * Block Lanczos on A = K⁻¹B in the K inner product (A is self-adjoint there, also for an
 * indefinite B), full reorthogonalisation (twice), blocks of `block` vectors. The projected
 * matrix H = Vᵀ B V is small and dense; a Ritz pair (θ, V y) is converged when its residual
 * ‖A x − θ x‖_K = ‖R y_last‖ ≤ tolerance·|θ|. Stops early when the Krylov space is exhausted.
 */
function blockLanczos(
  fact: Factorisation, K: SymmetricCsc, B: SymmetricCsc, n: number, options: EigenOptions,
): EigenResult & { start?: Float64Array } {
  const N = K.n;
  const given = options.start ? Math.min(Math.floor(options.start.length / N), N) : 0;
  // with starting vectors, one pseudo-random vector more: an invariant subspace of the start (an
  // eigenvector, but not the lowest) must not end the iteration
  const p0 = Math.min(N, Math.max(1, given ? given + 1 : 0, Math.floor(options.block ?? Math.min(n, 3))));
  const tol = options.tolerance ?? 1e-6;
  const maxBasis = Math.min(N, Math.max(n + p0, Math.floor(options.maxBasis ?? 3 * n + 60)));
  const blocks: Float64Array[] = [], sizes: number[] = [], offsets: number[] = [];
  const H = new Float64Array(maxBasis * maxBasis);
  let m = 0, solves = 0, iterations = 0;
  // start: a deterministic random block, K-orthonormal
  let W: Float64Array = new Float64Array(N * p0);
  randomFill(W, given * N, N * p0, 1);
  if (given) W.set(options.start!.subarray(0, given * N));
  let first = orthonormalise(W, symmetricProduct(K, W, p0), p0, N, 0);
  let cur = first.V, pk = first.r;
  let theta: number[] = [], Y: Matrix | null = null, wanted: number[] = [];
  let converged = false;
  while (pk > 0) {
    iterations++;
    blocks.push(cur); sizes.push(pk); offsets.push(m);
    const off = m;
    m += pk;
    const Z = symmetricProduct(B, cur, pk);
    W = fact.solve(Z, pk);
    solves += pk;
    let normBefore = 0;
    for (let c = 0; c < pk; c++) {
      let s = 0;
      for (let i = 0; i < N; i++) s += W[c * N + i] * Z[c * N + i];
      normBefore = Math.max(normBefore, Math.abs(s));
    }
    // first pass: the coefficients are the entries of H = Vᵀ B V (K W = Z)
    for (let b = 0; b < blocks.length; b++) {
      const C = innerProducts(blocks[b], sizes[b], Z, pk, N);
      for (let i = 0; i < sizes[b]; i++) {
        for (let j = 0; j < pk; j++) {
          H[(offsets[b] + i) * maxBasis + off + j] = C[i * pk + j];
          if (b < blocks.length - 1) H[(off + j) * maxBasis + offsets[b] + i] = C[i * pk + j];
        }
      }
      subtractProduct(W, blocks[b], sizes[b], C, pk, N);
    }
    // second pass (rounding)
    let KW = symmetricProduct(K, W, pk);
    for (let b = 0; b < blocks.length; b++) subtractProduct(W, blocks[b], sizes[b], innerProducts(blocks[b], sizes[b], KW, pk, N), pk, N);
    KW = symmetricProduct(K, W, pk);
    const next = m < N ? orthonormalise(W, KW, pk, N, 1e-20 * normBefore) : { V: new Float64Array(0), R: new Float64Array(0), r: 0 };

    // Ritz pairs of the basis so far
    const Hm = new Float64Array(m * m);
    for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) Hm[i * m + j] = H[i * maxBasis + j];
    const e = symmetricEigen(Hm, m);
    theta = e.d; Y = e.V;
    const tMax = Math.max(1e-300, ...theta.map(Math.abs));
    wanted = theta.map((_, i) => i).filter((i) => theta[i] > 1e-12 * tMax).sort((a, b) => theta[b] - theta[a]).slice(0, n);
    const exhausted = next.r === 0;
    const residualOk = wanted.every((i) => {
      let r2 = 0;
      for (let a = 0; a < next.r; a++) {
        let s = 0;
        for (let j = 0; j < pk; j++) s += next.R[a * pk + j] * Y!.get(off + j, i);
        r2 += s * s;
      }
      return Math.sqrt(r2) <= tol * Math.abs(theta[i]);
    });
    if (exhausted || (wanted.length === n && residualOk)) { converged = true; break; }
    if (m + next.r > maxBasis) break;
    cur = next.V; pk = next.r;
  }
  // Ritz vectors x = V y (K-normalised)
  const ritz = (cols: number[]): Float64Array => {
    const X = new Float64Array(N * cols.length);
    blocks.forEach((blk, b) => {
      const C = new Float64Array(sizes[b] * cols.length);
      for (let i = 0; i < sizes[b]; i++) cols.forEach((c, k) => { C[i * cols.length + k] = -Y!.get(offsets[b] + i, c); });
      subtractProduct(X, blk, sizes[b], C, cols.length, N);
    });
    return X;
  };
  if (!converged) {
    // start block for subspace iteration: the wanted Ritz vectors, then the others by |θ|
    const q = Math.min(N, Math.max(n, Math.floor(options.subspace ?? Math.min(2 * n, n + 8))));
    const rest = theta.map((_, i) => i).filter((i) => !wanted.includes(i)).sort((a, b) => Math.abs(theta[b]) - Math.abs(theta[a]));
    const cols = [...wanted, ...rest].slice(0, q);
    return {
      values: new Float64Array(0), vectors: new Float64Array(0), residuals: new Float64Array(0),
      iterations, converged, solves, locked: 0, method: 'lanczos', start: ritz(cols),
    };
  }
  return { ...finish(K, B, ritz(wanted), wanted.map((i) => theta[i])), iterations, converged, solves, locked: 0, method: 'lanczos' };
}
