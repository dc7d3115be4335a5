/**
 * A very small WebAssembly assembler: enough of the binary format (WebAssembly Core
 * Specification 2.0, §5) to build one module that imports its memory and exports a few
 * functions written with the instruction builder below. It lets the dense kernels of the
 * factorisation use 128-bit SIMD without a separate toolchain or a binary file.
 */

export const I32 = 0x7f;
export const F64 = 0x7c;
export const V128 = 0x7b;
export type ValType = typeof I32 | typeof F64 | typeof V128;

function uleb(out: number[], v: number): void {
  do {
    let b = v & 0x7f;
    v >>>= 7;
    if (v !== 0) b |= 0x80;
    out.push(b);
  } while (v !== 0);
}

function sleb(out: number[], v: number): void {
  for (;;) {
    const b = v & 0x7f;
    v >>= 7;
    if ((v === 0 && (b & 0x40) === 0) || (v === -1 && (b & 0x40) !== 0)) {
      out.push(b);
      return;
    }
    out.push(b | 0x80);
  }
}

function name(out: number[], s: string): void {
  uleb(out, s.length);
  for (let i = 0; i < s.length; i++) out.push(s.charCodeAt(i));
}

/** Instruction builder for one function body; locals are numbered after the parameters. */
export class FunctionBuilder {
  readonly code: number[] = [];
  private readonly localTypes: ValType[] = [];

  constructor(
    readonly exportName: string,
    readonly params: ValType[],
    readonly results: ValType[] = [],
  ) {}

  /** declares a new local of the given type and returns its index */
  local(type: ValType): number {
    this.localTypes.push(type);
    return this.params.length + this.localTypes.length - 1;
  }

  private op(...bytes: number[]): this {
    for (const b of bytes) this.code.push(b);
    return this;
  }
  private simd(opcode: number): this {
    this.code.push(0xfd);
    uleb(this.code, opcode);
    return this;
  }
  private mem(align: number, offset: number): this {
    uleb(this.code, align);
    uleb(this.code, offset);
    return this;
  }

  get(l: number): this {
    this.op(0x20);
    uleb(this.code, l);
    return this;
  }
  set(l: number): this {
    this.op(0x21);
    uleb(this.code, l);
    return this;
  }
  tee(l: number): this {
    this.op(0x22);
    uleb(this.code, l);
    return this;
  }
  i32(v: number): this {
    this.op(0x41);
    sleb(this.code, v | 0);
    return this;
  }
  f64(v: number): this {
    this.op(0x44);
    const b = new Uint8Array(new Float64Array([v]).buffer);
    for (const x of b) this.code.push(x);
    return this;
  }

  // control: block/loop take no values (block type 0x40)
  block(): this {
    return this.op(0x02, 0x40);
  }
  loop(): this {
    return this.op(0x03, 0x40);
  }
  if(): this {
    return this.op(0x04, 0x40);
  }
  else(): this {
    return this.op(0x05);
  }
  end(): this {
    return this.op(0x0b);
  }
  br(depth: number): this {
    this.op(0x0c);
    uleb(this.code, depth);
    return this;
  }
  brIf(depth: number): this {
    this.op(0x0d);
    uleb(this.code, depth);
    return this;
  }
  select(): this {
    return this.op(0x1b);
  }

  // i32 arithmetic and comparisons
  add(): this {
    return this.op(0x6a);
  }
  sub(): this {
    return this.op(0x6b);
  }
  mul(): this {
    return this.op(0x6c);
  }
  and(): this {
    return this.op(0x71);
  }
  shl(): this {
    return this.op(0x74);
  }
  eqz(): this {
    return this.op(0x45);
  }
  ltS(): this {
    return this.op(0x48);
  }
  ltU(): this {
    return this.op(0x49);
  }
  gtS(): this {
    return this.op(0x4a);
  }
  leS(): this {
    return this.op(0x4c);
  }
  geS(): this {
    return this.op(0x4e);
  }
  geU(): this {
    return this.op(0x4f);
  }

  // memory: byte address on the stack
  i32Load(offset = 0): this {
    return this.op(0x28).mem(2, offset);
  }
  f64Load(offset = 0): this {
    return this.op(0x2b).mem(3, offset);
  }
  f64Store(offset = 0): this {
    return this.op(0x39).mem(3, offset);
  }
  v128Load(offset = 0): this {
    return this.simd(0x00).mem(3, offset);
  }
  v128Store(offset = 0): this {
    return this.simd(0x0b).mem(3, offset);
  }

