/**
 * Dense kernels of the supernodal factorisation in WebAssembly with 128-bit SIMD, built at
 * load time by wasm-emitter.ts. All arguments are indices into one memory that holds the
 * factor (Float64, element index = byte address / 8) and the scatter maps (Int32, given by
 * their byte address). When WebAssembly SIMD is unavailable, `simdKernels()` returns null
 * and the factorisation uses its plain TypeScript kernels instead.
 *
 * update(ob, w, rLo, rHi, cLo, cHi, kLo, kHi, tRowB, tColB):
 *   for rLo ≤ r < rHi and cLo ≤ c < cHi, c ≤ r (rounded up to the 4-row block, so a few
 *   entries just above the diagonal of the target are written too; callers never read them):
 *   L[tRow[r] + tCol[c]] −= Σ_{kLo ≤ k < kHi} L[ob + r·w + k] · L[ob + c·w + k]
 *   computed four rows by two columns at a time, two products per SIMD lane pair.
 */
import { buildSolveBackward, buildSolveForward } from './solve-kernels.js';
import { assembleModule, F64, FunctionBuilder, I32, V128 } from './wasm-emitter.js';

/** The parts of the WebAssembly JavaScript interface used here (not in every lib setting). */
interface WasmMemory {
  readonly buffer: ArrayBuffer;
  grow(pages: number): number;
}
interface WasmApi {
  validate(bytes: Uint8Array): boolean;
  Module: new (bytes: Uint8Array) => object;
  Instance: new (module: object, imports: object) => { exports: Record<string, unknown> };
  Memory: new (descriptor: { initial: number }) => WasmMemory;
}
const wasm = (globalThis as { WebAssembly?: WasmApi }).WebAssembly;

export interface SimdKernels {
  memory: WasmMemory;
  /** built with relaxed-SIMD fused multiply-add */
  fused: boolean;
  update(ob: number, w: number, rLo: number, rHi: number, cLo: number, cHi: number, kLo: number, kHi: number, tRowB: number, tColB: number): void;
  trsm(os: number, nc: number, nr: number, j0: number, j1: number): void;
  gather(
    dstB: number,
    nrhs: number,
    lB: number,
    lStride8: number,
    srcB: number,
    srcStride8: number,
    rowsB: number,
    indirect: number,
    count: number,
    scale: number,
    diagB: number,
  ): void;
  /** block substitution, one call per supernode and pass (solve-kernels.ts) */
  solveForward(o8: number, nc: number, nr: number, xf8: number, ld8: number, rowsB: number, xB: number): void;
  solveBackward(o8: number, nc: number, nr: number, xf8: number, ld8: number, rowsB: number, xB: number, eB: number): void;
}

