/**
 * The other way round: a validated Model (SI) → the tables the importer reads (tables.md),
 * header units in brackets in the model's unit system, so that reading them back gives the
 * same model. Pure: the XLSX bytes are written on the server (`server/models/model-workbook.ts`).
 *
 * Decisions (each one keeps "read → write → read" identical):
 * - **Settings**: every key is written with its value, including the ones the original
 *   workbook left to their defaults; the re-read model then lists none as defaulted and the
 *   vertical axis as given (`inferred.defaulted`, `inferred.verticalAxisInferred`) — nothing
 *   else changes.
 * - **Sections**: rows of the workbook's own sections only (shape, the dimensions that were
 *   given, and only the properties the user gave: computed ones are computed again).
 *   Catalogue sections (`builtIn`) are not rows: members keep their designation and the
 *   catalogue resolves it again. Built-in materials likewise.
 * - **Materials**: `nu` always; `G` too unless it is E / (2(1 + nu)), which the reader computes.
 * - **Supports**: `type` (`fixed`/`pinned`) where it fits, freedom columns only where the
 *   support differs from it. If that would change the plane-frame inference, every support
 *   is written with all six freedom columns instead (what the original must have said).
 * - **Combinations**: with a generating rule, the setting and no table when the model's
 *   combinations are what the rule generates; the "1.0 <case>" set of a model without a table
 *   likewise gives no table. Anything else (a table, or edited combinations) is written out
 *   in long form, and a rule whose combinations were edited becomes `combination_rule = table`.
 * - **Numbers**: each value v (SI) is written as the shortest decimal y (15, 16 or 17
 *   significant digits) with y · factor === v, the reader's own conversion; so metric
 *   models come back bit for bit and clean numbers stay clean (300 mm, not 299.99999999999994).
 */
import { generateCombinations } from '../design/combinations.js';
import { detectPlaneFrame } from './inference.js';
import {
  FREEDOMS, type Combination, type Model, type MemberLoadKind, type NetArea, type SectionDims, type SectionProps, type Six,
  type Support,
} from '../model/types.js';
import { factorToSI, unitOf, type Quantity } from '../units/index.js';
import { oneCombinationPerCase } from './combinations.js';
import type { Cell, RawTable } from './table.js';

/** One table as written: header row first. */
export interface WrittenTable {
  name: string;
  rows: Cell[][];
}

/** A column: its header and how a record gives its cell. */
interface Column<T> {
  name: string;
  /** numbers: the quantity that picks the bracketed unit (and the conversion) */
  quantity?: Quantity;
  /** a unit other than the system's (roll in degrees) */
  unit?: string;
  get: (r: T) => Cell | undefined;
}

/** The decimal written for an SI value so that the reader's `y * factor` gives it back exactly. */
export function writtenNumber(si: number, factor: number): number {
  if (factor === 1 || si === 0) return si;
  const y0 = si / factor;
  for (const p of [15, 16, 17]) {
    const y = Number(y0.toPrecision(p));
    if (y * factor === si) return y;
  }
  // no decimal of ≤ 17 digits converts back bit for bit: try the neighbours of y0
  const step = Math.abs(y0) * Number.EPSILON;
  for (const y of [y0 + step, y0 - step, y0 + 2 * step, y0 - 2 * step]) if (y * factor === si) return y;
  return y0;
}

function header<T>(c: Column<T>, units: Model['settings']['units']): string {
  if (c.unit) return `${c.name} [${c.unit}]`;
  if (!c.quantity || c.quantity === 'ratio' || c.quantity === 'text') return c.name;
  return `${c.name} [${unitOf(c.quantity, units)}]`;
}

