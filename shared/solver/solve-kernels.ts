/**
 * WebAssembly SIMD kernels of the block substitution: one call per supernode and pass, all
 * right-hand sides at once. The work array X is row-major (the values of one freedom for
 * every load case adjacent) with an even row length `ld` (a zero column pads an odd count),
 * so that every row is a whole number of f64x2 vectors. All addresses are in bytes.
 *
 * solveForward(o8, nc, nr, xf8, ld8, rowsB, xB): with L the supernode's row-major nr × nc
 * block at o8, X1 the nc rows of X from xf8 and rows[t] (Int32 at rowsB) the freedom of
 * block row t:
 *   X1 ← L11⁻¹ X1 four rows at a time (the product with the rows already solved as a register
 *   tile of four rows of L11 by four load cases, then the 4 × 4 triangle in registers; the
 *   products subtracted in the order of the row-by-row loop, so the rounding is the same), then
 *   X[rows[t]] −= Σ_k L[t, k] · X1[k] for nc ≤ t < nr, four block rows by four load cases
 *   at a time in registers (a small matrix product reading L in its stored order).
 *
 * solveBackward(o8, nc, nr, xf8, ld8, rowsB, xB, eB): gathers E[t − nc] = X[rows[t]] into
 * the scratch at eB, then
 *   X1[k] −= Σ_t L[t, k] · E[t] for four columns k by four load cases at a time (reading the
 *   rows of L21 in their stored order), then X1 ← L11⁻ᵀ X1, last row first: four rows at a
 *   time (the same tile over the rows of L11 below, then the 4 × 4 triangle) in supernodes of
 *   BLOCKED_FROM columns or more, column by column in smaller ones.
 */
import { FunctionBuilder, I32, V128 } from './wasm-emitter.js';

/** emits `for (; q8 + 16·nv ≤ ld8; q8 += 16·nv) body(nv)` for nv = 2 then nv = 1 (ld even) */
function loadCaseChunks(f: FunctionBuilder, q8: number, ld8: number, body: (nv: number) => void): void {
  f.i32(0).set(q8);
  for (const nv of [2, 1]) {
    f.block().loop();
    f.get(q8).i32(16 * nv).add().get(ld8).gtS().brIf(1);
    body(nv);
    f.inc(q8, 16 * nv).br(0).end().end();
  }
}