  // f64 arithmetic
  fadd(): this {
    return this.op(0xa0);
  }
  fsub(): this {
    return this.op(0xa1);
  }
  fmul(): this {
    return this.op(0xa2);
  }
  fdiv(): this {
    return this.op(0xa3);
  }

  // f64x2
  v128Zero(): this {
    this.simd(0x0c);
    for (let i = 0; i < 16; i++) this.code.push(0);
    return this;
  }
  splat(): this {
    return this.simd(0x14);
  }
  lane(i: 0 | 1): this {
    return this.simd(0x21).op(i);
  }
  vadd(): this {
    return this.simd(0xf0);
  }
  vsub(): this {
    return this.simd(0xf1);
  }
  vmul(): this {
    return this.simd(0xf2);
  }
  vdiv(): this {
    return this.simd(0xf3);
  }

  // relaxed SIMD (WebAssembly relaxed-simd proposal): a·b + c and −(a·b) + c, fused where the
  // hardware has fused multiply-add
  vmadd(): this {
    return this.simd(0x107);
  }
  vnmadd(): this {
    return this.simd(0x108);
  }

  /**
   * With `fused` set, the products below use relaxed fused multiply-add; otherwise a
   * multiplication and an addition (the fallback where relaxed SIMD is unavailable).
   */
  fused = false;

  /** local acc ← acc + a·b (f64x2); pushA and pushB leave one vector each on the stack */
  mulAdd(acc: number, pushA: () => void, pushB: () => void): this {
    if (this.fused) {
      pushA();
      pushB();
      return this.get(acc).vmadd().set(acc);
    }
    this.get(acc);
    pushA();
    pushB();
    return this.vmul().vadd().set(acc);
  }

  /** local acc ← acc − a·b (f64x2) */
  mulSub(acc: number, pushA: () => void, pushB: () => void): this {
    if (this.fused) {
      pushA();
      pushB();
      return this.get(acc).vnmadd().set(acc);
    }
    this.get(acc);
    pushA();
    pushB();
    return this.vmul().vsub().set(acc);
  }

  /** local l += amount (i32) */
  inc(l: number, amount: number): this {
    return this.get(l).i32(amount).add().set(l);
  }

  body(): number[] {
    const out: number[] = [];
    // locals grouped by runs of the same type
    const groups: Array<[number, ValType]> = [];
    for (const t of this.localTypes) {
      const last = groups[groups.length - 1];
      if (last && last[1] === t) last[0]++;
      else groups.push([1, t]);
    }
    uleb(out, groups.length);
    for (const [count, t] of groups) {
      uleb(out, count);
      out.push(t);
    }
    for (const b of this.code) out.push(b);
    out.push(0x0b);
    return out;
  }
}

function section(out: number[], id: number, content: number[]): void {
  out.push(id);
  uleb(out, content.length);
  for (const b of content) out.push(b);
}

/** A module importing memory `env.mem` and exporting every function under its name. */
export function assembleModule(fns: FunctionBuilder[]): Uint8Array {
  const out = [0x00, 0x61, 0x73, 0x6d, 0x01, 0x00, 0x00, 0x00];
  const types: number[] = [];
  uleb(types, fns.length);
  for (const f of fns) {
    types.push(0x60);
    uleb(types, f.params.length);
    types.push(...f.params);
    uleb(types, f.results.length);
    types.push(...f.results);
  }
  section(out, 1, types);
  const imports: number[] = [1];
  name(imports, 'env');
  name(imports, 'mem');
  imports.push(0x02, 0x00, 0x00); // memory, limits: min 0, no max
  section(out, 2, imports);
  const funcs: number[] = [];
  uleb(funcs, fns.length);
  for (let i = 0; i < fns.length; i++) uleb(funcs, i);
  section(out, 3, funcs);
  const exports: number[] = [];
  uleb(exports, fns.length);
  fns.forEach((f, i) => {
    name(exports, f.exportName);
    exports.push(0x00);
    uleb(exports, i);
  });
  section(out, 7, exports);
  const code: number[] = [];
  uleb(code, fns.length);
  for (const f of fns) {
    const b = f.body();
    uleb(code, b.length);
    for (const x of b) code.push(x);
  }
  section(out, 10, code);
  return Uint8Array.from(out);
}
