/** Small builder of validated Model objects for engine tests (SI units throughout). */
import type {
  Combination, LoadDirection, Material, Member, MemberLoadKind, Model, Section, SectionProps, Six, VerticalAxis,
} from '../../../shared/model/types.js';

export const STEEL_E = 200e9;

export interface BuilderOptions {
  vertical?: VerticalAxis;
  /** plane frame: restrain out-of-plane freedoms (normal axis) */
  planeNormal?: 'X' | 'Y' | 'Z';
}

const FREEDOM_NAMES = ['ux', 'uy', 'uz', 'rx', 'ry', 'rz'];

export class ModelBuilder {
  readonly model: Model;

  constructor(opts: BuilderOptions = {}) {
    const vertical = opts.vertical ?? 'Z';
    const n = opts.planeNormal;
    this.model = {
      settings: {
        title: 'test', units: 'metric', verticalAxis: vertical, designCode: 'none', combinationRule: 'table',
        deflectionLimit: 360, gammaM0: 1, gammaM1: 1, gammaM2: 1.25,
        stations: 11, analysis: 'first_order', bucklingModes: 0, modes: 0, stabilityWarning: true,
      },
      inferred: {
        verticalAxisInferred: false,
        planeFrame: n ? { plane: n === 'X' ? 'YZ' : n === 'Y' ? 'XZ' : 'XY', normal: n } : null,
        defaulted: [],
      },
      nodes: [], supports: [], materials: [], sections: [], members: [], cases: [], nodeLoads: [],
      memberLoads: [], settlements: [], combinations: [], vehicles: [], lanes: [], movingLoads: [], resultPoints: [],
    };
    this.material('steel', {});
    this.section('S', {});
  }

  material(id: string, m: Partial<Material>): this {
    const E = m.E ?? STEEL_E, nu = m.nu ?? 0.3;
    this.model.materials.push({ id, E, nu, G: m.G ?? E / (2 * (1 + nu)), density: m.density ?? 0, alpha: m.alpha ?? 12e-6 });
    return this;
  }

  section(id: string, p: Partial<SectionProps>): this {
    const props: SectionProps = {
      A: 0.01, I_major: 1e-4, I_minor: 5e-5, J: 2e-5, Cw: 0, S_major: 0, S_minor: 0, Z_major: 0, Z_minor: 0,
      Av_major: 0, Av_minor: 0, depth: 0.3, ...p,
    };
    const s: Section = { id, shape: 'custom', dims: {}, props, given: Object.keys(props) as (keyof SectionProps)[] };
    this.model.sections.push(s);
    return this;
  }

  node(id: string, x: number, y: number, z = 0): this {
    this.model.nodes.push({ id, x, y, z });
    return this;
  }

  /** `spec`: 'fixed', 'pinned', or a list of freedoms like 'ux uz'. */
  support(node: string, spec: string, springs: Partial<Record<string, number>> = {}): this {
    const r = spec === 'fixed' ? FREEDOM_NAMES : spec === 'pinned' ? ['ux', 'uy', 'uz'] : spec.split(/\s+/).filter(Boolean);
    const restrained = FREEDOM_NAMES.map((f) => r.includes(f)) as Six<boolean>;
    const k = FREEDOM_NAMES.map((f) => springs[f] ?? 0) as Six<number>;
    this.model.supports.push({ node, restrained, springs: k });
    return this;
  }

  member(id: string, start: string, end: string, m: Partial<Member> = {}): this {
    this.model.members.push({
      id, start, end, section: 'S', material: 'steel', type: 'frame', roll: 0, releaseStart: 'fixed', releaseEnd: 'fixed',
      kMajor: 1, kMinor: 1, ...m,
    });
    return this;
  }

  loadCase(id: string, selfWeight = 0): this {
    this.model.cases.push({ id, category: 'dead', title: id, selfWeight, mass: false });
    return this;
  }

  nodeLoad(lc: string, node: string, v: Partial<Record<'fx' | 'fy' | 'fz' | 'mx' | 'my' | 'mz', number>>): this {
    const values = (['fx', 'fy', 'fz', 'mx', 'my', 'mz'] as const).map((k) => v[k] ?? 0) as Six<number>;
    this.model.nodeLoads.push({ case: lc, node, values });
    return this;
  }

  memberLoad(
    lc: string, member: string, kind: MemberLoadKind, direction: LoadDirection, w1: number,
    o: { a?: number; b?: number; w2?: number } = {},
  ): this {
    const m = this.model.members.find((x) => x.id === member)!;
    const s = this.model.nodes.find((n) => n.id === m.start)!, e = this.model.nodes.find((n) => n.id === m.end)!;
    const L = Math.hypot(e.x - s.x, e.y - s.y, e.z - s.z);
    const a = o.a ?? 0;
    this.model.memberLoads.push({
      case: lc, member, kind, direction, a, b: kind === 'point' || kind === 'moment' ? a : o.b ?? L, w1, w2: o.w2 ?? w1,
    });
    return this;
  }

  settlement(lc: string, node: string, v: Partial<Record<string, number>>): this {
    const values = FREEDOM_NAMES.map((f) => (v[f] === undefined ? null : v[f]!)) as Six<number | null>;
    this.model.settlements.push({ case: lc, node, values });
    return this;
  }

  combination(id: string, terms: Record<string, number>, limitState: Combination['limitState'] = 'strength'): this {
    this.model.combinations.push({ id, limitState, terms: Object.entries(terms).map(([c, factor]) => ({ case: c, factor })) });
    return this;
  }

  build(): Model {
    return this.model;
  }
}

/** |a − b| ≤ rtol · max(1e-30, |b|) style helper returning the relative error. */
export function relErr(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(b), 1e-30);
}

/** Value of a station quantity at x (exact station match required). */
export function at(xs: Float64Array, values: Float64Array, x: number): number {
  for (let i = 0; i < xs.length; i++) if (Math.abs(xs[i] - x) < 1e-9) return values[i];
  throw new Error(`no station at x = ${x}`);
}

export function nodeIndexOf(model: Model, id: string): number {
  return model.nodes.findIndex((n) => n.id === id);
}
