/**
 * Solving the subdivided system through the user's nodes only: the internal nodes of every
 * member (its sub-elements' nodes) connect to nothing but their own member, so they are
 * condensed out member by member — exactly, A_red = A_uu − Σ_m A_bi A_ii⁻¹ A_ib — and the
 * sparse factorisation works on a system the size of the first-order one. The internal
 * displacements follow per member, u_i = A_ii⁻¹ (f_i − A_ib u_b).
 *
 * The engine numbers the user's nodes first (shared/engine/assembly.ts numberEquations), so a
 * user freedom keeps its equation number in the reduced system. Dense work per member: a
 * Cholesky factorisation of its internal block (6 × (sub-elements − 1) freedoms at most),
 * within the block's skyline (block-tridiagonal along the member). The members' factors and W
 * are kept, so solveFactored can apply the last factorisation again (the second-order
 * iteration's preconditioned steps); the reduced system is refactorised into the memory of its
 * previous factor with the ordering and symbolic analysis of the first.
 * A member whose internal block is not positive definite buckles between its ends even with
 * them held: that is reported as an InternalInstability, as is a reduced matrix that is not.
 */
import { buildPattern } from '../engine/assembly.js';
import type { LinearSystem } from '../engine/system.js';
import { analysePattern, type SupernodalFactorisation } from '../solver/index.js';
import { SingularMatrixError, type FactorOptions, type SymmetricCsc } from '../solver/types.js';

/** K_red or a member's internal block is not positive definite; `index` a full equation at fault. */
export class CondensedInstability extends Error {
  constructor(readonly index: number) {
    super(`condensed system: not positive definite at equation ${index}`);
    this.name = 'CondensedInstability';
  }
}

interface MemberBlock {
  /** internal equations: first and count (contiguous, the member's internal nodes are consecutive) */
  i0: number;
  ni: number;
  /** boundary equations (free freedoms of the start and end nodes), ascending */
  b: Int32Array;
  /** positions in the full values of A_ii (lower, row-major dense index r*ni + c, r ≥ c) and of A_ib (r*nb + c) */
  iiPos: Int32Array;
  iiIdx: Int32Array;
  ibPos: Int32Array;
  ibIdx: Int32Array;
  /** positions in the reduced values of the lower pairs (redRow ≥ redCol) of b */
  redPos: Int32Array;
  redRow: Int32Array;
  redCol: Int32Array;
  /** skyline of A_ii: first column of row r holding an entry (the factor keeps that envelope) */
  first: Int32Array;
}

export interface CondensedSolver {
  /** equations of the reduced system (the free freedoms of the user's nodes) */
  nReduced: number;
  nnzFactor: number;
  /**
   * Solve A X = B (A aligned with the full pattern, B and X full, nrhs columns); throws
   * CondensedInstability when A is not positive definite. Same as factor(A) then solveFactored.
   */
  solve(A: Float64Array, B: Float64Array, nrhs: number): Float64Array;
  /**
   * Condense and factorise A (members' Cholesky factors and W kept, the reduced system
   * refactorised into the memory of the previous factor); throws CondensedInstability when A
   * is not positive definite.
   */
  factor(A: Float64Array): void;
  /** X = A⁻¹ B with the last A factorised (B full, nrhs columns; X a fresh array). */
  solveFactored(B: Float64Array, nrhs: number): Float64Array;
  /** CPU phases (condensation, reduced factorisation, solves) into the caller's record, when set */
  phase?: (name: string) => void;
}

/** Position of (row, col) in a lower CSC (rows ascending per column), −1 when absent. */
function find(K: SymmetricCsc, row: number, col: number): number {
  let lo = K.colPtr[col], hi = K.colPtr[col + 1] - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1, r = K.rowIdx[mid];
    if (r === row) return mid;
    if (r < row) lo = mid + 1;
    else hi = mid - 1;
  }
  return -1;
}