function table<T>(name: string, columns: Column<T>[], records: readonly T[], units: Model['settings']['units']): WrittenTable {
  const factors = columns.map((c) => {
    const unit = c.unit ?? (c.quantity && c.quantity !== 'ratio' && c.quantity !== 'text' ? unitOf(c.quantity, units) : null);
    return unit ? factorToSI(unit, c.quantity ?? 'ratio') ?? 1 : 1;
  });
  const rows: Cell[][] = [columns.map((c) => header(c, units))];
  for (const r of records) {
    rows.push(columns.map((c, i) => {
      const v = c.get(r);
      if (v === undefined || v === null) return null;
      return typeof v === 'number' ? writtenNumber(v, factors[i]) : v;
    }));
  }
  return { name, rows };
}

const num = <T>(name: string, get: (r: T) => number | undefined, quantity?: Quantity): Column<T> => ({ name, quantity, get });
const text = <T>(name: string, get: (r: T) => string | undefined): Column<T> => ({ name, get });

const NET: Column<{ net?: NetArea }>[] = [
  num('An', (r) => r.net?.An, 'area'),
  num('U', (r) => r.net?.U),
  num('Ae', (r) => r.net?.Ae, 'area'),
];

/** Unit of w1/w2 by load kind, as the reader converts them (tables.md "member_loads"). */
const KIND_QUANTITY: Record<MemberLoadKind, Quantity> = {
  point: 'force', moment: 'moment', uniform: 'line_load', linear: 'line_load', temperature: 'temperature', temperature_gradient: 'temperature',
};

function settingsTable(model: Model, rule: Model['settings']['combinationRule']): WrittenTable {
  const s = model.settings;
  const pairs: [string, Cell][] = [
    ['title', s.title], ['units', s.units], ['vertical_axis', s.verticalAxis], ['design_code', s.designCode],
    ['combination_rule', rule], ['deflection_limit', s.deflectionLimit],
    ['gamma_m0', s.gammaM0], ['gamma_m1', s.gammaM1], ['gamma_m2', s.gammaM2],
    ['stations', s.stations], ['analysis', s.analysis], ['buckling_modes', s.bucklingModes], ['modes', s.modes],
    ['stability_warning', s.stabilityWarning ? 'on' : 'off'],
  ];
  return { name: 'settings', rows: [['key', 'value'], ...pairs.map(([k, v]) => [k, v])] };
}

const FIXED: Six<boolean> = [true, true, true, true, true, true];
const PINNED: Six<boolean> = [true, true, true, false, false, false];
const NONE: Six<boolean> = [false, false, false, false, false, false];

interface SupportRow { s: Support; type?: 'fixed' | 'pinned'; cells: (0 | 1 | undefined)[] }

/** Supports with the `type` shorthand and freedom cells only where they differ from it. */
function compactSupports(model: Model): SupportRow[] {
  const plane = model.inferred.planeFrame;
  return model.supports.map((s) => {
    // the smallest shorthand that covers every restrained freedom out of the inferred plane,
    // so the plane-frame inference reads the same (explicit cells there would show 3D intent)
    const out = plane ? outOfPlane(plane.normal) : [];
    const bases: [SupportRow['type'], Six<boolean>][] = [[undefined, NONE], ['pinned', PINNED], ['fixed', FIXED]];
    const fits = bases.filter(([, b]) => out.every((f) => !s.restrained[f] || b[f]));
    const [type, base] = fits.reduce((best, cand) => (diff(cand[1], s.restrained) < diff(best[1], s.restrained) ? cand : best), fits[0] ?? bases[0]);
    return { s, type, cells: s.restrained.map((r, i) => (r === base[i] ? undefined : r ? 1 : 0)) };
  });
}

function outOfPlane(normal: 'X' | 'Y' | 'Z'): number[] {
  return normal === 'Z' ? [2, 3, 4] : normal === 'X' ? [0, 4, 5] : [1, 3, 5];
}

function diff(a: Six<boolean>, b: Six<boolean>): number {
  return a.reduce((n, x, i) => n + (x === b[i] ? 0 : 1), 0);
}