export function buildSolveForward(fused: boolean): FunctionBuilder {
  const f = new FunctionBuilder('solveForward', [I32, I32, I32, I32, I32, I32, I32]);
  f.fused = fused;
  const [o8, nc, nr, xf8, ld8, rowsB, xB] = [0, 1, 2, 3, 4, 5, 6];
  const nc8 = f.local(I32);
  const i = f.local(I32);
  const q8 = f.local(I32);
  const end = f.local(I32);
  const px = f.local(I32);
  const addr = f.local(I32);
  const pa = [f.local(I32), f.local(I32), f.local(I32), f.local(I32)];
  const acc: number[][] = [];
  for (let a = 0; a < 4; a++) acc.push([f.local(V128), f.local(V128)]);
  const lv = [f.local(V128), f.local(V128), f.local(V128), f.local(V128)];
  const xv = [f.local(V128), f.local(V128)];

  f.get(nc).i32(3).shl().set(nc8);

  // X1[i] = (X1[i] − Σ_{k<i} L[i, k] X1[k]) / L[i, i], mr rows at a time: the product with the
  // solved rows above as a register tile (mr rows by four load cases, L read in stored order),
  // then the mr × mr triangle in registers
  const triangle = (mr: number): void => {
    loadCaseChunks(f, q8, ld8, (nv) => {
      // pa[a] = &L[i + a, 0], end = &L[i, i], px = &X1[0] + q8
      f.get(o8).get(i).get(nc8).mul().add().set(pa[0]);
      for (let a = 1; a < mr; a++) f.get(pa[a - 1]).get(nc8).add().set(pa[a]);
      f.get(pa[0]).get(i).i32(3).shl().add().set(end);
      f.get(xf8).get(q8).add().set(px);
      // acc[a] ← X1[i + a], then minus the products in the order of k (the rounding of the
      // row-by-row substitution)
      f.get(xf8).get(i).get(ld8).mul().add().get(q8).add().set(addr);
      for (let a = 0; a < mr; a++) {
        if (a > 0) f.get(addr).get(ld8).add().set(addr);
        for (let c = 0; c < nv; c++) f.get(addr).v128Load(16 * c).set(acc[a][c]);
      }
      f.block().loop();
      f.get(pa[0]).get(end).geU().brIf(1);
      for (let c = 0; c < nv; c++) f.get(px).v128Load(16 * c).set(xv[c]);
      for (let a = 0; a < mr; a++) {
        f.get(pa[a]).f64Load().splat().set(lv[a]);
        for (let c = 0; c < nv; c++) f.mulSub(acc[a][c], () => f.get(lv[a]), () => f.get(xv[c]));
      }
      for (let a = 0; a < mr; a++) f.inc(pa[a], 8);
      f.get(px).get(ld8).add().set(px);
      f.br(0).end().end();
      // pa[a] = &L[i + a, i], px = &X1[i] + q8; acc[a] ← the solved row i + a
      f.get(px).set(addr);
      for (let a = 0; a < mr; a++) {
        if (a > 0) f.get(addr).get(ld8).add().set(addr);
        for (let b = 0; b < a; b++) {
          f.get(pa[a]).f64Load(8 * b).splat().set(lv[0]);
          for (let c = 0; c < nv; c++) f.mulSub(acc[a][c], () => f.get(lv[0]), () => f.get(acc[b][c]));
        }
        f.get(pa[a]).f64Load(8 * a).splat().set(lv[0]);
        for (let c = 0; c < nv; c++) {
          f.get(acc[a][c]).get(lv[0]).vdiv().set(acc[a][c]);
          f.get(addr).get(acc[a][c]).v128Store(16 * c);
        }
      }
    });
  };
  f.i32(0).set(i);
  f.block().loop();
  f.get(i).i32(4).add().get(nc).gtS().brIf(1);
  triangle(4);
  f.inc(i, 4).br(0).end().end();
  f.block().loop();
  f.get(i).get(nc).geS().brIf(1);
  triangle(1);
  f.inc(i, 1).br(0).end().end();

  // X[rows[t]] −= Σ_k L[t, k] X1[k], mr rows at a time
  const rowsBelow = (mr: number): void => {
    loadCaseChunks(f, q8, ld8, (nv) => {
      f.get(o8).get(i).get(nc8).mul().add().set(pa[0]);
      for (let a = 1; a < mr; a++) f.get(pa[a - 1]).get(nc8).add().set(pa[a]);
      f.get(pa[0]).get(nc8).add().set(end);
      f.get(xf8).get(q8).add().set(px);
      for (let a = 0; a < mr; a++) for (let c = 0; c < nv; c++) f.v128Zero().set(acc[a][c]);
      f.block().loop();
      f.get(pa[0]).get(end).geU().brIf(1);
      for (let c = 0; c < nv; c++) f.get(px).v128Load(16 * c).set(xv[c]);
      for (let a = 0; a < mr; a++) {
        f.get(pa[a]).f64Load().splat().set(lv[a]);
        for (let c = 0; c < nv; c++) f.mulAdd(acc[a][c], () => f.get(lv[a]), () => f.get(xv[c]));
      }
      for (let a = 0; a < mr; a++) f.inc(pa[a], 8);
      f.get(px).get(ld8).add().set(px);
      f.br(0).end().end();
      for (let a = 0; a < mr; a++) {
        // addr = xB + rows[i + a]·ld8 + q8
        f.get(xB).get(rowsB).get(i).i32(2).shl().add().i32Load(4 * a).get(ld8).mul().add().get(q8).add().set(addr);
        for (let c = 0; c < nv; c++) f.get(addr).get(addr).v128Load(16 * c).get(acc[a][c]).vsub().v128Store(16 * c);
      }
    });
  };
  f.get(nc).set(i);
  f.block().loop();
  f.get(i).i32(4).add().get(nr).gtS().brIf(1);
  rowsBelow(4);
  f.inc(i, 4).br(0).end().end();
  f.block().loop();
  f.get(i).get(nr).geS().brIf(1);
  rowsBelow(1);
  f.inc(i, 1).br(0).end().end();
  return f;
}

/**
 * supernodes of at least this many columns solve the triangle of the backward pass in blocks
 * of four columns (7–15 % less solve time at frame_10k and frame_50k); smaller ones column by
 * column, reading L11 down a column (it fits the cache there)
 */
export const BLOCKED_FROM = 48;