function buildUpdate(fused: boolean): FunctionBuilder {
  const f = new FunctionBuilder('update', [I32, I32, I32, I32, I32, I32, I32, I32, I32, I32]);
  f.fused = fused;
  const [ob, w, rLo, rHi, cLo, cHi, kLo, kHi, tRowB, tColB] = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9];
  const r = f.local(I32);
  const c = f.local(I32);
  const cEnd = f.local(I32);
  const w8 = f.local(I32);
  const odd = f.local(I32);
  const len2 = f.local(I32);
  const end = f.local(I32);
  const addr = f.local(I32);
  const pa = [f.local(I32), f.local(I32), f.local(I32), f.local(I32)];
  const pb = [f.local(I32), f.local(I32)];
  const tr = [f.local(I32), f.local(I32), f.local(I32), f.local(I32)];
  const tc = [f.local(I32), f.local(I32)];
  const va = [f.local(V128), f.local(V128), f.local(V128), f.local(V128)];
  const vb = [f.local(V128), f.local(V128)];
  const acc: number[] = [];
  for (let i = 0; i < 8; i++) acc.push(f.local(V128));
  const s: number[] = [];
  for (let i = 0; i < 8; i++) s.push(f.local(F64));

  /** byte address of L[ob + row·w + kLo] for the row held in local `row` */
  const rowStart = (row: number, target: number): void => {
    f.get(ob).get(row).get(w).mul().add().get(kLo).add().i32(3).shl().set(target);
  };

  const micro = (mr: number, nr: number): void => {
    rowStart(r, pa[0]);
    for (let i = 1; i < mr; i++) f.get(pa[i - 1]).get(w8).add().set(pa[i]);
    rowStart(c, pb[0]);
    for (let j = 1; j < nr; j++) f.get(pb[j - 1]).get(w8).add().set(pb[j]);
    for (let q = 0; q < mr * nr; q++) f.v128Zero().set(acc[q]);
    f.get(pa[0]).get(len2).add().set(end);
    f.block().loop();
    f.get(pa[0]).get(end).geU().brIf(1);
    for (let i = 0; i < mr; i++) f.get(pa[i]).v128Load().set(va[i]);
    for (let j = 0; j < nr; j++) f.get(pb[j]).v128Load().set(vb[j]);
    for (let i = 0; i < mr; i++) {
      for (let j = 0; j < nr; j++) {
        const q = i * nr + j;
        f.mulAdd(acc[q], () => f.get(va[i]), () => f.get(vb[j]));
      }
    }
    for (let i = 0; i < mr; i++) f.inc(pa[i], 16);
    for (let j = 0; j < nr; j++) f.inc(pb[j], 16);
    f.br(0).end().end();
    for (let q = 0; q < mr * nr; q++) f.get(acc[q]).lane(0).get(acc[q]).lane(1).fadd().set(s[q]);
    f.get(odd).if();
    for (let i = 0; i < mr; i++) {
      for (let j = 0; j < nr; j++) {
        const q = i * nr + j;
        f.get(s[q]).get(pa[i]).f64Load().get(pb[j]).f64Load().fmul().fadd().set(s[q]);
      }
    }
    f.end();
    for (let j = 0; j < nr; j++) f.get(c).i32(2).shl().get(tColB).add().i32Load(4 * j).i32(3).shl().set(tc[j]);
    for (let i = 0; i < mr; i++) {
      for (let j = 0; j < nr; j++) {
        const q = i * nr + j;
        f.get(tr[i]).get(tc[j]).add().tee(addr);
        f.get(addr).f64Load().get(s[q]).fsub().f64Store();
      }
    }
  };

  /** column loop for a block of `mr` rows starting at r: columns cLo ≤ c < min(cHi, r + mr) */
  const columns = (mr: number): void => {
    // byte offsets of the target rows, loaded once per row block
    for (let i = 0; i < mr; i++) f.get(r).i32(2).shl().get(tRowB).add().i32Load(4 * i).i32(3).shl().set(tr[i]);
    f.get(cHi).get(r).i32(mr).add().get(cHi).get(r).i32(mr).add().ltS().select().set(cEnd);
    f.get(cLo).set(c);
    f.block().loop();
    f.get(c).i32(2).add().get(cEnd).gtS().brIf(1);
    micro(mr, 2);
    f.inc(c, 2).br(0).end().end();
    f.get(c).get(cEnd).ltS().if();
    micro(mr, 1);
    f.end();
  };

  f.get(w).i32(3).shl().set(w8);
  f.get(kHi).get(kLo).sub().i32(1).and().set(odd);
  f.get(kHi).get(kLo).sub().i32(-2).and().i32(3).shl().set(len2);
  f.get(rLo).set(r);
  f.block().loop();
  f.get(r).i32(4).add().get(rHi).gtS().brIf(1);
  columns(4);
  f.inc(r, 4).br(0).end().end();
  f.block().loop();
  f.get(r).get(rHi).geS().brIf(1);
  columns(1);
  f.inc(r, 1).br(0).end().end();
  return f;
}

/**
 * trsm(os, nc, nr, j0, j1): in the row-major nr × nc block at os, for rows j1 ≤ r < nr and
 * columns j0 ≤ j < j1 in turn, L[r, j] = (L[r, j] − Σ_{j0≤k<j} L[r, k]·L[j, k]) / L[j, j]
 * (solving the rows below a factored diagonal panel), four rows at a time.
 */