function samePlane(a: Model['inferred']['planeFrame'], b: Model['inferred']['planeFrame']): boolean {
  return a === b || (a !== null && b !== null && a.plane === b.plane && a.normal === b.normal);
}

function supportsTable(model: Model): WrittenTable {
  let rows = compactSupports(model);
  const explicit = rows.map((r) => r.cells.map((c) => c !== undefined));
  if (!samePlane(detectPlaneFrame(model.nodes, model.supports, model.settings.verticalAxis, explicit), model.inferred.planeFrame)) {
    rows = model.supports.map((s) => ({ s, type: undefined, cells: s.restrained.map((r) => (r ? 1 : 0)) }));
  }
  const columns: Column<SupportRow>[] = [
    text('node', (r) => r.s.node),
    text('type', (r) => r.type),
    ...FREEDOMS.map((f, i): Column<SupportRow> => ({ name: f, get: (r) => r.cells[i] })),
    ...FREEDOMS.map((f, i) => num<SupportRow>(`k_${f}`, (r) => (r.s.springs[i] ? r.s.springs[i] : undefined), i < 3 ? 'spring_trans' : 'spring_rot')),
  ];
  return table('supports', columns, rows, model.settings.units);
}

const DIM_COLUMNS: (keyof SectionDims)[] = ['d', 'bf', 'tf', 'tw', 'r', 'b', 't', 'h', 'D'];
const PROP_QUANTITY: Record<keyof SectionProps, Quantity> = {
  A: 'area', I_major: 'inertia', I_minor: 'inertia', J: 'inertia', Cw: 'warping', S_major: 'modulus', S_minor: 'modulus',
  Z_major: 'modulus', Z_minor: 'modulus', Av_major: 'area', Av_minor: 'area', depth: 'section_dim',
};

function sectionsTable(model: Model): WrittenTable {
  const own = model.sections.filter((s) => !s.builtIn);
  // only the columns some row uses; `D` and `d` are one column for the reader (round shapes read it as D)
  const dims = DIM_COLUMNS.filter((k) => k !== 'D' && own.some((s) => s.dims[k] !== undefined));
  const round = own.some((s) => s.dims.D !== undefined);
  if (round && !dims.includes('d')) dims.unshift('d');
  const props = (Object.keys(PROP_QUANTITY) as (keyof SectionProps)[]).filter((p) => own.some((s) => s.given.includes(p)));
  const columns: Column<(typeof own)[number]>[] = [
    text('section', (s) => s.id),
    text('shape', (s) => s.shape),
    ...dims.map((k) => num<(typeof own)[number]>(k, (s) => (k === 'd' && s.dims.D !== undefined ? s.dims.D : s.dims[k]), 'section_dim')),
    ...props.map((p) => num<(typeof own)[number]>(p, (s) => (s.given.includes(p) ? s.props[p] : undefined), PROP_QUANTITY[p])),
    ...NET,
  ];
  return table('sections', columns, own, model.settings.units);
}

function materialsTable(model: Model): WrittenTable {
  const own = model.materials.filter((m) => !m.builtIn);
  type M = (typeof own)[number];
  const columns: Column<M>[] = [
    text('material', (m) => m.id),
    num('E', (m) => m.E, 'stress'),
    num('G', (m) => (m.G === m.E / (2 * (1 + m.nu)) ? undefined : m.G), 'stress'),
    num('nu', (m) => m.nu),
    num('fy', (m) => m.fy, 'stress'),
    num('fu', (m) => m.fu, 'stress'),
    num('density', (m) => m.density, 'density'),
    num('alpha', (m) => m.alpha, 'thermal_expansion'),
  ];
  return table('materials', columns, own, model.settings.units);
}

