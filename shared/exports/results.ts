/**
 * Result tables as rows (tables.md "Results exports"): displacements, reactions, member
 * forces, and — when design results exist — the utilisation schedule and the detailed
 * checks. Headers carry their unit in brackets in the model's unit system; cells hold
 * numbers converted to that system (formatting happens in the serialisers).
 */
import type { AnalysisResult } from '../engine/types.js';
import { CHECK_FAMILIES, type CheckFamily, type CheckInput, type CheckRecord, type MemberUtilisation } from '../design/types.js';
import { clean, noiseFloor, type NoiseFloor } from '../design/noise.js';
import { formatExportNumber } from './csv.js';
import type { Model, UnitSystem } from '../model/types.js';
import { fromSI, unitOf, type Quantity } from '../units/index.js';

export type ResultCell = string | number | null;

export interface ResultTable {
  /** file / sheet name without extension: `displacements` */
  name: string;
  header: string[];
  rows: ResultCell[][];
}

/** What the design checks hand over (shared/design: checkModel). */
export interface DesignResultLike {
  members: MemberUtilisation[];
  records: CheckRecord[];
}

/** `name [unit]` for a quantity in a unit system. */
export function headerWithUnit(name: string, quantity: Quantity, system: UnitSystem): string {
  const u = unitOf(quantity, system);
  return u && u !== '-' ? `${name} [${u}]` : name;
}

const NODE_DISP: [string, Quantity][] = [['ux', 'displacement'], ['uy', 'displacement'], ['uz', 'displacement'], ['rx', 'rotation'], ['ry', 'rotation'], ['rz', 'rotation']];
const NODE_REACT: [string, Quantity][] = [['fx', 'force'], ['fy', 'force'], ['fz', 'force'], ['mx', 'moment'], ['my', 'moment'], ['mz', 'moment']];

/**
 * Moving loads: when some loading is an envelope (issue 7), an `envelope` column after
 * `loading` holds `max` or `min` on its rows and stays blank on the others.
 */
function envelopeColumn(analysis: AnalysisResult): boolean {
  return analysis.loadings.some((l) => l.envelope !== undefined);
}

/** Noise (design/noise.ts) as zero: forces against the force floor, moments against the moment floor. */
function denoised(v: number, q: Quantity, floor: NoiseFloor | null): number {
  if (!floor) return v;
  return q === 'force' ? clean(v, floor.force) : q === 'moment' ? clean(v, floor.moment) : v;
}

function nodeTable(name: string, model: Model, analysis: AnalysisResult, cols: [string, Quantity][], values: (l: number) => Float64Array, nodes: number[], floor: NoiseFloor | null = null): ResultTable {
  const sys = model.settings.units;
  const env = envelopeColumn(analysis);
  const header = ['loading', ...(env ? ['envelope'] : []), 'node', ...cols.map(([c, q]) => headerWithUnit(c, q, sys))];
  const rows: ResultCell[][] = [];
  analysis.loadings.forEach((loading, l) => {
    const v = values(l);
    const lead: ResultCell[] = env ? [loading.id, loading.envelope ?? ''] : [loading.id];
    for (const i of nodes) {
      rows.push([...lead, analysis.nodeIds[i], ...cols.map(([, q], k) => fromSI(denoised(v[i * 6 + k], q, floor), q, sys))]);
    }
  });
  return { name, header, rows };
}

/** Node displacements and rotations for every loading. */
export function displacementTable(model: Model, analysis: AnalysisResult): ResultTable {
  const all = analysis.nodeIds.map((_, i) => i);
  return nodeTable('displacements', model, analysis, NODE_DISP, (l) => analysis.displacements(l), all);
}

/**
 * Support reactions (supported nodes only) for every loading; numerical noise written as 0
 * (floor over the analysis' loadings unless given, e.g. over every loading of a run when
 * only one is exported).
 */