export function condensedSolver(sys: LinearSystem, options: FactorOptions = {}): CondensedSolver {
  const { mesh, eq, nEq, pat } = sys;
  const full = pat.K;
  const nUser = mesh.nUserNodes;
  // reduced equations: the user's free freedoms, numbered as in the full system
  let nRed = 0;
  for (let g = 0; g < nUser * 6; g++) if (eq[g] >= 0) nRed = eq[g] + 1;
  const ms = Int32Array.from(mesh.members, (m) => m.start), me = Int32Array.from(mesh.members, (m) => m.end);
  const red = buildPattern(nUser, ms, me, eq.subarray(0, nUser * 6), nRed).K;
  // user–user entries of the full matrix
  const uuFull: number[] = [], uuRed: number[] = [];
  for (let c = 0; c < nRed; c++) {
    for (let p = full.colPtr[c]; p < full.colPtr[c + 1]; p++) {
      const r = full.rowIdx[p];
      if (r >= nRed) continue;
      const q = find(red, r, c);
      if (q < 0) throw new Error(`condensed system: entry (${r}, ${c}) missing from the reduced pattern`);
      uuFull.push(p); uuRed.push(q);
    }
  }
  const blocks: MemberBlock[] = [];
  for (const m of mesh.members) {
    if (m.elementCount < 2) continue;
    let i0 = -1, i1 = -1;
    for (let k = 1; k < m.elementCount; k++) {
      const n = mesh.elStart[m.firstElement + k];
      for (let f = 0; f < 6; f++) {
        const e = eq[n * 6 + f];
        if (e < 0) continue;
        if (i0 < 0) i0 = e;
        i1 = e;
      }
    }
    if (i0 < 0) continue;
    const ni = i1 - i0 + 1;
    const bl: number[] = [];
    for (const n of [m.start, m.end]) for (let f = 0; f < 6; f++) if (eq[n * 6 + f] >= 0) bl.push(eq[n * 6 + f]);
    const b = Int32Array.from(bl).sort();
    const nb = b.length;
    const iiPos: number[] = [], iiIdx: number[] = [], ibPos: number[] = [], ibIdx: number[] = [];
    for (let c = 0; c < ni; c++) {
      for (let p = full.colPtr[i0 + c]; p < full.colPtr[i0 + c + 1]; p++) {
        const r = full.rowIdx[p] - i0;
        if (r >= 0 && r < ni) { iiPos.push(p); iiIdx.push(r * ni + c); }
      }
    }
    b.forEach((bc, c) => {
      for (let p = full.colPtr[bc]; p < full.colPtr[bc + 1]; p++) {
        const r = full.rowIdx[p] - i0;
        if (r >= 0 && r < ni) { ibPos.push(p); ibIdx.push(r * nb + c); }
      }
    });
    const redPos: number[] = [], redRow: number[] = [], redCol: number[] = [];
    for (let c = 0; c < nb; c++) {
      for (let r = c; r < nb; r++) {
        const q = find(red, b[r], b[c]);
        if (q < 0) throw new Error(`condensed system: member ${m.id} coupling (${b[r]}, ${b[c]}) missing from the reduced pattern`);
        redPos.push(q); redRow.push(r); redCol.push(c);
      }
    }
    const first = Int32Array.from({ length: ni }, (_, r) => r);
    for (const ix of iiIdx) { const r = Math.floor(ix / ni), c = ix % ni; if (c < first[r]) first[r] = c; }
    blocks.push({
      first,
      i0, ni, b, iiPos: Int32Array.from(iiPos), iiIdx: Int32Array.from(iiIdx), ibPos: Int32Array.from(ibPos), ibIdx: Int32Array.from(ibIdx),
      redPos: Int32Array.from(redPos), redRow: Int32Array.from(redRow), redCol: Int32Array.from(redCol),
    });
  }
  const pivotTolerance = options.pivotTolerance ?? 1e-10;
  // ordering and symbolic analysis of the reduced pattern once; each factorisation refactorises into the same memory
  const analysis = nRed > 0 ? analysePattern(red, options) : null;
  let fact: SupernodalFactorisation | null = null;
  let factored = false;
  const redValues = new Float64Array(red.values.length);
  // per member: the Cholesky factor of A_ii and W = A_ii⁻¹ A_ib, kept from the condensation to the solves
  const wOff = new Int32Array(blocks.length + 1), lOff = new Int32Array(blocks.length + 1);
  let maxNb = 0;
  blocks.forEach((bk, k) => {
    wOff[k + 1] = wOff[k] + bk.ni * bk.b.length;
    lOff[k + 1] = lOff[k] + bk.ni * bk.ni;
    maxNb = Math.max(maxNb, bk.b.length);
  });
  const Wall = new Float64Array(wOff[blocks.length]);
  const Lall = new Float64Array(lOff[blocks.length]);
  const Aib = new Float64Array(Math.max(1, ...blocks.map((bk) => bk.ni)) * maxNb), acc = new Float64Array(maxNb);
  const self: CondensedSolver = {
    nReduced: nRed,
    nnzFactor: analysis ? analysis.nnzFactor : 0,
    factor(A: Float64Array): void {
      factored = false;
      redValues.fill(0);
      for (let k = 0; k < uuFull.length; k++) redValues[uuRed[k]] += A[uuFull[k]];
      // per member: L Lᵀ = A_ii, W = A_ii⁻¹ A_ib; A_red −= A_ibᵀ W
      for (let k = 0; k < blocks.length; k++) {
        const bk = blocks[k], ni = bk.ni, nb = bk.b.length, lo = lOff[k], wo = wOff[k];
        Lall.fill(0, lo, lo + ni * ni);
        Aib.fill(0, 0, ni * nb);
        for (let q = 0; q < bk.iiPos.length; q++) Lall[lo + bk.iiIdx[q]] += A[bk.iiPos[q]];
        for (let q = 0; q < bk.ibPos.length; q++) Aib[bk.ibIdx[q]] += A[bk.ibPos[q]];
        cholesky(Lall, lo, ni, bk.first, pivotTolerance, bk.i0);
        for (let q = 0; q < ni * nb; q++) Wall[wo + q] = Aib[q];
        cholSolve(Lall, lo, ni, bk.first, Wall, wo, nb);
        for (let q = 0; q < bk.redPos.length; q++) {
          const r = bk.redRow[q], c = bk.redCol[q];
          let sum = 0;
          for (let i = 0; i < ni; i++) sum += Aib[i * nb + r] * Wall[wo + i * nb + c];
          redValues[bk.redPos[q]] -= sum;
        }
      }
      self.phase?.('condensation');
      if (analysis) {
        try {
          if (fact) fact.refactorise(redValues);
          else fact = analysis.factorise(redValues, pivotTolerance);
        } catch (err) {
          if (err instanceof SingularMatrixError) throw new CondensedInstability(err.index);
          throw err;
        }
      }
      factored = true;
      self.phase?.('factorisation');
    },
    solveFactored(B: Float64Array, nrhs: number): Float64Array {
      if (!factored) throw new Error('condensed system: no factorisation to solve with');
      if (B.length !== nEq * nrhs) throw new Error(`condensed system: right-hand side has ${B.length} values, expected ${nEq * nrhs}`);
      const Bred = new Float64Array(nRed * nrhs);
      for (let c = 0; c < nrhs; c++) for (let i = 0; i < nRed; i++) Bred[c * nRed + i] = B[c * nEq + i];
      // per member: f_red −= Wᵀ f_i, g = A_ii⁻¹ f_i (in place in X)
      const X = new Float64Array(nEq * nrhs);
      X.set(B);
      for (let k = 0; k < blocks.length; k++) {
        const bk = blocks[k], ni = bk.ni, b = bk.b, nb = b.length, i0 = bk.i0, lo = lOff[k], wo = wOff[k];
        for (let c = 0; c < nrhs; c++) {
          const o = c * nEq + i0, ro = c * nRed;
          acc.fill(0, 0, nb);
          for (let i = 0; i < ni; i++) {
            const fi = B[o + i];
            if (fi === 0) continue;
            const w = wo + i * nb;
            for (let r = 0; r < nb; r++) acc[r] += Wall[w + r] * fi;
          }
          for (let r = 0; r < nb; r++) Bred[ro + b[r]] -= acc[r];
          cholSolve1(Lall, lo, ni, bk.first, X, o);
        }
      }
      self.phase?.('solve: members');
      const Xred: Float64Array = fact ? fact.solve(Bred, nrhs) : new Float64Array(0);
      self.phase?.('solve: reduced');
      for (let c = 0; c < nrhs; c++) for (let i = 0; i < nRed; i++) X[c * nEq + i] = Xred[c * nRed + i];
      // u_i = g − W u_b
      for (let k = 0; k < blocks.length; k++) {
        const bk = blocks[k], ni = bk.ni, b = bk.b, nb = b.length, wo = wOff[k];
        for (let c = 0; c < nrhs; c++) {
          const o = c * nEq + bk.i0, ob = c * nRed;
          for (let r = 0; r < nb; r++) acc[r] = Xred[ob + b[r]];
          for (let i = 0; i < ni; i++) {
            let sum = X[o + i];
            const w = wo + i * nb;
            for (let r = 0; r < nb; r++) sum -= Wall[w + r] * acc[r];
            X[o + i] = sum;
          }
        }
      }
      self.phase?.('solve: members');
      return X;
    },
    solve(A: Float64Array, B: Float64Array, nrhs: number): Float64Array {
      if (B.length !== nEq * nrhs) throw new Error(`condensed system: right-hand side has ${B.length} values, expected ${nEq * nrhs}`);
      self.factor(A);
      return self.solveFactored(B, nrhs);
    },
  };
  return self;
}