function membersTable(model: Model): WrittenTable {
  type M = Model['members'][number];
  const columns: Column<M>[] = [
    text('member', (m) => m.id), text('start', (m) => m.start), text('end', (m) => m.end),
    text('section', (m) => m.section), text('material', (m) => m.material), text('type', (m) => m.type),
    { name: 'roll', unit: 'deg', quantity: 'rotation', get: (m) => m.roll },
    text('release_start', (m) => m.releaseStart), text('release_end', (m) => m.releaseEnd),
    text('section_end', (m) => m.sectionEnd), text('group', (m) => m.group),
    num('k_major', (m) => m.kMajor), num('k_minor', (m) => m.kMinor),
    num('l_major', (m) => m.lMajor, 'length'), num('l_minor', (m) => m.lMinor, 'length'), num('lb', (m) => m.lb, 'length'),
    num('cb', (m) => m.cb), num('deflection_limit', (m) => m.deflectionLimit),
    ...NET,
  ];
  return table('members', columns, model.members, model.settings.units);
}

/** Member lengths as the reader computes them (a load's `b` equal to it is left blank). */
function lengths(model: Model): Map<string, number> {
  const nodes = new Map(model.nodes.map((n) => [n.id, n]));
  const out = new Map<string, number>();
  for (const m of model.members) {
    const a = nodes.get(m.start);
    const b = nodes.get(m.end);
    if (a && b) out.set(m.id, Math.hypot(a.x - b.x, a.y - b.y, a.z - b.z));
  }
  return out;
}

function memberLoadsTable(model: Model): WrittenTable {
  type L = Model['memberLoads'][number];
  const length = lengths(model);
  const units = model.settings.units;
  const thermal = (l: L) => l.kind === 'temperature' || l.kind === 'temperature_gradient';
  const concentrated = (l: L) => l.kind === 'point' || l.kind === 'moment';
  // w1/w2 take their unit from the kind: converted here with the system unit of that kind
  const w = (l: L, x: number) => writtenNumber(x, factorToSI(unitOf(KIND_QUANTITY[l.kind], units), KIND_QUANTITY[l.kind]) ?? 1);
  const columns: Column<L>[] = [
    text('case', (l) => l.case), text('member', (l) => l.member), text('kind', (l) => l.kind),
    text('direction', (l) => (thermal(l) ? undefined : l.direction)),
    num('a', (l) => (thermal(l) ? undefined : l.a), 'length'),
    num('b', (l) => (thermal(l) || concentrated(l) || l.b === length.get(l.member) ? undefined : l.b), 'length'),
    { name: 'w1', get: (l) => w(l, l.w1) },
    { name: 'w2', get: (l) => (l.kind === 'linear' || l.kind === 'temperature_gradient' ? w(l, l.w2) : undefined) },
  ];
  return table('member_loads', columns, model.memberLoads, units);
}

function sameCombinations(a: Combination[], b: Combination[]): boolean {
  const key = (c: Combination) => JSON.stringify([c.id, c.limitState, c.terms.map((t) => [t.case, t.factor])]);
  return a.length === b.length && a.every((c, i) => key(c) === key(b[i]));
}

/** The combination rule to write and whether the combinations need a table. */
function combinationPlan(model: Model): { rule: Model['settings']['combinationRule']; table: boolean } {
  const rule = model.settings.combinationRule;
  if (rule !== 'table') {
    return sameCombinations(model.combinations, generateCombinations(rule, model.cases)) ? { rule, table: false } : { rule: 'table', table: true };
  }
  const perCase = model.combinations.every((c) => c.generated) && sameCombinations(model.combinations, oneCombinationPerCase(model.cases));
  return { rule, table: !perCase };
}

/**
 * The model as the importer's tables, in the contract's order. Core tables are always
 * written (header only when empty); optional ones (combinations, vehicles, lanes,
 * moving_loads, result_points) only when the model has rows for them.
 */
