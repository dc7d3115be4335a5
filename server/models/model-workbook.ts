/**
 * GET /api/models/:id/versions/:version/workbook.xlsx — a model version (grid edits
 * included) as the workbook the importer reads: one sheet per table, header row first with
 * units in brackets in the model's unit system (shared/reader/workbook-writer.ts decides
 * what is written and why re-importing it gives the same model).
 *
 * Nothing but the tables goes into the sheets (a title row above a header would be read as
 * the header). Ids are text cells, numbers number cells with their full precision.
 */
import ExcelJS from 'exceljs';
import type { DataSource } from 'typeorm';
import type { Model } from '../../shared/model/types.js';
import { modelTables } from '../../shared/reader/workbook-writer.js';
import { loadModel } from './model.service.js';

export const XLSX_TYPE = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';

/** The workbook's bytes. */
export async function modelWorkbook(model: Model): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Trestle';
  for (const t of modelTables(model)) {
    const ws = wb.addWorksheet(t.name);
    for (const cells of t.rows) ws.addRow(cells.map((c) => (c === undefined ? null : c)));
    const head = ws.getRow(1);
    head.font = { bold: true };
    head.eachCell((cell) => {
      cell.fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: 'FFD9DEE8' } };
      cell.border = { bottom: { style: 'thin' } };
    });
    t.rows[0].forEach((h, i) => {
      const widest = Math.max(String(h ?? '').length, ...t.rows.slice(1, 200).map((r) => String(r[i] ?? '').length));
      ws.getColumn(i + 1).width = Math.min(40, Math.max(8, widest + 2));
    });
    ws.views = [{ state: 'frozen', xSplit: 0, ySplit: 1 }];
  }
  return Buffer.from(await wb.xlsx.writeBuffer());
}

/** A file name of plain characters: `<model name>-v<version>.xlsx`. */
export function workbookFileName(name: string, version: number): string {
  const base = name.normalize('NFKD').replace(/[^\w.-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 80) || 'model';
  return `${base}-v${version}.xlsx`;
}

export async function modelVersionWorkbook(ds: DataSource, id: number, version: number): Promise<{ fileName: string; contentType: string; body: Buffer }> {
  const { record, model } = await loadModel(ds, id, version);
  return { fileName: workbookFileName(record.name, version), contentType: XLSX_TYPE, body: await modelWorkbook(model) };
}