function buildTrsm(fused: boolean): FunctionBuilder {
  const f = new FunctionBuilder('trsm', [I32, I32, I32, I32, I32]);
  f.fused = fused;
  const [os, nc, nr, j0, j1] = [0, 1, 2, 3, 4];
  const r = f.local(I32);
  const j = f.local(I32);
  const nc8 = f.local(I32);
  const pb = f.local(I32);
  const end = f.local(I32);
  const addr = f.local(I32);
  const pa = [f.local(I32), f.local(I32), f.local(I32), f.local(I32)];
  const va = [f.local(V128), f.local(V128), f.local(V128), f.local(V128)];
  const vb = f.local(V128);
  const acc = [f.local(V128), f.local(V128), f.local(V128), f.local(V128)];
  const s = [f.local(F64), f.local(F64), f.local(F64), f.local(F64)];
  const d = f.local(F64);

  const rows = (mr: number): void => {
    f.get(j0).set(j);
    f.block().loop();
    f.get(j).get(j1).geS().brIf(1);
    // pa[0] = &L[r, j0], pb = &L[j, j0]
    f.get(os).get(r).get(nc).mul().add().get(j0).add().i32(3).shl().set(pa[0]);
    for (let i = 1; i < mr; i++) f.get(pa[i - 1]).get(nc8).add().set(pa[i]);
    f.get(os).get(j).get(nc).mul().add().get(j0).add().i32(3).shl().set(pb);
    f.get(pb).get(j).get(j0).sub().i32(-2).and().i32(3).shl().add().set(end);
    for (let i = 0; i < mr; i++) f.v128Zero().set(acc[i]);
    f.block().loop();
    f.get(pb).get(end).geU().brIf(1);
    f.get(pb).v128Load().set(vb);
    for (let i = 0; i < mr; i++) f.get(pa[i]).v128Load().set(va[i]);
    for (let i = 0; i < mr; i++) f.mulAdd(acc[i], () => f.get(va[i]), () => f.get(vb));
    for (let i = 0; i < mr; i++) f.inc(pa[i], 16);
    f.inc(pb, 16);
    f.br(0).end().end();
    for (let i = 0; i < mr; i++) f.get(acc[i]).lane(0).get(acc[i]).lane(1).fadd().set(s[i]);
    f.get(j).get(j0).sub().i32(1).and().if();
    for (let i = 0; i < mr; i++) f.get(s[i]).get(pa[i]).f64Load().get(pb).f64Load().fmul().fadd().set(s[i]);
    for (let i = 0; i < mr; i++) f.inc(pa[i], 8);
    f.inc(pb, 8);
    f.end();
    // pb now points at L[j, j]; pa[i] at L[r + i, j]
    f.get(pb).f64Load().set(d);
    for (let i = 0; i < mr; i++) {
      f.get(pa[i]).set(addr);
      f.get(addr).get(addr).f64Load().get(s[i]).fsub().get(d).fdiv().f64Store();
    }
    f.inc(j, 1).br(0).end().end();
  };

  f.get(nc).i32(3).shl().set(nc8);
  f.get(j1).set(r);
  f.block().loop();
  f.get(r).i32(4).add().get(nr).gtS().brIf(1);
  rows(4);
  f.inc(r, 4).br(0).end().end();
  f.block().loop();
  f.get(r).get(nr).geS().brIf(1);
  rows(1);
  f.inc(r, 1).br(0).end().end();
  return f;
}

/**
 * gather(dstB, nrhs, lB, lStride8, srcB, srcStride8, rowsB, indirect, count, scale, diagB):
 * one row of a block substitution over all load cases. With x_t the row of nrhs values at
 * srcB + t·srcStride8 (or, when `indirect`, at srcB + rows[t]·srcStride8 with rows at rowsB)
 * and l_t the value at lB + t·lStride8:
 *   dst ← (dst − Σ_{t<count} l_t · x_t) / (scale ? L at diagB : 1)
 * with the load cases eight (then two, then one) at a time in registers.
 */
