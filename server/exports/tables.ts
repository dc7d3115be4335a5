/** The five export tables of a run, built from its stored results (display units). */
import type { CheckRecord, MemberUtilisation } from '../../shared/design/types.js';
import { CHECK_FAMILIES } from '../../shared/design/types.js';
import type { Model, UnitSystem } from '../../shared/model/types.js';
import type { LoadingInfo } from '../../shared/schemas/runs.js';
import { fromSI, unitOf, type Quantity } from '../../shared/units/index.js';
import type { ExportCell, ExportTable } from './table.js';

const NUM = '0.000###';
const RATIO = '0.000';

const head = (name: string, q: Quantity, units: UnitSystem) => `${name} [${unitOf(q, units)}]`;
const conv = (v: number | null | undefined, q: Quantity, units: UnitSystem): ExportCell =>
  v === null || v === undefined || !Number.isFinite(v) ? null : fromSI(v, q, units);

export const FAMILY_TITLES: Record<string, string> = {
  tension: 'tension', compression: 'compression', bending_major: 'bending major', bending_minor: 'bending minor',
  shear_major: 'shear major', shear_minor: 'shear minor', combined: 'combined', torsion: 'torsion',
  deflection: 'deflection', slenderness: 'slenderness',
};

export function utilisationTable(members: MemberUtilisation[], units: UnitSystem): ExportTable {
  const families = CHECK_FAMILIES.filter((f) => members.some((m) => f in m.families));
  return {
    title: 'Utilisation schedule',
    columns: [
      { header: 'member', width: 12 }, { header: 'group', width: 14 }, { header: 'section', width: 16 }, { header: 'material', width: 12 },
      { header: head('length', 'length', units), numFmt: NUM, width: 11 },
      { header: 'ratio', numFmt: RATIO, width: 9, ratio: true },
      { header: 'check', width: 24 }, { header: 'clause', width: 12 }, { header: 'combination', width: 14 }, { header: 'status', width: 12 },
      ...families.map((f) => ({ header: f, numFmt: RATIO, width: 11 })),
    ],
    rows: members.map((m) => [
      m.member, m.group, m.section, m.material, conv(m.length, 'length', units), m.ratio, m.check, m.clause, m.combination, m.status,
      ...families.map((f) => m.families[f] ?? null),
    ]),
    statuses: members.map((m) => m.status),
  };
}

export function checksTable(records: CheckRecord[], units: UnitSystem): ExportTable {
  return {
    title: 'Detailed checks',
    columns: [
      { header: 'member', width: 12 }, { header: 'combination', width: 14 }, { header: 'check', width: 28 }, { header: 'clause', width: 12 },
      { header: 'demand', numFmt: NUM, width: 12 }, { header: 'capacity', numFmt: NUM, width: 12 }, { header: 'unit', width: 8 },
      { header: 'ratio', numFmt: RATIO, width: 9, ratio: true }, { header: 'status', width: 12 }, { header: 'note', width: 40 },
    ],
    rows: records.map((r) => [
      r.member, r.combination, r.title, r.clause,
      conv(r.demand, r.quantity, units), conv(r.capacity, r.quantity, units), unitOf(r.quantity, units),
      r.ratio, r.status, r.note ?? '',
    ]),
    statuses: records.map((r) => r.status),
  };
}

export function displacementsTable(model: Model, loadings: LoadingInfo[], disp: Float64Array, units: UnitSystem, only?: number[]): ExportTable {
  const n = model.nodes.length;
  const rows: ExportCell[][] = [];
  for (const l of only ?? loadings.map((_, i) => i)) {
    for (let i = 0; i < n; i++) {
      const o = (l * n + i) * 6;
      rows.push([
        loadings[l].id, model.nodes[i].id,
        conv(disp[o], 'displacement', units), conv(disp[o + 1], 'displacement', units), conv(disp[o + 2], 'displacement', units),
        disp[o + 3], disp[o + 4], disp[o + 5],
      ]);
    }
  }
  return {
    title: 'Displacements',
    columns: [
      { header: 'loading', width: 14 }, { header: 'node', width: 10 },
      ...['ux', 'uy', 'uz'].map((c) => ({ header: head(c, 'displacement', units), numFmt: NUM, width: 12 })),
      ...['rx', 'ry', 'rz'].map((c) => ({ header: head(c, 'rotation', units), numFmt: '0.000000E+00', width: 12 })),
    ],
    rows,
  };
}

export function reactionsTable(model: Model, loadings: LoadingInfo[], react: Float64Array, units: UnitSystem, only?: number[]): ExportTable {
  const n = model.nodes.length;
  const nodeIndex = new Map(model.nodes.map((x, i) => [x.id, i]));
  const supported = [...new Set(model.supports.map((s) => nodeIndex.get(s.node)).filter((i): i is number => i !== undefined))].sort((a, b) => a - b);
  const rows: ExportCell[][] = [];
  for (const l of only ?? loadings.map((_, i) => i)) {
    for (const i of supported) {
      const o = (l * n + i) * 6;
      rows.push([
        loadings[l].id, model.nodes[i].id,
        conv(react[o], 'force', units), conv(react[o + 1], 'force', units), conv(react[o + 2], 'force', units),
        conv(react[o + 3], 'moment', units), conv(react[o + 4], 'moment', units), conv(react[o + 5], 'moment', units),
      ]);
    }
  }
  return {
    title: 'Reactions',
    columns: [
      { header: 'loading', width: 14 }, { header: 'node', width: 10 },
      ...['fx', 'fy', 'fz'].map((c) => ({ header: head(c, 'force', units), numFmt: NUM, width: 12 })),
      ...['mx', 'my', 'mz'].map((c) => ({ header: head(c, 'moment', units), numFmt: NUM, width: 12 })),
    ],
    rows,
  };
}

/** Member forces from the worker's flattened blocks (loading-major, member-minor). */
export function forcesTable(
  model: Model, loadings: LoadingInfo[], only: number[], counts: Int32Array, data: Float64Array, units: UnitSystem,
): ExportTable {
  const nm = model.members.length;
  const rows: ExportCell[][] = [];
  const q: Quantity[] = ['length', 'force', 'force', 'force', 'moment', 'moment', 'moment', 'displacement', 'displacement'];
  let k = 0;
  only.forEach((l, li) => {
    for (let m = 0; m < nm; m++) {
      const c = counts[li * nm + m];
      for (let s = 0; s < c; s++) {
        const row: ExportCell[] = [loadings[l].id, model.members[m].id];
        for (let j = 0; j < 9; j++) row.push(conv(data[k++], q[j], units));
        rows.push(row);
      }
    }
  });
  const names = ['x', 'N', 'V_major', 'V_minor', 'T', 'M_major', 'M_minor', 'd_major', 'd_minor'];
  return {
    title: 'Member forces',
    columns: [
      { header: 'loading', width: 14 }, { header: 'member', width: 10 },
      ...names.map((c, j) => ({ header: head(c, q[j], units), numFmt: NUM, width: 12 })),
    ],
    rows,
  };
}