/**
 * In-place Cholesky of the lower triangle of L (n × n, row-major from offset lo) within its
 * skyline (row r from column first[r]; the factor has no entries outside it); a small pivot throws.
 */
function cholesky(L: Float64Array, lo: number, n: number, first: Int32Array, tol: number, eq0: number): void {
  for (let i = 0; i < n; i++) {
    const fi = first[i], ri = lo + i * n;
    for (let j = fi; j < i; j++) {
      const rj = lo + j * n, k0 = fi > first[j] ? fi : first[j];
      let v = L[ri + j];
      for (let k = k0; k < j; k++) v -= L[ri + k] * L[rj + k];
      L[ri + j] = v / L[rj + j];
    }
    const diag = L[ri + i];
    let d = diag;
    for (let k = fi; k < i; k++) d -= L[ri + k] * L[ri + k];
    if (!(d > tol * Math.abs(diag))) throw new CondensedInstability(eq0 + i);
    L[ri + i] = Math.sqrt(d);
  }
}

/** X ← (L Lᵀ)⁻¹ X for X n × m (row-major from offset xo), L (from lo) within its skyline. */
function cholSolve(L: Float64Array, lo: number, n: number, first: Int32Array, X: Float64Array, xo: number, m: number): void {
  for (let i = 0; i < n; i++) {
    const ri = lo + i * n, xi = xo + i * m;
    for (let k = first[i]; k < i; k++) {
      const l = L[ri + k], xk = xo + k * m;
      if (l !== 0) for (let c = 0; c < m; c++) X[xi + c] -= l * X[xk + c];
    }
    const d = L[ri + i];
    for (let c = 0; c < m; c++) X[xi + c] /= d;
  }
  for (let i = n - 1; i >= 0; i--) {
    const ri = lo + i * n, xi = xo + i * m, d = L[ri + i];
    for (let c = 0; c < m; c++) X[xi + c] /= d;
    for (let k = first[i]; k < i; k++) {
      const l = L[ri + k], xk = xo + k * m;
      if (l !== 0) for (let c = 0; c < m; c++) X[xk + c] -= l * X[xi + c];
    }
  }
}

/** x[xo..xo+n) ← (L Lᵀ)⁻¹ x for one column, L (from lo) within its skyline. */
function cholSolve1(L: Float64Array, lo: number, n: number, first: Int32Array, x: Float64Array, xo: number): void {
  for (let i = 0; i < n; i++) {
    const ri = lo + i * n;
    let v = x[xo + i];
    for (let k = first[i]; k < i; k++) v -= L[ri + k] * x[xo + k];
    x[xo + i] = v / L[ri + i];
  }
  for (let i = n - 1; i >= 0; i--) {
    const ri = lo + i * n, v = x[xo + i] / L[ri + i];
    x[xo + i] = v;
    for (let k = first[i]; k < i; k++) x[xo + k] -= L[ri + k] * v;
  }
}
