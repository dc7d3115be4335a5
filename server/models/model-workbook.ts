/**
 * GET /api/models/:id/versions/:version/workbook.xlsx (and workbook.zip, the same tables as
 * CSV files) — a model version (grid edits included) as the workbook the importer reads: one sheet per table, header row first with
 * units in brackets in the model's unit system (shared/reader/workbook-writer.ts decides
 * what is written and why re-importing it gives the same model).
 *
 * Nothing but the tables goes into the sheets (a title row above a header would be read as
 * the header). Ids are text cells, numbers number cells with their full precision.
 */
import { crc32, deflateRawSync } from 'node:zlib';
import ExcelJS from 'exceljs';
import type { DataSource } from 'typeorm';
import type { Model } from '../../shared/model/types.js';
import { modelTables, tableCsv } from '../../shared/reader/workbook-writer.js';
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

/**
 * The same tables as `<table>.csv` files (UTF-8, comma separated) in one ZIP archive: the
 * importer takes them as a set of CSV files. Written here with node:zlib (deflate, CRC-32):
 * a ZIP of a few small files needs no library.
 */
export function modelCsvZip(model: Model, date = new Date()): Buffer {
  return zip(modelTables(model).map((t) => ({ name: `${t.name}.csv`, data: Buffer.from(tableCsv(t), 'utf8') })), date);
}

/** A ZIP archive (PKWARE APPNOTE 6.3: local headers, central directory, end record), deflated entries. */
function zip(files: { name: string; data: Buffer }[], date: Date): Buffer {
  const time = (date.getUTCHours() << 11) | (date.getUTCMinutes() << 5) | (date.getUTCSeconds() >> 1);
  const day = ((date.getUTCFullYear() - 1980) << 9) | ((date.getUTCMonth() + 1) << 5) | date.getUTCDate();
  const locals: Buffer[] = [];
  const central: Buffer[] = [];
  let offset = 0;
  for (const f of files) {
    const name = Buffer.from(f.name, 'utf8');
    const packed = deflateRawSync(f.data);
    const crc = crc32(f.data);
    const common = (b: Buffer, at: number) => {
      b.writeUInt16LE(20, at); // version needed: 2.0 (deflate)
      b.writeUInt16LE(0x0800, at + 2); // names in UTF-8
      b.writeUInt16LE(8, at + 4); // deflate
      b.writeUInt16LE(time, at + 6);
      b.writeUInt16LE(day, at + 8);
      b.writeUInt32LE(crc, at + 10);
      b.writeUInt32LE(packed.length, at + 14);
      b.writeUInt32LE(f.data.length, at + 18);
      b.writeUInt16LE(name.length, at + 22);
    };
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    common(local, 4);
    const dir = Buffer.alloc(46);
    dir.writeUInt32LE(0x02014b50, 0);
    dir.writeUInt16LE(20, 4); // made by: 2.0
    common(dir, 6);
    dir.writeUInt32LE(offset, 42);
    locals.push(local, name, packed);
    central.push(dir, name);
    offset += local.length + name.length + packed.length;
  }
  const dirBytes = Buffer.concat(central);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(files.length, 8);
  end.writeUInt16LE(files.length, 10);
  end.writeUInt32LE(dirBytes.length, 12);
  end.writeUInt32LE(offset, 16);
  return Buffer.concat([...locals, dirBytes, end]);
}

/** A file name of plain characters: `<model name>-v<version>.<ext>`. */
export function workbookFileName(name: string, version: number, ext: 'xlsx' | 'zip' = 'xlsx'): string {
  const base = name.normalize('NFKD').replace(/[^\w.-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 80) || 'model';
  return `${base}-v${version}.${ext}`;
}

export async function modelVersionWorkbook(ds: DataSource, id: number, version: number, format: 'xlsx' | 'zip' = 'xlsx'): Promise<{ fileName: string; contentType: string; body: Buffer }> {
  const { record, model } = await loadModel(ds, id, version);
  if (format === 'zip') return { fileName: workbookFileName(record.name, version, 'zip'), contentType: 'application/zip', body: modelCsvZip(model) };
  return { fileName: workbookFileName(record.name, version), contentType: XLSX_TYPE, body: await modelWorkbook(model) };
}