export function reactionTable(model: Model, analysis: AnalysisResult, floor: NoiseFloor = noiseFloor(model, analysis)): ResultTable {
  return nodeTable('reactions', model, analysis, NODE_REACT, (l) => analysis.reactions(l), [...analysis.supportedNodes].sort((a, b) => a - b), floor);
}

const FORCE_COLS: [keyof Omit<import('../engine/types.js').StationForces, 'x'>, Quantity][] = [
  ['N', 'force'], ['V_major', 'force'], ['V_minor', 'force'], ['T', 'moment'], ['M_major', 'moment'], ['M_minor', 'moment'],
  ['d_major', 'displacement'], ['d_minor', 'displacement'],
];

/** Internal forces and local deflections at every station of every member, every loading; numerical noise written as 0. */
export function memberForceTable(model: Model, analysis: AnalysisResult): ResultTable {
  const sys = model.settings.units;
  const floor = noiseFloor(model, analysis);
  const env = envelopeColumn(analysis);
  const header = ['loading', ...(env ? ['envelope'] : []), 'member', headerWithUnit('x', 'length', sys), ...FORCE_COLS.map(([c, q]) => headerWithUnit(c, q, sys))];
  // Member by member (the engine caches one member's case stations), rows kept grouped by loading.
  const leads: ResultCell[][] = analysis.loadings.map((loading) => (env ? [loading.id, loading.envelope ?? ''] : [loading.id]));
  const byLoading: ResultCell[][][] = analysis.loadings.map(() => []);
  analysis.memberIds.forEach((id, m) => {
    for (let l = 0; l < leads.length; l++) {
      const f = analysis.memberForces(m, l);
      const out = byLoading[l];
      for (let s = 0; s < f.x.length; s++) {
        out.push([...leads[l], id, fromSI(f.x[s], 'length', sys), ...FORCE_COLS.map(([c, q]) => fromSI(denoised(f[c][s], q, floor), q, sys))]);
      }
    }
  });
  return { name: 'member_forces', header, rows: byLoading.flat() };
}

/** Families that appear in the schedule, in the contract's order. */
function familiesIn(members: MemberUtilisation[]): CheckFamily[] {
  return CHECK_FAMILIES.filter((f) => members.some((m) => f in m.families));
}

/** The utilisation schedule: one row per member, a ratio column per check family. */
export function utilisationTable(model: Model, design: DesignResultLike): ResultTable {
  const sys = model.settings.units;
  const fams = familiesIn(design.members);
  // moving loads: where the vehicle's leading axle stood when the governing check governed
  const moving = design.members.some((m) => m.vehiclePosition !== undefined);
  const header = ['member', 'group', 'section', 'material', headerWithUnit('length', 'length', sys), 'ratio', 'check', 'clause', 'combination', 'status', ...fams,
    ...(moving ? [headerWithUnit('vehicle_position', 'length', sys)] : [])];
  const rows = design.members.map((m): ResultCell[] => [
    m.member, m.group, m.section, m.material, fromSI(m.length, 'length', sys), m.ratio, m.check, m.clause, m.combination, m.status,
    ...fams.map((f) => m.families[f] ?? null),
    ...(moving ? [m.vehiclePosition === undefined ? null : fromSI(m.vehiclePosition, 'length', sys)] : []),
  ]);
  return { name: 'utilisation', header, rows };
}

/**
 * The `details` cell: every input and intermediate of a record as `symbol=value unit`
 * separated by `; `, values in the model's unit system (at least 7 significant digits),
 * then the position `x` where the demand governs. A `;` inside a text value is written
 * as `,` so the separator stays unambiguous.
 */
export function detailsOf(inputs: CheckInput[], system: UnitSystem, x: number | null = null): string {
  const parts = inputs.map((i) => {
    if (typeof i.value === 'string') return `${i.symbol}=${i.value.replace(/;/g, ',')}`;
    const u = unitOf(i.quantity, system);
    const v = fromSI(i.value, i.quantity, system);
    return `${i.symbol}=${Number.isFinite(v) ? formatExportNumber(v) : String(v)}${u && u !== '-' ? ` ${u}` : ''}`;
  });
  if (x !== null) parts.push(`x=${formatExportNumber(fromSI(x, 'length', system))} ${unitOf('length', system)}`);
  return parts.join('; ');
}

