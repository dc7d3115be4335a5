/**
 * The blank import workbook: one sheet per table with its headers (dimensional columns
 * carry the unit system's default unit in brackets) and a sheet of instructions.
 */
import ExcelJS from 'exceljs';
import type { UnitSystem } from '../../shared/model/types.js';
import { COMBINATIONS_LONG, TABLES } from '../../shared/reader/specs.js';
import type { ColumnSpec } from '../../shared/reader/table.js';
import { unitOf } from '../../shared/units/index.js';

/** Column names as users write them (the reader matches them case-insensitively). */
const DISPLAY: Record<string, string> = {
  e: 'E', g: 'G', a: 'A', i_major: 'I_major', i_minor: 'I_minor', j: 'J', cw: 'Cw', s_major: 'S_major', s_minor: 'S_minor',
  z_major: 'Z_major', z_minor: 'Z_minor', av_major: 'Av_major', av_minor: 'Av_minor', n: 'N', an: 'An', u: 'U', ae: 'Ae',
};

const ORDER = ['settings', 'materials', 'sections', 'nodes', 'supports', 'members', 'cases', 'node_loads', 'member_loads', 'settlements', 'combinations', 'result_points'];

export function templateHeader(c: ColumnSpec, units: UnitSystem): string {
  const name = DISPLAY[c.name] ?? c.name;
  if (c.kind !== 'number' || c.noUnit) return name;
  if (c.defaultUnit) return `${name} [${c.defaultUnit}]`;
  if (!c.quantity || c.quantity === 'ratio' || c.quantity === 'text') return name;
  return `${name} [${unitOf(c.quantity, units)}]`;
}

const INSTRUCTIONS = (units: UnitSystem) => [
  'How to fill in this workbook',
  '',
  'Each sheet is one table of the model; the sheet name is the table name. Leave out sheets you do not need.',
  'The first row of each sheet holds the column names. Put one item per row below it; blank rows are skipped.',
  `Units: this template uses the "${units}" unit system. A unit in square brackets after a column name sets the unit of`,
  'that column (for example "x [mm]" or "fy [ksi]"); change it if your numbers are in another unit.',
  'settings: one key per row (title, units, vertical_axis, design_code, combination_rule, deflection_limit, gamma_m0 …,',
  'stations, analysis, buckling_modes, modes, stability_warning).',
  'result_points: optional extra result positions, one row per member and distance x from its start node.',
  'Identifiers (node, member, section, material, case, combination) are text and must be unique in their table.',
  'A member may name a catalogue section (for example IPE300 or W12X26) or a built-in material (for example S355 or A992)',
  'without defining it in the sections or materials sheet.',
  'combinations: one row per case in a combination (combination, case, factor, limit_state = strength or service).',
  'member_loads: kind is point, moment, uniform, linear, temperature or temperature_gradient; w1 and w2 take the unit of',
  'the kind in the model unit system (force, moment, line load or temperature change).',
  'Upload the workbook (or the sheets saved as one .csv file per table, named after the table) on the import page;',
  'the preview lists every error and warning with its sheet, row and column before anything is saved.',
  '',
  'Results are for checking by a competent engineer; local codes, national annexes and licensed practice govern.',
];

export async function templateWorkbook(units: UnitSystem): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Trestle';
  const help = wb.addWorksheet('instructions');
  INSTRUCTIONS(units).forEach((line, i) => {
    const row = help.addRow([line]);
    if (i === 0) row.font = { bold: true, size: 14 };
  });
  help.getColumn(1).width = 120;
  for (const name of ORDER) {
    const spec = name === 'combinations' ? COMBINATIONS_LONG : TABLES[name];
    if (!spec) continue;
    const ws = wb.addWorksheet(name);
    const row = ws.addRow(spec.columns.map((c) => templateHeader(c, units)));
    row.font = { bold: true };
    spec.columns.forEach((_, i) => (ws.getColumn(i + 1).width = 14));
    ws.views = [{ state: 'frozen', ySplit: 1 }];
    if (name === 'settings') {
      ws.addRow(['units', units]);
      ws.addRow(['design_code', units === 'us' ? 'aisc360-lrfd' : 'en1993-1-1']);
    }
  }
  return Buffer.from(await wb.xlsx.writeBuffer());
}
