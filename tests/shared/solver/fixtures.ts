/** Small matrices for the solver tests: assembly from triplets and 2D element stiffness. */
import type { SymmetricCsc } from '../../../shared/solver/index.js';

/** Lower-triangle CSC from (row, column, value) triplets; entries are summed, both halves accepted. */
export function lowerCsc(n: number, triplets: Array<[number, number, number]>): SymmetricCsc {
  const cols: Array<Map<number, number>> = Array.from({ length: n }, () => new Map());
  for (const [a, b, v] of triplets) {
    const i = Math.max(a, b);
    const j = Math.min(a, b);
    cols[j].set(i, (cols[j].get(i) ?? 0) + v);
  }
  const colPtr = new Int32Array(n + 1);
  const rows: number[] = [];
  const vals: number[] = [];
  for (let j = 0; j < n; j++) {
    for (const i of [...cols[j].keys()].sort((x, y) => x - y)) {
      rows.push(i);
      vals.push(cols[j].get(i)!);
    }
    colPtr[j + 1] = rows.length;
  }
  return { n, colPtr, rowIdx: Int32Array.from(rows), values: Float64Array.from(vals) };
}

/** Lower-triangle CSC of a dense symmetric matrix given by rows. */
export function fromDense(A: number[][]): SymmetricCsc {
  const t: Array<[number, number, number]> = [];
  for (let i = 0; i < A.length; i++) for (let j = 0; j <= i; j++) if (A[i][j] !== 0 || i === j) t.push([i, j, A[i][j]]);
  return lowerCsc(A.length, t);
}

/** y = K x for a lower-triangle CSC matrix. */
export function multiply(K: SymmetricCsc, x: Float64Array): Float64Array {
  const y = new Float64Array(K.n);
  for (let j = 0; j < K.n; j++) {
    for (let p = K.colPtr[j]; p < K.colPtr[j + 1]; p++) {
      const i = K.rowIdx[p];
      y[i] += K.values[p] * x[j];
      if (i !== j) y[j] += K.values[p] * x[i];
    }
  }
  return y;
}

/** ‖K x − b‖∞ / (‖K‖∞ ‖x‖∞ + ‖b‖∞) for column q of a block */
export function relativeResidual(K: SymmetricCsc, X: Float64Array, B: Float64Array, q = 0): number {
  const n = K.n;
  const x = X.subarray(q * n, (q + 1) * n);
  const b = B.subarray(q * n, (q + 1) * n);
  const kx = multiply(K, x);
  const rowSum = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    for (let p = K.colPtr[j]; p < K.colPtr[j + 1]; p++) {
      const i = K.rowIdx[p];
      rowSum[i] += Math.abs(K.values[p]);
      if (i !== j) rowSum[j] += Math.abs(K.values[p]);
    }
  }
  let r = 0, nk = 0, nx = 0, nb = 0;
  for (let i = 0; i < n; i++) {
    r = Math.max(r, Math.abs(kx[i] - b[i]));
    nk = Math.max(nk, rowSum[i]);
    nx = Math.max(nx, Math.abs(x[i]));
    nb = Math.max(nb, Math.abs(b[i]));
  }
  return nk * nx + nb === 0 ? 0 : r / (nk * nx + nb);
}

/** 5-point (2D) or 7-point (3D) grid Laplacian plus a small shift, natural row-by-row numbering. */
export function gridLaplacian(dims: number[], shift = 1e-3): SymmetricCsc {
  const n = dims.reduce((a, b) => a * b, 1);
  const t: Array<[number, number, number]> = [];
  const strides = dims.map((_, k) => dims.slice(0, k).reduce((a, b) => a * b, 1));
  for (let v = 0; v < n; v++) {
    let deg = 0;
    for (let k = 0; k < dims.length; k++) {
      const c = Math.floor(v / strides[k]) % dims[k];
      if (c + 1 < dims[k]) t.push([v + strides[k], v, -1]);
      if (c > 0) deg++;
      if (c + 1 < dims[k]) deg++;
    }
    t.push([v, v, deg + shift]);
  }
  return lowerCsc(n, t);
}

/**
 * Plane frame assembly. Element stiffness of a 2D Euler–Bernoulli frame member in global axes
 * (standard direct-stiffness matrix, e.g. McGuire, Gallagher & Ziemian, Matrix Structural
 * Analysis, 2nd ed., eq. 4.34 with the rotation of ch. 5 — from memory). With `truss`, only the
 * axial terms EA/L are kept (pin-ended bar).
 */
export interface PlaneMember {
  a: number;
  b: number;
  E: number;
  A: number;
  I: number;
  truss?: boolean;
}

export function planeFrame(
  coords: Array<[number, number]>,
  members: PlaneMember[],
  restrained: Set<number>,
): { K: SymmetricCsc; freedom: (node: number, dof: 0 | 1 | 2) => number } {
  const index = new Int32Array(coords.length * 3).fill(-1);
  let n = 0;
  for (let d = 0; d < coords.length * 3; d++) if (!restrained.has(d)) index[d] = n++;
  const t: Array<[number, number, number]> = [];
  for (let d = 0; d < coords.length * 3; d++) if (index[d] >= 0) t.push([index[d], index[d], 0]);
  for (const m of members) {
    const [xa, ya] = coords[m.a];
    const [xb, yb] = coords[m.b];
    const L = Math.hypot(xb - xa, yb - ya);
    const c = (xb - xa) / L;
    const s = (yb - ya) / L;
    const ea = (m.E * m.A) / L;
    const k12 = m.truss ? 0 : (12 * m.E * m.I) / L ** 3;
    const k6 = m.truss ? 0 : (6 * m.E * m.I) / L ** 2;
    const k4 = m.truss ? 0 : (4 * m.E * m.I) / L;
    const k2 = m.truss ? 0 : (2 * m.E * m.I) / L;
    // local: u1 v1 r1 u2 v2 r2
    const kl = [
      [ea, 0, 0, -ea, 0, 0],
      [0, k12, k6, 0, -k12, k6],
      [0, k6, k4, 0, -k6, k2],
      [-ea, 0, 0, ea, 0, 0],
      [0, -k12, -k6, 0, k12, -k6],
      [0, k6, k2, 0, -k6, k4],
    ];
    const T = [
      [c, s, 0, 0, 0, 0],
      [-s, c, 0, 0, 0, 0],
      [0, 0, 1, 0, 0, 0],
      [0, 0, 0, c, s, 0],
      [0, 0, 0, -s, c, 0],
      [0, 0, 0, 0, 0, 1],
    ];
    const dofs = [m.a * 3, m.a * 3 + 1, m.a * 3 + 2, m.b * 3, m.b * 3 + 1, m.b * 3 + 2];
    for (let i = 0; i < 6; i++) {
      for (let j = 0; j <= i; j++) {
        let v = 0;
        for (let p = 0; p < 6; p++) for (let q = 0; q < 6; q++) v += T[p][i] * kl[p][q] * T[q][j];
        const gi = index[dofs[i]];
        const gj = index[dofs[j]];
        if (gi >= 0 && gj >= 0) t.push([gi, gj, v]);
      }
    }
  }
  return { K: lowerCsc(n, t), freedom: (node, dof) => index[node * 3 + dof] };
}