/**
 * Every check record. Demand and capacity hold values of different kinds row by row, so
 * their unit is given in a `unit` column after the contract's columns, then `details`
 * (detailsOf). A check made about each axis (AISC E3, EN 6.3.1: record.axes) is written
 * as one row per axis, each with its own capacity, ratio, status and details; the largest
 * of their ratios is the record's.
 */
export function checksTable(model: Model, design: DesignResultLike): ResultTable {
  const sys = model.settings.units;
  const moving = design.records.some((r) => r.envelope !== undefined);
  const header = ['member', 'combination', 'check', 'clause', 'demand', 'capacity', 'ratio', 'status', 'note', 'unit', 'details',
    ...(moving ? ['envelope', headerWithUnit('vehicle_position', 'length', sys)] : [])];
  const rows: ResultCell[][] = [];
  for (const r of design.records) {
    const unit = r.quantity === 'ratio' || r.quantity === 'text' ? '' : unitOf(r.quantity, sys);
    const tail = moving ? [r.envelope ?? '', r.vehiclePosition === undefined ? null : fromSI(r.vehiclePosition, 'length', sys)] : [];
    const row = (title: string, capacity: number | null, ratio: number | null, status: string, details: string): ResultCell[] => [
      r.member, r.combination, title, r.clause,
      r.demand === null ? null : fromSI(r.demand, r.quantity, sys),
      capacity === null ? null : fromSI(capacity, r.quantity, sys),
      ratio, status, r.note ?? '', unit === '-' ? '' : unit, details, ...tail,
    ];
    if (r.axes && r.axes.length && r.demand !== null && r.status !== 'not checked') {
      for (const a of r.axes) {
        const ratio = r.demand === 0 ? 0 : a.capacity > 0 ? r.demand / a.capacity : Infinity;
        rows.push(row(`${r.title}, ${a.axis} axis`, a.capacity, ratio, ratio <= 1 ? 'pass' : 'fail', detailsOf(a.inputs, sys, r.x)));
      }
    } else {
      rows.push(row(r.title, r.capacity, r.ratio, r.status, detailsOf(r.inputs, sys, r.x)));
    }
  }
  return { name: 'checks', header, rows };
}

/**
 * Moving loads: per moving load and member, the absolute maximum and minimum of each force
 * under the vehicle alone (unfactored) over the member and every vehicle position, with x and
 * where the leading axle stood (shared/moving memberExtremes). Forces that stay zero are left
 * out. Undefined without moving loads.
 */
export function movingExtremesTable(model: Model, analysis: AnalysisResult): ResultTable | undefined {
  const mv = analysis.moving;
  if (!mv) return undefined;
  const sys = model.settings.units;
  const header = ['case', 'vehicle', 'lane', 'member', 'force', 'extreme', 'unit', 'value', headerWithUnit('x', 'length', sys), 'direction', headerWithUnit('vehicle_position', 'length', sys)];
  const rows: ResultCell[][] = [];
  model.movingLoads.forEach((ml, j) => {
    analysis.memberIds.forEach((id, mi) => {
      const ex = mv.memberExtremes(j, mi);
      for (const key of ['N', 'V_major', 'V_minor', 'T', 'M_major', 'M_minor'] as const) {
        const q: Quantity = key === 'T' || key.startsWith('M_') ? 'moment' : 'force';
        if (ex[key].max.value === 0 && ex[key].min.value === 0) continue;
        for (const side of ['max', 'min'] as const) {
          const e = ex[key][side];
          rows.push([ml.case, ml.vehicle, ml.lane, id, key, side, unitOf(q, sys), fromSI(e.value, q, sys), fromSI(e.x, 'length', sys),
            e.at?.direction ?? '', e.at ? fromSI(e.at.lead, 'length', sys) : null]);
        }
      }
    });
  });
  return { name: 'moving_extremes', header, rows };
}
