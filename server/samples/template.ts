/**
 * The blank import workbook: one sheet per table with its headers (dimensional columns
 * carry the unit system's default unit in brackets), a note on each header cell that could
 * be misread, and the instructions as a note on the settings sheet.
 */
import ExcelJS from 'exceljs';
import type { UnitSystem } from '../../shared/model/types.js';
import { COMBINATIONS_LONG, TABLES } from '../../shared/reader/specs.js';
import type { ColumnSpec } from '../../shared/reader/table.js';
import { unitOf } from '../../shared/units/index.js';

/**
 * Column names as tables.md writes them (the reader matches them case-insensitively). Only
 * for the tables of sections, materials and members: member_loads' `a` (a position along the
 * member) stays lower case so it is never read as the area `A`.
 */
const DISPLAY_TABLES = new Set(['materials', 'sections', 'members']);
const DISPLAY: Record<string, string> = {
  e: 'E', g: 'G', a: 'A', i_major: 'I_major', i_minor: 'I_minor', j: 'J', cw: 'Cw', s_major: 'S_major', s_minor: 'S_minor',
  z_major: 'Z_major', z_minor: 'Z_minor', av_major: 'Av_major', av_minor: 'Av_minor', n: 'N', an: 'An', u: 'U', ae: 'Ae',
};

const ORDER = ['settings', 'materials', 'sections', 'nodes', 'supports', 'members', 'cases', 'node_loads', 'member_loads', 'settlements', 'combinations', 'result_points'];

export function templateHeader(c: ColumnSpec, units: UnitSystem, table = 'sections'): string {
  const name = (DISPLAY_TABLES.has(table) ? DISPLAY[c.name] : undefined) ?? c.name;
  if (c.kind !== 'number' || c.noUnit) return name;
  if (c.defaultUnit) return `${name} [${c.defaultUnit}]`;
  if (!c.quantity || c.quantity === 'ratio' || c.quantity === 'text') return name;
  return `${name} [${unitOf(c.quantity, units)}]`;
}

/** What a quantity is, in words, for the header notes. */
const QUANTITY_WORDS: Partial<Record<string, string>> = {
  length: 'a length', section_dim: 'a section dimension', area: 'an area', inertia: 'a second moment of area or torsion constant',
  modulus: 'a section modulus', warping: 'a warping constant', force: 'a force', moment: 'a moment', line_load: 'a load per unit length',
  stress: 'a stress or modulus', density: 'a mass density', temperature: 'a change of temperature', thermal_expansion: 'a coefficient of thermal expansion',
  spring_trans: 'a translational spring stiffness', spring_rot: 'a rotational spring stiffness', rotation: 'a rotation',
};

/** Columns whose name alone could be misread (tables.md gives the meaning). */
const COLUMN_NOTES: Record<string, Record<string, string>> = {
  member_loads: {
    a: 'a: distance along the member from its start node where the load acts (point, moment) or starts (uniform, linear). A length, not an area (the area of a section is A on the sections sheet). Blank = 0.',
    b: 'b: distance along the member from its start node where a uniform or linear load ends. A length. Blank = the member length.',
    w1: 'w1: the load value, in the unit system\'s unit for the kind (force, moment, load per unit length or temperature change). No unit in brackets.',
    w2: 'w2: the value at b of a linear load (or at the -z face of a temperature gradient). No unit in brackets.',
  },
  sections: {
    a: 'A: cross-section area.',
  },
};

/** The note on a header cell: what the column holds and how to change its unit. */
export function headerNote(table: string, c: ColumnSpec, units: UnitSystem): string | undefined {
  const own = COLUMN_NOTES[table]?.[c.name];
  const header = templateHeader(c, units, table);
  const unit = /\[(.*)\]$/.exec(header)?.[1];
  const what = c.quantity && QUANTITY_WORDS[c.quantity];
  const other = unit === 'm' ? ' (e.g. [mm])' : unit === 'ft' ? ' (e.g. [in])' : '';
  const unitLine = unit && what ? `${what} in ${unit}; write another unit in the square brackets if your numbers are in one${other}.` : undefined;
  const text = [own, unitLine].filter(Boolean).join(' ');
  return text || undefined;
}

const INSTRUCTIONS = (units: UnitSystem) => [
  'How to fill in this workbook',
  '',
  'Each sheet is one table of the model; the sheet name is the table name. Leave out sheets you do not need.',
  'The first row of each sheet holds the column names (hover a name for its note). Put one item per row below it; blank rows are skipped.',
  `Units: this template uses the "${units}" unit system. A unit in square brackets after a column name sets the unit of`,
  'that column (for example "x [mm]" or "fy [ksi]"); change it if your numbers are in another unit. Units go in square',
  'brackets only: "fy (MPa)" is not read.',
  'settings: one key per row (title, units, vertical_axis, design_code, combination_rule, deflection_limit, gamma_m0 …,',
  'stations, analysis, buckling_modes, modes, stability_warning).',
  'result_points: optional extra result positions, one row per member and distance x from its start node.',
  'Identifiers (node, member, section, material, case, combination) are text and must be unique in their table.',
  'A member may name a catalogue section (for example IPE300 or W12X26) or a built-in material (for example S355 or A992)',
  'without defining it in the sections or materials sheet.',
  'combinations: one row per case in a combination (combination, case, factor, limit_state = strength or service).',
  'member_loads: kind is point, moment, uniform, linear, temperature or temperature_gradient; a and b are distances along',
  'the member from its start node (lengths, not areas); w1 and w2 take the unit of the kind in the model unit system',
  '(force, moment, line load or temperature change).',
  'Upload the workbook (or the sheets saved as one .csv file per table, named after the table) on the import page;',
  'the preview lists every error and warning with its sheet, row and column before anything is saved.',
  '',
  'Results are for checking by a competent engineer; local codes, national annexes and licensed practice govern.',
];

/**
 * The instructions are a note on the first header cell of the settings sheet and the
 * workbook's description, not a sheet of their own: every sheet of an import is a table, and
 * an unknown one is a warning (tables.md), so the blank workbook imports without warnings.
 */
export async function templateWorkbook(units: UnitSystem): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Trestle';
  wb.title = 'Trestle model tables';
  wb.description = INSTRUCTIONS(units).join('\n');
  for (const name of ORDER) {
    const spec = name === 'combinations' ? COMBINATIONS_LONG : TABLES[name];
    if (!spec) continue;
    const ws = wb.addWorksheet(name);
    const row = ws.addRow(spec.columns.map((c) => templateHeader(c, units, name)));
    row.font = { bold: true };
    spec.columns.forEach((c, i) => {
      ws.getColumn(i + 1).width = 14;
      const note = headerNote(name, c, units);
      if (note) row.getCell(i + 1).note = note;
    });
    ws.views = [{ state: 'frozen', ySplit: 1 }];
    if (name === 'settings') {
      row.getCell(1).note = INSTRUCTIONS(units).join('\n');
      ws.addRow(['units', units]);
      ws.addRow(['design_code', units === 'us' ? 'aisc360-lrfd' : 'en1993-1-1']);
    }
  }
  return Buffer.from(await wb.xlsx.writeBuffer());
}