function buildGather(): FunctionBuilder {
  const f = new FunctionBuilder('gather', [I32, I32, I32, I32, I32, I32, I32, I32, I32, I32, I32]);
  const [dstB, nrhs, lB, lStride8, srcB, srcStride8, rowsB, indirect, count, scale, diagB] = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
  const q8 = f.local(I32);
  const nrhs8 = f.local(I32);
  const t = f.local(I32);
  const pl = f.local(I32);
  const ps = f.local(I32);
  const pr = f.local(I32);
  const l = f.local(V128);
  const acc = [f.local(V128), f.local(V128), f.local(V128), f.local(V128)];
  const ls = f.local(F64);
  const as = f.local(F64);

  /** acc −= l_t · x_t over t, for `nv` vectors (0: one scalar) at byte offset q8 of each row */
  const terms = (nv: number): void => {
    const step = (src: () => void): void => {
      if (nv === 0) {
        f.get(pl).f64Load().set(ls);
        f.get(as);
        f.get(ls);
        src();
        f.f64Load().fmul().fsub().set(as);
        return;
      }
      f.get(pl).f64Load().splat().set(l);
      for (let c = 0; c < nv; c++) {
        f.get(acc[c]).get(l);
        src();
        f.v128Load(16 * c).vmul().vsub().set(acc[c]);
      }
    };
    f.get(lB).set(pl);
    f.i32(0).set(t);
    f.get(indirect).if();
    f.get(rowsB).set(pr);
    f.block().loop();
    f.get(t).get(count).geS().brIf(1);
    step(() => f.get(srcB).get(pr).i32Load().get(srcStride8).mul().add().get(q8).add());
    f.get(pl).get(lStride8).add().set(pl);
    f.inc(pr, 4).inc(t, 1).br(0).end().end();
    f.else();
    f.get(srcB).get(q8).add().set(ps);
    f.block().loop();
    f.get(t).get(count).geS().brIf(1);
    step(() => f.get(ps));
    f.get(pl).get(lStride8).add().set(pl);
    f.get(ps).get(srcStride8).add().set(ps);
    f.inc(t, 1).br(0).end().end();
    f.end();
  };

  const chunk = (nv: number): void => {
    const width = nv === 0 ? 8 : 16 * nv;
    f.block().loop();
    f.get(q8).i32(width).add().get(nrhs8).gtS().brIf(1);
    if (nv === 0) f.get(dstB).get(q8).add().f64Load().set(as);
    for (let c = 0; c < nv; c++) f.get(dstB).get(q8).add().v128Load(16 * c).set(acc[c]);
    terms(nv);
    f.get(scale).if();
    if (nv === 0) f.get(as).get(diagB).f64Load().fdiv().set(as);
    else {
      f.get(diagB).f64Load().splat().set(l);
      for (let c = 0; c < nv; c++) f.get(acc[c]).get(l).vdiv().set(acc[c]);
    }
    f.end();
    if (nv === 0) f.get(dstB).get(q8).add().get(as).f64Store();
    for (let c = 0; c < nv; c++) f.get(dstB).get(q8).add().get(acc[c]).v128Store(16 * c);
    f.inc(q8, width).br(0).end().end();
  };

  f.get(nrhs).i32(3).shl().set(nrhs8);
  f.i32(0).set(q8);
  chunk(4);
  chunk(1);
  chunk(0);
  return f;
}

/** compiled modules: [plain, fused]; null where the runtime refuses the module */
const compiled: Array<object | null | undefined> = [undefined, undefined];

function module(fused: boolean): object | null {
  const i = fused ? 1 : 0;
  if (compiled[i] !== undefined) return compiled[i];
  let mod: object | null = null;
  try {
    if (wasm) {
      const fns = [buildUpdate(fused), buildTrsm(fused), buildGather(), buildSolveForward(fused), buildSolveBackward(fused)];
      const bytes = assembleModule(fns);
      if (wasm.validate(bytes)) mod = new wasm.Module(bytes);
    }
  } catch {
    mod = null;
  }
  compiled[i] = mod;
  return mod;
}

let fusedWanted = true;

/**
 * Whether the kernels use relaxed-SIMD fused multiply-add where the runtime has it (default
 * true; browsers with relaxed SIMD, Node only behind --experimental-wasm-relaxed-simd).
 * Off, or where unavailable, they multiply and add separately.
 */
export function useFusedMultiplyAdd(on: boolean): void {
  fusedWanted = on;
}

/** True when kernels with fused multiply-add can be built on this runtime. */
export function hasFusedMultiplyAdd(): boolean {
  return module(true) !== null;
}

/** largest memory asked for (bytes); beyond it the TypeScript kernels are used */
export const MAX_BYTES = 2 ** 32 - 2 ** 16;

let enabled = true;

/** Switches the SIMD kernels off (or back on), e.g. to test the TypeScript kernels. */
export function useSimdKernels(on: boolean): void {
  enabled = on;
}

/** Kernels over a fresh memory of at least `bytes` bytes, or null when unavailable. */
export function simdKernels(bytes: number): SimdKernels | null {
  if (!enabled || !wasm || bytes > MAX_BYTES) return null;
  const fusedMod = fusedWanted ? module(true) : null;
  const mod = fusedMod ?? module(false);
  if (mod === null) return null;
  try {
    const memory = new wasm.Memory({ initial: Math.max(1, Math.ceil(bytes / 65536)) });
    const inst = new wasm.Instance(mod, { env: { mem: memory } });
    const ex = inst.exports as unknown as Omit<SimdKernels, 'memory'>;
    return { memory, fused: mod === fusedMod, update: ex.update, trsm: ex.trsm, gather: ex.gather, solveForward: ex.solveForward, solveBackward: ex.solveBackward };
  } catch {
    return null;
  }
}
