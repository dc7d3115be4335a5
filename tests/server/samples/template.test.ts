/**
 * The blank workbook (GET /api/templates/model.xlsx) imports as it is, without a warning or an
 * error, in both unit systems; the member-load positions a and b read as lengths, with a note
 * that says so beside the header.
 */
import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { templateWorkbook } from '../../../server/samples/template.js';
import { readWorkbook } from '../../../shared/reader/index.js';

async function sheets(units: 'metric' | 'us'): Promise<ExcelJS.Workbook> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load((await templateWorkbook(units)) as unknown as ArrayBuffer);
  return wb;
}

describe('blank workbook', () => {
  for (const units of ['metric', 'us'] as const) {
    it(`reads back with 0 warnings and 0 errors (${units})`, async () => {
      const r = await readWorkbook(new Uint8Array(await templateWorkbook(units)));
      expect(r.ok ? r.warnings : r.problems).toEqual([]);
      expect(r.ok).toBe(true);
    });
  }

  it('gives the member-load positions a length unit and a note that they are distances, not areas', async () => {
    const wb = await sheets('metric');
    const loads = wb.getWorksheet('member_loads')!;
    const header = loads.getRow(1).values as (string | undefined)[];
    const a = header.indexOf('a [m]');
    expect(a).toBeGreaterThan(0);
    expect(header).toContain('b [m]');
    const note = String(loads.getRow(1).getCell(a).note);
    expect(note).toMatch(/distance along the member from its start node/);
    expect(note).toMatch(/not an area/);
    expect((await sheets('us')).getWorksheet('member_loads')!.getRow(1).values).toContain('a [ft]');
    // the area of a section keeps its own unit, so the two can be told apart at a glance
    expect(wb.getWorksheet('sections')!.getRow(1).values).toContain('A [mm2]');
  });

  it('carries the instructions in a note, every sheet being a table', async () => {
    const wb = await sheets('us');
    expect(wb.worksheets.map((w) => w.name)).not.toContain('instructions');
    const note = String(wb.getWorksheet('settings')!.getCell('A1').note);
    expect(note).toContain('Units go in square');
    expect(note).toContain('licensed practice govern');
  });
});
