/**
 * Writes every demo model of models.ts as samples/<name>/<name>.xlsx (a sheet per table)
 * and samples/<name>/csv/<table>.csv from the same tables, so the two never drift.
 * Run: npx tsx scripts/samples/build.ts
 */
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import ExcelJS from 'exceljs';
import { workbookTables } from '../../shared/reader/xlsx.js';
import { tableCsv } from './csv.js';
import { SAMPLES, type SampleModel } from './models.js';

const ROOT = resolve(import.meta.dirname, '..', '..', 'samples');
/** fixed so that a rebuild without changes gives the same files */
const STAMP = new Date('2026-01-01T00:00:00Z');


export async function workbookOf(sample: SampleModel): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Trestle samples';
  wb.created = STAMP;
  wb.modified = STAMP;
  for (const [name, rows] of Object.entries(sample.tables)) {
    const ws = wb.addWorksheet(name);
    for (const r of rows) ws.addRow(r.map((v) => (v === null ? null : v)));
    ws.getRow(1).font = { bold: true };
    ws.columns.forEach((c, i) => {
      c.width = Math.max(10, ...rows.map((r) => String(r[i] ?? '').length + 2));
    });
  }
  return Buffer.from(await wb.xlsx.writeBuffer());
}

/** Whether a workbook holds exactly the sample's tables (names and cells). */
async function sameContent(bytes: Uint8Array, sample: SampleModel): Promise<boolean> {
  try {
    const tables = await workbookTables(bytes);
    const want = Object.entries(sample.tables);
    if (tables.length !== want.length) return false;
    return want.every(([name, rows], i) => {
      const t = tables[i];
      if (t.name !== name || t.rows.length !== rows.length) return false;
      return rows.every((r, j) => {
        const got = t.rows[j];
        const width = Math.max(r.length, got.length);
        for (let k = 0; k < width; k++) if ((r[k] ?? null) !== (got[k] ?? null)) return false;
        return true;
      });
    });
  } catch {
    return false;
  }
}

async function main(): Promise<void> {
  for (const make of SAMPLES) {
    const sample = make();
    const dir = join(ROOT, sample.name);
    rmSync(join(dir, 'csv'), { recursive: true, force: true });
    mkdirSync(join(dir, 'csv'), { recursive: true });
    for (const [name, rows] of Object.entries(sample.tables)) writeFileSync(join(dir, 'csv', `${name}.csv`), tableCsv(rows));
    const file = join(dir, `${sample.name}.xlsx`);
    // the zip inside an XLSX stamps the time of writing: rewrite only when the content changed
    if (!(existsSync(file) && (await sameContent(readFileSync(file), sample)))) writeFileSync(file, await workbookOf(sample));
    console.log(`${sample.name}: ${Object.keys(sample.tables).length} tables`);
  }
}

await main();
