/**
 * Spin modes: a node where every member meeting it has its bending released (pinned frame
 * members such as braces) can rotate about some axis without deforming anything. Its free
 * rotations' block of K is then singular along a direction n. K is positive semi-definite,
 * so nᵀKn = 0 implies Kn = 0: the mode is decoupled from every other freedom, and adding
 * stiffness along n changes no result. A node moment with a component along n cannot be
 * carried, which is reported as an instability.
 */
import { FREE, type Mesh } from './discretise.js';

export interface SpinMode {
  node: number;
  /** the free rotation freedoms (3, 4, 5 subset) */
  dofs: number[];
  /** unit direction in those freedoms */
  v: number[];
  /** stiffness added along v */
  k: number;
}

/** Eigenvalues and vectors of a small symmetric matrix (cyclic Jacobi), a is n×n row-major. */
export function symmetricEigen(a: number[], n: number): { values: number[]; vectors: number[][] } {
  const A = a.slice();
  const V: number[] = Array.from({ length: n * n }, (_, i) => (i % (n + 1) === 0 ? 1 : 0));
  for (let sweep = 0; sweep < 50; sweep++) {
    let off = 0;
    for (let p = 0; p < n; p++) for (let q = p + 1; q < n; q++) off += A[p * n + q] ** 2;
    if (off < 1e-30 * (1 + A.reduce((s, x) => s + x * x, 0))) break;
    for (let p = 0; p < n; p++) {
      for (let q = p + 1; q < n; q++) {
        const apq = A[p * n + q];
        if (apq === 0) continue;
        const theta = (A[q * n + q] - A[p * n + p]) / (2 * apq);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1), s = t * c;
        for (let k = 0; k < n; k++) {
          const akp = A[k * n + p], akq = A[k * n + q];
          A[k * n + p] = c * akp - s * akq;
          A[k * n + q] = s * akp + c * akq;
        }
        for (let k = 0; k < n; k++) {
          const apk = A[p * n + k], aqk = A[q * n + k];
          A[p * n + k] = c * apk - s * aqk;
          A[q * n + k] = s * apk + c * aqk;
        }
        for (let k = 0; k < n; k++) {
          const vkp = V[k * n + p], vkq = V[k * n + q];
          V[k * n + p] = c * vkp - s * vkq;
          V[k * n + q] = s * vkp + c * vkq;
        }
      }
    }
  }
  const values = Array.from({ length: n }, (_, i) => A[i * n + i]);
  const vectors = Array.from({ length: n }, (_, j) => Array.from({ length: n }, (_, i) => V[i * n + j]));
  return { values, vectors };
}

/** blocks: per node, the 3×3 rotation block (row-major) summed over its elements. */
export function findSpinModes(mesh: Mesh, blocks: Float64Array, status: Uint8Array): SpinMode[] {
  const nNodes = mesh.nNodes;
  const modes: SpinMode[] = [];
  for (let n = 0; n < nNodes; n++) {
    const dofs = [3, 4, 5].filter((k) => status[n * 6 + k] === FREE);
    if (dofs.length < 2) continue;
    const m = dofs.length;
    const a: number[] = [];
    for (const i of dofs) for (const j of dofs) a.push(blocks[n * 9 + (i - 3) * 3 + (j - 3)] + (i === j ? mesh.springs[n * 6 + i] : 0));
    const { values, vectors } = symmetricEigen(a, m);
    const max = Math.max(...values);
    if (!(max > 0)) continue;
    values.forEach((lam, i) => {
      if (lam <= 1e-9 * max) modes.push({ node: n, dofs, v: vectors[i], k: max });
    });
  }
  return modes;
}
