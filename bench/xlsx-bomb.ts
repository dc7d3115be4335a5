/**
 * The hostile workbook of issue 12: a ~1 MB XLSX whose one sheet holds rows × columns numeric
 * cells (default 2,000 × 16,384, column XFD is Excel's last). Written as a stream (fflate's Zip),
 * so generating it costs a row of text at a time, not the sheet.
 *
 * `npx tsx --tsconfig tsconfig.server.json bench/xlsx-bomb.ts [rows] [columns] [--reuse]` writes it to
 * test-artifacts/xlsx-bomb.xlsx (`--reuse`: reads the one written before) and prints how fast and in how much memory the reader refuses it,
 * once through the zip directory check (what the server does before any worker sees the file)
 * and once streamed with a size limit large enough to let the sheet be parsed (the row, column
 * and cell limits then stop it). Printed, never asserted.
 */
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { Zip, ZipDeflate, strToU8 } from 'fflate';

const CONTENT_TYPES = `<?xml version="1.0" encoding="UTF-8"?><Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types"><Default Extension="rels" ContentType="application/vnd.openxmlformats-package.relationships+xml"/><Default Extension="xml" ContentType="application/xml"/><Override PartName="/xl/workbook.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml"/><Override PartName="/xl/worksheets/sheet1.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.worksheet+xml"/></Types>`;
const ROOT_RELS = `<?xml version="1.0" encoding="UTF-8"?><Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"><Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/officeDocument" Target="xl/workbook.xml"/></Relationships>`;
const WORKBOOK = `<?xml version="1.0" encoding="UTF-8"?><workbook xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships"><sheets><sheet name="members" sheetId="1" r:id="rId1"/></sheets></workbook>`;
const WORKBOOK_RELS = `<?xml version="1.0" encoding="UTF-8"?><Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"><Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/worksheet" Target="worksheets/sheet1.xml"/></Relationships>`;

/** The bomb's bytes: `rows` rows of `columns` cells holding 1. */
export function xlsxBomb(rows = 2000, columns = 16384): Uint8Array {
  const chunks: Uint8Array[] = [];
  const zip = new Zip((err, data) => {
    if (err) throw err;
    chunks.push(data);
  });
  const add = (name: string, text: string) => {
    const f = new ZipDeflate(name, { level: 9 });
    zip.add(f);
    f.push(strToU8(text), true);
  };
  add('[Content_Types].xml', CONTENT_TYPES);
  add('_rels/.rels', ROOT_RELS);
  add('xl/workbook.xml', WORKBOOK);
  add('xl/_rels/workbook.xml.rels', WORKBOOK_RELS);
  const sheet = new ZipDeflate('xl/worksheets/sheet1.xml', { level: 9 });
  zip.add(sheet);
  sheet.push(strToU8(`<?xml version="1.0" encoding="UTF-8"?><worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><sheetData>`));
  const cell = '<c><v>1</v></c>'; // no reference: the next column, as the format allows
  for (let r = 1; r <= rows; r++) {
    sheet.push(strToU8(`<row r="${r}">${cell.repeat(columns)}</row>`));
  }
  sheet.push(strToU8('</sheetData></worksheet>'), true);
  zip.end();
  const out = new Uint8Array(chunks.reduce((n, c) => n + c.length, 0));
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.length;
  }
  return out;
}

async function main(): Promise<void> {
  const { inspectWorkbook, readWorkbook, DEFAULT_XLSX_LIMITS } = await import('../shared/reader/xlsx.js');
  const args = process.argv.slice(2).filter((a) => a !== '--reuse');
  const rows = Number(args[0] ?? 2000);
  const columns = Number(args[1] ?? 16384);
  const file = 'test-artifacts/xlsx-bomb.xlsx';
  let t = performance.now();
  let bomb: Uint8Array;
  if (process.argv.includes('--reuse') && existsSync(file)) {
    bomb = new Uint8Array(readFileSync(file));
    console.log(`bomb read from ${file}: ${(bomb.length / 1024).toFixed(0)} kB`);
  } else {
    bomb = xlsxBomb(rows, columns);
    console.log(`bomb ${rows} × ${columns} cells: ${(bomb.length / 1024).toFixed(0)} kB, generated in ${((performance.now() - t) / 1000).toFixed(1)} s`);
    mkdirSync('test-artifacts', { recursive: true });
    writeFileSync(file, bomb);
  }
  const rss0 = process.memoryUsage().rss;
  let peak = rss0;
  const sample = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 5);
  const attempt = async (label: string, run: () => unknown) => {
    peak = process.memoryUsage().rss;
    t = performance.now();
    let outcome = 'read (not refused!)';
    try {
      await run();
    } catch (e) {
      outcome = `refused: ${(e as Error).message}`;
    }
    const ms = performance.now() - t;
    peak = Math.max(peak, process.memoryUsage().rss);
    console.log(`${label}: ${ms.toFixed(0)} ms, peak RSS ${(peak / 1024 / 1024).toFixed(0)} MB — ${outcome}`);
  };
  await attempt('zip directory check (default limits)', () => inspectWorkbook(bomb));
  await attempt('streamed read, size limit lifted', () => readWorkbook(bomb, { limits: { maxUncompressedBytes: 4 * 1024 ** 3 } }));
  await attempt('streamed read, size and column limits lifted', () =>
    readWorkbook(bomb, { limits: { maxUncompressedBytes: 4 * 1024 ** 3, maxColumns: 16384 } }),
  );
  clearInterval(sample);
  console.log(`defaults: ${JSON.stringify(DEFAULT_XLSX_LIMITS)}`);
}

if (import.meta.url === `file://${process.argv[1]}`) void main();
