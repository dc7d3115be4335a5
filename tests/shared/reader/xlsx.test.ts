import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { readWorkbook } from '../../../shared/reader/index.js';
import { BASE, read } from './helpers.js';

/** The BASE CSV tables written as an XLSX workbook, numbers as number cells. */
async function baseWorkbook(edit?: (wb: ExcelJS.Workbook) => void): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  for (const [name, text] of Object.entries(BASE)) {
    const ws = wb.addWorksheet(name);
    for (const line of text.trim().split('\n')) {
      ws.addRow(line.split(',').map((c) => (c !== '' && !Number.isNaN(Number(c)) ? Number(c) : c === '' ? null : c)));
    }
  }
  edit?.(wb);
  return Buffer.from(await wb.xlsx.writeBuffer());
}

describe('XLSX row source', () => {
  it('gives the same model as the CSV files', async () => {
    const x = await readWorkbook(await baseWorkbook());
    const c = read();
    expect(x.ok && c.ok).toBe(true);
    if (x.ok && c.ok) expect(x.model).toEqual(c.model);
  });

  it('reads formula results and rich text, and reports sheet row numbers', async () => {
    const buf = await baseWorkbook((wb) => {
      const ws = wb.getWorksheet('nodes')!;
      ws.getCell('B4').value = { formula: '2*3', result: 6 };
      ws.getCell('A5').value = { richText: [{ text: 'N' }, { text: '4', font: { bold: true } }] };
      ws.spliceRows(3, 0, [], []); // two empty sheet rows: N2 moves to row 5
      ws.getCell('C5').value = 'tall';
    });
    const r = await readWorkbook(buf);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems).toEqual([{ severity: 'error', table: 'nodes', row: 5, column: 'y', message: '"tall" is not a number' }]);
  });

  it('reads 12.0 in a number cell as the id 12', async () => {
    const buf = await baseWorkbook((wb) => {
      const nodes = wb.getWorksheet('nodes')!;
      nodes.getCell('A2').value = 12.0;
      wb.getWorksheet('members')!.getCell('B2').value = 12;
      wb.getWorksheet('supports')!.getCell('A2').value = 12;
    });
    const r = await readWorkbook(buf);
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.model.members[0].start).toBe('12');
  });

  it('reports a file that is not a workbook instead of throwing', async () => {
    const r = await readWorkbook(new TextEncoder().encode('node,x,y\n'));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems[0].message).toContain('not a readable XLSX workbook');
  });
});
