/** Hostile workbooks (issue 12): refused while reading, by the limit they cross, in little time and memory. */
import ExcelJS from 'exceljs';
import { Zip, ZipDeflate, strToU8, zipSync } from 'fflate';
import { beforeAll, describe, expect, it } from 'vitest';
import { DEFAULT_XLSX_LIMITS, inspectWorkbook, readWorkbook, XlsxLimitError, type XlsxLimits } from '../../../shared/reader/xlsx.js';
import { xlsxBomb } from '../../../bench/xlsx-bomb.js';
import { BASE } from './helpers.js';

async function baseWorkbook(edit?: (wb: ExcelJS.Workbook) => void): Promise<Uint8Array> {
  const wb = new ExcelJS.Workbook();
  for (const [name, text] of Object.entries(BASE)) {
    const ws = wb.addWorksheet(name);
    for (const line of text.trim().split('\n')) {
      ws.addRow(line.split(',').map((c) => (c !== '' && !Number.isNaN(Number(c)) ? Number(c) : c === '' ? null : c)));
    }
  }
  edit?.(wb);
  return new Uint8Array(await wb.xlsx.writeBuffer());
}

async function refusal(bytes: Uint8Array, limits: Partial<XlsxLimits> = {}): Promise<XlsxLimitError> {
  try {
    await readWorkbook(bytes, { limits });
  } catch (e) {
    if (e instanceof XlsxLimitError) return e;
    throw e;
  }
  throw new Error('the workbook was read, not refused');
}

/** A one-sheet workbook whose sheet XML is given (the directory may be told a smaller size). */
function oneSheet(sheetXml: string, lieAboutSize = false): Uint8Array {
  const parts: Record<string, string> = {
    '[Content_Types].xml': '<Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types"/>',
    'xl/workbook.xml': '<workbook xmlns:r="r"><sheets><sheet name="nodes" sheetId="1" r:id="rId1"/></sheets></workbook>',
    'xl/_rels/workbook.xml.rels': '<Relationships><Relationship Id="rId1" Target="worksheets/sheet1.xml"/></Relationships>',
    'xl/worksheets/sheet1.xml': `<worksheet><sheetData>${sheetXml}</sheetData></worksheet>`,
  };
  const zip = zipSync(Object.fromEntries(Object.entries(parts).map(([k, v]) => [k, strToU8(v)])), { level: 9 });
  if (lieAboutSize) {
    // set the sheet's declared size in the central directory to 100 bytes
    const view = new DataView(zip.buffer, zip.byteOffset, zip.byteLength);
    for (let i = zip.length - 22; i >= 0; i--) {
      if (view.getUint32(i, true) !== 0x02014b50) continue;
      const nameLength = view.getUint16(i + 28, true);
      const name = new TextDecoder().decode(zip.subarray(i + 46, i + 46 + nameLength));
      if (name === 'xl/worksheets/sheet1.xml') view.setUint32(i + 24, 100, true);
    }
  }
  return zip;
}