export function buildSolveBackward(fused: boolean): FunctionBuilder {
  const f = new FunctionBuilder('solveBackward', [I32, I32, I32, I32, I32, I32, I32, I32]);
  f.fused = fused;
  const [o8, nc, nr, xf8, ld8, rowsB, xB, eB] = [0, 1, 2, 3, 4, 5, 6, 7];
  const nc8 = f.local(I32);
  const k = f.local(I32);
  const q8 = f.local(I32);
  const end = f.local(I32);
  const pl = f.local(I32);
  const pe = f.local(I32);
  const src = f.local(I32);
  const addr = f.local(I32);
  const diag = f.local(I32);
  const acc: number[][] = [];
  for (let a = 0; a < 4; a++) acc.push([f.local(V128), f.local(V128)]);
  const lv = [f.local(V128), f.local(V128), f.local(V128), f.local(V128)];
  const ev = [f.local(V128), f.local(V128)];

  f.get(nc).i32(3).shl().set(nc8);

  // E[t − nc] = X[rows[t]]: gather the rows below into contiguous scratch
  f.get(eB).set(pe);
  f.get(rowsB).get(nc).i32(2).shl().add().set(pl);
  f.get(rowsB).get(nr).i32(2).shl().add().set(end);
  f.block().loop();
  f.get(pl).get(end).geU().brIf(1);
  f.get(xB).get(pl).i32Load().get(ld8).mul().add().set(src);
  f.get(src).get(ld8).add().set(addr);
  f.block().loop();
  f.get(src).get(addr).geU().brIf(1);
  f.get(pe).get(src).v128Load().v128Store();
  f.inc(src, 16).inc(pe, 16);
  f.br(0).end().end();
  f.inc(pl, 4);
  f.br(0).end().end();

  // X1[k] −= Σ_t L[t, k] E[t − nc], mk columns of L21 at a time
  const columns = (mk: number): void => {
    loadCaseChunks(f, q8, ld8, (nv) => {
      // pl = &L[nc, k]; end = &L[nr, k]
      f.get(o8).get(nc).get(nc8).mul().add().get(k).i32(3).shl().add().set(pl);
      f.get(o8).get(nr).get(nc8).mul().add().get(k).i32(3).shl().add().set(end);
      f.get(eB).get(q8).add().set(pe);
      for (let a = 0; a < mk; a++) for (let c = 0; c < nv; c++) f.v128Zero().set(acc[a][c]);
      f.block().loop();
      f.get(pl).get(end).geU().brIf(1);
      for (let c = 0; c < nv; c++) f.get(pe).v128Load(16 * c).set(ev[c]);
      for (let a = 0; a < mk; a++) {
        f.get(pl).f64Load(8 * a).splat().set(lv[a]);
        for (let c = 0; c < nv; c++) f.mulAdd(acc[a][c], () => f.get(lv[a]), () => f.get(ev[c]));
      }
      f.get(pl).get(nc8).add().set(pl);
      f.get(pe).get(ld8).add().set(pe);
      f.br(0).end().end();
      for (let a = 0; a < mk; a++) {
        f.get(xf8).get(k).i32(a).add().get(ld8).mul().add().get(q8).add().set(addr);
        for (let c = 0; c < nv; c++) f.get(addr).get(addr).v128Load(16 * c).get(acc[a][c]).vsub().v128Store(16 * c);
      }
    });
  };
  f.get(nr).get(nc).gtS().if();
  f.i32(0).set(k);
  f.block().loop();
  f.get(k).i32(4).add().get(nc).gtS().brIf(1);
  columns(4);
  f.inc(k, 4).br(0).end().end();
  f.block().loop();
  f.get(k).get(nc).geS().brIf(1);
  columns(1);
  f.inc(k, 1).br(0).end().end();
  f.end();

  // From BLOCKED_FROM columns on, the triangle is solved in blocks (below); smaller
  // supernodes keep the column-by-column loop, whose rounding small models were checked with.
  f.get(nc).i32(BLOCKED_FROM).geS().if();
  // X1[k] = (X1[k] − Σ_{j>k} L[j, k] X1[j]) / L[k, k], last row first, mk columns at a time:
  // the product with the solved rows below as a register tile (mk columns by four load cases,
  // each row of L read as mk adjacent values), then the mk × mk triangle in registers
  const triangle = (mk: number): void => {
    loadCaseChunks(f, q8, ld8, (nv) => {
      // diag = &L[k, k]; pl = &L[k + mk, k], end = &L[nc, k], pe = &X1[k + mk] + q8
      f.get(o8).get(k).get(nc).mul().get(k).add().i32(3).shl().add().set(diag);
      f.get(diag).get(nc8).i32(mk).mul().add().set(pl);
      f.get(o8).get(nc).get(nc8).mul().add().get(k).i32(3).shl().add().set(end);
      f.get(xf8).get(k).i32(mk).add().get(ld8).mul().add().get(q8).add().set(pe);
      for (let a = 0; a < mk; a++) for (let c = 0; c < nv; c++) f.v128Zero().set(acc[a][c]);
      f.block().loop();
      f.get(pl).get(end).geU().brIf(1);
      for (let c = 0; c < nv; c++) f.get(pe).v128Load(16 * c).set(ev[c]);
      for (let a = 0; a < mk; a++) {
        f.get(pl).f64Load(8 * a).splat().set(lv[a]);
        for (let c = 0; c < nv; c++) f.mulAdd(acc[a][c], () => f.get(lv[a]), () => f.get(ev[c]));
      }
      f.get(pl).get(nc8).add().set(pl);
      f.get(pe).get(ld8).add().set(pe);
      f.br(0).end().end();
      for (let a = mk - 1; a >= 0; a--) {
        // addr = &X1[k + a] + q8; acc[a] ← the solved row k + a
        f.get(xf8).get(k).i32(a).add().get(ld8).mul().add().get(q8).add().set(addr);
        for (let c = 0; c < nv; c++) f.get(addr).v128Load(16 * c).get(acc[a][c]).vsub().set(acc[a][c]);
        for (let b = a + 1; b < mk; b++) {
          // L[k + b, k + a]
          f.get(diag).get(nc8).i32(b).mul().add().f64Load(8 * a).splat().set(lv[0]);
          for (let c = 0; c < nv; c++) f.mulSub(acc[a][c], () => f.get(lv[0]), () => f.get(acc[b][c]));
        }
        f.get(diag).get(nc8).i32(a).mul().add().f64Load(8 * a).splat().set(lv[0]);
        for (let c = 0; c < nv; c++) {
          f.get(acc[a][c]).get(lv[0]).vdiv().set(acc[a][c]);
          f.get(addr).get(acc[a][c]).v128Store(16 * c);
        }
      }
    });
  };
  // blocks [k, k + 4) from the end, then single columns
  f.get(nc).i32(4).sub().set(k);
  f.block().loop();
  f.get(k).i32(0).ltS().brIf(1);
  triangle(4);
  f.get(k).i32(4).sub().set(k);
  f.br(0).end().end();
  f.get(k).i32(3).add().set(k);
  f.block().loop();
  f.get(k).i32(0).ltS().brIf(1);
  triangle(1);
  f.get(k).i32(1).sub().set(k);
  f.br(0).end().end();
  f.else();
  // X1[k] = (X1[k] − Σ_{j>k} L[j, k] X1[j]) / L[k, k], last row first
  f.get(nc).i32(1).sub().set(k);
  f.block().loop();
  f.get(k).i32(0).ltS().brIf(1);
  loadCaseChunks(f, q8, ld8, (nv) => {
    f.get(xf8).get(k).get(ld8).mul().add().get(q8).add().set(addr);
    for (let c = 0; c < nv; c++) f.get(addr).v128Load(16 * c).set(acc[0][c]);
    // pl = &L[k + 1, k], end = &L[nc, k], pe = &X1[k + 1] + q8
    f.get(o8).get(k).i32(1).add().get(nc8).mul().add().get(k).i32(3).shl().add().set(pl);
    f.get(o8).get(nc).get(nc8).mul().add().get(k).i32(3).shl().add().set(end);
    f.get(addr).get(ld8).add().set(pe);
    f.block().loop();
    f.get(pl).get(end).geU().brIf(1);
    f.get(pl).f64Load().splat().set(lv[0]);
    for (let c = 0; c < nv; c++) f.mulSub(acc[0][c], () => f.get(lv[0]), () => f.get(pe).v128Load(16 * c));
    f.get(pl).get(nc8).add().set(pl);
    f.get(pe).get(ld8).add().set(pe);
    f.br(0).end().end();
    f.get(o8).get(k).get(nc8).mul().add().get(k).i32(3).shl().add().f64Load().splat().set(lv[0]);
    for (let c = 0; c < nv; c++) f.get(addr).get(acc[0][c]).get(lv[0]).vdiv().v128Store(16 * c);
  });
  f.get(k).i32(1).sub().set(k);
  f.br(0).end().end();
  f.end();
  return f;
}