export function modelTables(model: Model): WrittenTable[] {
  const units = model.settings.units;
  const plan = combinationPlan(model);
  type N = Model['nodes'][number];
  type C = Model['cases'][number];
  type NL = Model['nodeLoads'][number];
  type ST = Model['settlements'][number];
  type CT = { id: string; limitState: string; case: string; factor: number };
  type V = Model['vehicles'][number];
  type LN = Model['lanes'][number];
  type ML = Model['movingLoads'][number];
  type RP = Model['resultPoints'][number];
  const out: WrittenTable[] = [
    settingsTable(model, plan.rule),
    table<N>('nodes', [text('node', (n) => n.id), num('x', (n) => n.x, 'length'), num('y', (n) => n.y, 'length'), num('z', (n) => n.z, 'length')], model.nodes, units),
    supportsTable(model),
    materialsTable(model),
    sectionsTable(model),
    membersTable(model),
    table('cases', [
      text('case', (c: C) => c.id), text('category', (c: C) => c.category), text('title', (c: C) => c.title || undefined),
      num('self_weight', (c: C) => c.selfWeight), text('mass', (c: C) => (c.mass ? 'yes' : 'no')),
    ], model.cases, units),
    table('node_loads', [
      text('case', (l: NL) => l.case), text('node', (l: NL) => l.node),
      ...(['fx', 'fy', 'fz', 'mx', 'my', 'mz'] as const).map((k, i) => num<NL>(k, (l) => l.values[i], i < 3 ? 'force' : 'moment')),
    ], model.nodeLoads, units),
    memberLoadsTable(model),
    table('settlements', [
      text('case', (s: ST) => s.case), text('node', (s: ST) => s.node),
      ...FREEDOMS.map((f, i) => num<ST>(f, (s) => s.values[i] ?? undefined, i < 3 ? 'length' : 'rotation')),
    ], model.settlements, units),
  ];
  if (plan.table) {
    const terms: CT[] = model.combinations.flatMap((c) => c.terms.map((t) => ({ id: c.id, limitState: c.limitState, case: t.case, factor: t.factor })));
    out.push(table('combinations', [
      text('combination', (t: CT) => t.id), text('limit_state', (t: CT) => t.limitState), text('case', (t: CT) => t.case), num('factor', (t: CT) => t.factor),
    ], terms, units));
  }
  if (model.vehicles.length) {
    out.push(table('vehicles', [text('vehicle', (v: V) => v.vehicle), text('axle', (v: V) => v.axle), num('offset', (v: V) => v.offset, 'length'), num('load', (v: V) => v.load, 'force')], model.vehicles, units));
  }
  if (model.lanes.length) out.push(table('lanes', [text('lane', (l: LN) => l.lane), num('seq', (l: LN) => l.seq), text('member', (l: LN) => l.member)], model.lanes, units));
  if (model.movingLoads.length) {
    out.push(table('moving_loads', [
      text('case', (m: ML) => m.case), text('vehicle', (m: ML) => m.vehicle), text('lane', (m: ML) => m.lane),
      num('step', (m: ML) => m.step, 'length'), text('direction', (m: ML) => m.direction),
    ], model.movingLoads, units));
  }
  if (model.resultPoints.length) out.push(table('result_points', [text('member', (p: RP) => p.member), num('x', (p: RP) => p.x, 'length')], model.resultPoints, units));
  return out;
}

/** The written tables as the reader's raw tables (what an XLSX with number cells gives). */
export function asRawTables(tables: WrittenTable[]): RawTable[] {
  return tables.map((t) => ({ name: t.name, rows: t.rows, rowNumbers: t.rows.map((_, i) => i + 1), source: 'xlsx' }));
}

/** One table as CSV text (comma separated; cells with a comma, quote or line break quoted). */
export function tableCsv(t: WrittenTable): string {
  const cell = (c: Cell): string => {
    if (c === null || c === undefined) return '';
    const s = typeof c === 'number' ? String(c) : String(c);
    return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
  };
  return t.rows.map((r) => r.map(cell).join(',')).join('\n') + '\n';
}