describe('XLSX limits', () => {
  // a quarter of the 2,000 rows keeps the test quick (bench/xlsx-bomb.ts measures the whole bomb)
  let bomb: Uint8Array;
  beforeAll(() => {
    bomb = xlsxBomb(500, 16384);
  }, 60_000);

  it('refuses the bomb from its zip directory in well under a second', () => {
    expect(bomb.length).toBeLessThan(1024 * 1024);
    const t0 = performance.now();
    expect(() => inspectWorkbook(bomb, { ...DEFAULT_XLSX_LIMITS, maxUncompressedBytes: 64 * 1024 * 1024 })).toThrow(
      /over the size limit: it unpacks to 117\.\d MB; at most 64 MB are read/,
    );
    expect(performance.now() - t0).toBeLessThan(1000);
  });

  it('stops streaming the bomb at the first cell beyond the column limit, without inflating the sheet', async () => {
    const rss = process.memoryUsage().rss;
    const t0 = performance.now();
    const e = await refusal(bomb, { maxUncompressedBytes: 2 ** 32 });
    expect(e.limit).toBe('maxColumns');
    expect(e.message).toBe('the workbook is over the column limit: sheet members has a cell in column GS (row 1); at most 200 columns are read');
    expect(performance.now() - t0).toBeLessThan(5000);
    expect(process.memoryUsage().rss - rss).toBeLessThan(200 * 1024 * 1024);
  });

  it('counts cells and rows across sheets as they are read', async () => {
    const book = await baseWorkbook();
    expect((await refusal(book, { maxRows: 10 })).message).toMatch(/^the workbook is over the row limit: it has more than 10 rows \(sheet \w+, row \d+\)$/);
    expect((await refusal(book, { maxCells: 20 })).message).toMatch(/^the workbook is over the cell limit: it (has|holds) more than 20 /);
    expect((await refusal(book, { maxColumns: 4 })).message).toMatch(/column E \(row 1\); at most 4 columns/);
  });

  it('refuses more sheets than allowed and more bytes than allowed before inflating', async () => {
    const book = await baseWorkbook();
    expect((await refusal(book, { maxSheets: 3 })).message).toBe('the workbook is over the sheet limit: it has 9 sheets; at most 3 are read');
    expect((await refusal(book, { maxUncompressedBytes: 1000 })).limit).toBe('maxUncompressedBytes');
  });

  it('refuses a part that inflates beyond the size its directory declares', async () => {
    const rows = Array.from({ length: 50 }, (_, i) => `<row r="${i + 1}"><c t="inlineStr"><is><t>N${i}</t></is></c></row>`).join('');
    expect((await readWorkbook(oneSheet(rows))).ok).toBe(false); // a nodes table without x, y: read, with problems
    const e = await refusal(oneSheet(rows, true));
    expect(e.message).toMatch(/its part xl\/worksheets\/sheet1\.xml unpacks to more than the 100 bytes its zip directory declares/);
  });

  it('does not expand entities a sheet declares (an XML entity bomb is an unreadable workbook)', async () => {
    const xml = '<!DOCTYPE worksheet [<!ENTITY a "aaaaaaaaaa"><!ENTITY b "&a;&a;&a;&a;&a;&a;&a;&a;&a;&a;">]><worksheet><sheetData><row r="1"><c t="inlineStr"><is><t>&b;</t></is></c></row></sheetData></worksheet>';
    const book = zipSync({
      'xl/workbook.xml': strToU8('<workbook xmlns:r="r"><sheets><sheet name="nodes" sheetId="1" r:id="rId1"/></sheets></workbook>'),
      'xl/_rels/workbook.xml.rels': strToU8('<Relationships><Relationship Id="rId1" Target="worksheets/sheet1.xml"/></Relationships>'),
      'xl/worksheets/sheet1.xml': strToU8(xml),
    });
    const r = await readWorkbook(book);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems[0].message).toMatch(/^the file is not a readable XLSX workbook: .*undefined entity/);
  });

  it('streams a generated workbook of 20,000 rows within the limits', async () => {
    const chunks: Uint8Array[] = [];
    const zip = new Zip((err, data) => {
      if (err) throw err;
      chunks.push(data);
    });
    const add = (name: string, text: string) => {
      const f = new ZipDeflate(name);
      zip.add(f);
      f.push(strToU8(text), true);
    };
    add('xl/workbook.xml', '<workbook xmlns:r="r"><sheets><sheet name="nodes" sheetId="1" r:id="rId1"/></sheets></workbook>');
    add('xl/_rels/workbook.xml.rels', '<Relationships><Relationship Id="rId1" Target="worksheets/sheet1.xml"/></Relationships>');
    const sheet = new ZipDeflate('xl/worksheets/sheet1.xml');
    zip.add(sheet);
    sheet.push(strToU8('<worksheet><sheetData><row r="1"><c t="inlineStr"><is><t>node</t></is></c><c t="inlineStr"><is><t>x</t></is></c><c t="inlineStr"><is><t>y</t></is></c></row>'));
    for (let r = 2; r <= 20_001; r++) sheet.push(strToU8(`<row r="${r}"><c t="inlineStr"><is><t>N${r}</t></is></c><c><v>${r}</v></c><c><v>0</v></c></row>`));
    sheet.push(strToU8('</sheetData></worksheet>'), true);
    zip.end();
    const bytes = new Uint8Array(chunks.reduce((n, c) => n + c.length, 0));
    chunks.reduce((at, c) => (bytes.set(c, at), at + c.length), 0);
    const r = await readWorkbook(bytes);
    expect(r.counts.nodes).toBe(20_000);
  });
});

describe('XLSX formulas', () => {
  it('refuses a formula with no saved value, naming its table, row and column', async () => {
    const book = await baseWorkbook((wb) => {
      wb.getWorksheet('nodes')!.getCell('B3').value = { formula: '2*3' } as ExcelJS.CellFormulaValue;
    });
    const r = await readWorkbook(book);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems[0]).toEqual({
      severity: 'error',
      table: 'nodes',
      row: 3,
      column: 'x',
      message: 'cell B3 holds the formula =2*3 with no saved value: open the workbook in a spreadsheet program, let it calculate and save it, or type the value',
    });
  });

  it('reads a formula with its saved value', async () => {
    const book = await baseWorkbook((wb) => {
      wb.getWorksheet('nodes')!.getCell('B3').value = { formula: '2*3', result: 0 } as ExcelJS.CellFormulaValue;
    });
    expect((await readWorkbook(book)).ok).toBe(true);
  });
});
