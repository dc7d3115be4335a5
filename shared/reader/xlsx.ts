/**
 * XLSX row source: one sheet per table (the sheet name is the table name), row numbers as
 * the sheet shows them. Cells give numbers, text, formula results and rich text.
 * Pure: takes the workbook's bytes, never a path.
 */
import ExcelJS from 'exceljs';
import type { ReadResult } from '../model/types.js';
import { readTables, type ReadOptions } from './read.js';
import type { Cell, RawTable } from './table.js';

type CellValue = ExcelJS.CellValue;

/** A cell's value as a number, text or null. */
export function cellValue(v: CellValue): Cell {
  if (v === null || v === undefined) return null;
  if (typeof v === 'number' || typeof v === 'string') return v;
  if (typeof v === 'boolean') return v ? 'true' : 'false';
  if (v instanceof Date) return v.toISOString();
  if (typeof v === 'object') {
    if ('richText' in v && Array.isArray(v.richText)) return v.richText.map((p) => p.text).join('');
    if ('formula' in v || 'sharedFormula' in v) {
      const r = (v as { result?: CellValue }).result;
      if (r && typeof r === 'object' && 'error' in r) return String((r as { error: string }).error);
      return cellValue(r ?? null);
    }
    if ('text' in v && typeof (v as { text: unknown }).text === 'string') {
      const t = (v as { text: string | { richText: { text: string }[] } }).text;
      return typeof t === 'string' ? t : null;
    }
    if ('error' in v) return String((v as { error: string }).error);
  }
  return String(v);
}

/** The sheets of a workbook as raw tables. */
export async function workbookTables(buffer: ArrayBuffer | Uint8Array): Promise<RawTable[]> {
  const wb = new ExcelJS.Workbook();
  const bytes = buffer instanceof Uint8Array ? buffer : new Uint8Array(buffer);
  await wb.xlsx.load(bytes as unknown as ArrayBuffer);
  const tables: RawTable[] = [];
  wb.eachSheet((ws) => {
    const rows: Cell[][] = [];
    const rowNumbers: number[] = [];
    ws.eachRow({ includeEmpty: false }, (row, rowNumber) => {
      const cells: Cell[] = [];
      row.eachCell({ includeEmpty: true }, (cell, col) => {
        cells[col - 1] = cellValue(cell.value);
      });
      for (let i = 0; i < cells.length; i++) if (cells[i] === undefined) cells[i] = null;
      rows.push(cells);
      rowNumbers.push(rowNumber);
    });
    tables.push({ name: ws.name, rows, rowNumbers, source: 'xlsx' });
  });
  return tables;
}

/** Read a model from an XLSX workbook. Never rejects: a broken file is a problem. */
export async function readWorkbook(buffer: ArrayBuffer | Uint8Array, options: ReadOptions = {}): Promise<ReadResult> {
  let tables: RawTable[];
  try {
    tables = await workbookTables(buffer);
  } catch (e) {
    return { ok: false, problems: [{ severity: 'error', table: '', message: `the file is not a readable XLSX workbook: ${(e as Error).message}` }], counts: {} };
  }
  return readTables(tables, options);
}
