/**
 * An export table as a formatted workbook: a header block (project, model, version, run,
 * date, code, analysis method, units, the settings that apply to the code, who ran and who
 * approved the run and when, the software version, status counts, the caution), then the table with a frozen header row,
 * an autofilter, number formats and fills for ratio bands.
 */
import { PassThrough, type Writable } from 'node:stream';
import ExcelJS from 'exceljs';
import { ratioBand, type RatioBand } from '../../shared/results/member-rows.js';
import { CHECK_FAMILIES, type CheckStatus } from '../../shared/design/types.js';
import { neutraliseText, type ResultTable } from '../../shared/exports/index.js';
import type { DesignCode, UnitSystem } from '../../shared/model/types.js';
import { DESIGN_CODE_NAMES, UNIT_SYSTEM_NAMES } from '../../shared/reader/settings-summary.js';

export const CAUTION =
  'Results are for checking by a competent engineer. The design checks implement the cited clauses with the ' +
  'assumptions and limits stated in each record; members reported as "not checked" are not passing. Local codes, ' +
  'national annexes and licensed practice govern.';

/** Our own palette for the ratio bands (ARGB). */
export const BAND_FILLS: Record<RatioBand, string> = {
  ok: 'FFDCEFE0',
  near: 'FFFBE7B5',
  over: 'FFF4C7C3',
  unchecked: 'FFE3E3EA',
};

export interface HeaderBlock {
  project: string;
  model: string;
  version: number;
  run: number;
  date: string;
  code: string;
  units: string;
  counts: { pass: number; fail: number; notChecked: number };
  reviewStatus: string;
  /** the analysis method in words (first or second order, the code's method) */
  method?: string;
  /** settings that apply to the code, as [label, value] (shared/reader/settings-summary.ts) */
  settings?: [string, string][];
  /** who started the run and when */
  ranBy?: string;
  /** "name, date" of the approval, or why there is none */
  approved?: string;
  /** `Trestle <package.json version>` */
  software?: string;
}

const TITLES: Record<string, string> = {
  utilisation: 'Utilisation schedule', checks: 'Detailed checks', displacements: 'Displacements', reactions: 'Reactions',
  member_forces: 'Member forces', stability: 'Elastic critical load factors', modes: 'Natural frequencies',
};
const RATIO_COLUMNS = new Set<string>(['ratio', ...CHECK_FAMILIES]);
const neutralise = neutraliseText;

/** Where the streaming workbook writer sends its bytes (a file, a response, a worker's port). */
export type ByteSink = Writable;

/**
 * The formatted workbook written row by row with exceljs' streaming WorkbookWriter: every row
 * is committed as it is written, so memory holds one row of cells plus the zip buffers.
 */
export async function writeXlsx(table: ResultTable, header: HeaderBlock, stream: ByteSink): Promise<number> {
  const title = TITLES[table.name] ?? table.name;
  const columns = table.header.map((h) => ({
    header: h,
    ratio: h === 'ratio',
    numFmt: RATIO_COLUMNS.has(h) ? '0.000' : /^r[xyz] \[/.test(h) ? '0.000E+00' : h.includes('[') || h === 'demand' || h === 'capacity' ? '0.000###' : undefined,
    width: h === 'details' ? 100 : Math.max(10, Math.min(40, h.length + 4)),
  }));
  const statusCol = table.header.indexOf('status');
  const block: [string, string | number][] = [
    ['Project', neutralise(header.project)],
    ['Model', neutralise(header.model)],
    ['Model version', header.version],
    ['Run', header.run],
    ['Date', header.date],
    ['Design code', DESIGN_CODE_NAMES[header.code as DesignCode] ?? header.code],
    ...(header.method ? [['Analysis', header.method] as [string, string]] : []),
    ['Units', UNIT_SYSTEM_NAMES[header.units as UnitSystem] ?? header.units],
    ...(header.settings ?? []).map(([k, v]) => [k, neutralise(v)] as [string, string]),
    ...(header.ranBy ? [['Run by', neutralise(header.ranBy)] as [string, string]] : []),
    ...(header.approved ? [['Approved by / on', neutralise(header.approved)] as [string, string]] : []),
    ...(header.software ? [['Software', header.software] as [string, string]] : []),
    ['Members passing', header.counts.pass],
    ['Members failing', header.counts.fail],
    ['Members not checked', header.counts.notChecked],
    ['Review status', header.reviewStatus],
  ];
  // rows: title, the block, caution, a blank row, then the table's header row
  const first = block.length + 4;
  const wb = new ExcelJS.stream.xlsx.WorkbookWriter({ stream, useStyles: true, useSharedStrings: false });
  wb.creator = 'Trestle';
  wb.created = new Date();
  const ws = wb.addWorksheet(title.slice(0, 31), { views: [{ state: 'frozen', xSplit: 0, ySplit: first }] });
  ws.columns = columns.map((c, i) => ({ width: Math.max(c.width, i === 0 ? 16 : 0), ...(c.numFmt ? { style: { numFmt: c.numFmt } } : {}) }));
  const titleRow = ws.addRow([title]);
  titleRow.font = { bold: true, size: 14 };
  titleRow.commit();
  for (const [k, v] of block) {
    const row = ws.addRow([k, v]);
    row.getCell(1).font = { bold: true };
    row.getCell(2).alignment = { horizontal: 'left' };
    row.commit();
  }
  const caution = ws.addRow([CAUTION]);
  caution.getCell(1).font = { italic: true, color: { argb: 'FF7A3B00' } };
  ws.mergeCells(caution.number, 1, caution.number, Math.max(6, columns.length));
  caution.getCell(1).alignment = { wrapText: true, vertical: 'top' };
  caution.height = 48;
  caution.commit();
  ws.addRow([]).commit();

  const headerRow = ws.addRow(columns.map((c) => c.header));
  headerRow.font = { bold: true };
  headerRow.eachCell((cell) => {
    cell.fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: 'FFD9DEE8' } };
    cell.border = { bottom: { style: 'thin' } };
  });
  headerRow.commit();
  const ratioCol = columns.findIndex((c) => c.ratio);
  for (const cells of table.rows) {
    const row = ws.addRow(cells.map((v) => (typeof v === 'string' ? neutralise(v) : v)));
    if (ratioCol >= 0 && statusCol >= 0) {
      const band = ratioBand(typeof cells[ratioCol] === 'number' ? (cells[ratioCol] as number) : null, String(cells[statusCol]) as CheckStatus);
      row.getCell(ratioCol + 1).fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: BAND_FILLS[band] } };
    }
    row.commit();
  }
  ws.autoFilter = { from: { row: first, column: 1 }, to: { row: first + table.rows.length, column: columns.length } };
  ws.commit();
  await wb.commit();
  return table.rows.length;
}

/** The whole workbook in memory (tests, small tables); the server streams with writeXlsx. */
export async function toXlsx(table: ResultTable, header: HeaderBlock): Promise<Buffer> {
  const chunks: Buffer[] = [];
  const sink = new PassThrough();
  sink.on('data', (c: Buffer) => chunks.push(c));
  const ended = new Promise((resolve) => sink.on('end', resolve));
  await writeXlsx(table, header, sink);
  await ended;
  return Buffer.concat(chunks);
}
