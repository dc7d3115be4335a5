/** Exports: formula neutralisation, the XLSX header block and rows read back with exceljs. */
import { readFileSync } from 'node:fs';
import ExcelJS from 'exceljs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { MemberUtilisation } from '../../../shared/design/types.js';
import type { Model } from '../../../shared/model/types.js';
import { neutraliseText as neutralise, toCsv } from '../../../shared/exports/index.js';
import { utilisationExport } from '../../../server/exports/tables.js';
import { BAND_FILLS, CAUTION, toXlsx } from '../../../server/exports/xlsx.js';
import { closeRunPool } from '../../../server/runs/worker-pool.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { CSV, newProject, upload } from '../models/fixture.js';
import { settle } from '../runs/poll.js';

function util(member: string, group: string, ratio: number | null, status: MemberUtilisation['status']): MemberUtilisation {
  return {
    member, group, section: 'B300', material: 'Steel355', length: 6, ratio, check: 'bending', clause: '6.2.5',
    combination: 'ULS', status, families: { bending_major: ratio }, familyStatus: { bending_major: status }, warnings: [],
  };
}

const metric = { settings: { units: 'metric' } } as Model;
const utilisationTable = (members: MemberUtilisation[], _units: string) => utilisationExport(metric, members);

const binary = (r: NodeJS.ReadableStream, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  r.on('data', (c: Buffer) => chunks.push(c));
  r.on('end', () => cb(null, Buffer.concat(chunks)));
};

/** The row of the table header ('member' in the first column), below the header block. */
function tableHeaderRow(ws: ExcelJS.Worksheet): number {
  let at = -1;
  ws.eachRow((r, i) => { if (at < 0 && r.getCell(1).value === 'member') at = i; });
  return at;
}

describe('export tables', () => {
  it('neutralises user text that begins with =, +, - or @ in CSV', () => {
    expect(neutralise('=SUM(A1)')).toBe("'=SUM(A1)");
    expect(neutralise('@cmd')).toBe("'@cmd");
    expect(neutralise('beams')).toBe('beams');
    const csv = toCsv(utilisationTable([util('=1+1', '+evil', 0.5, 'pass'), util('M2', '-x', -0.25, 'pass')], 'metric'));
    const lines = csv.trim().split('\r\n');
    expect(lines[0]).toBe('member,group,section,material,length [m],ratio,check,clause,combination,status,bending_major');
    expect(lines[1].startsWith("'=1+1,'+evil,")).toBe(true);
    expect(lines[2].split(',')[1]).toBe("'-x");
    // numbers stay numbers (a negative number is not user text)
    expect(lines[2].split(',')[5]).toBe('-0.25');
  });

  it('writes the header block, caution, frozen header row, autofilter and ratio fills', async () => {
    const table = utilisationTable(
      [util('M1', '=HYPERLINK("x")', 0.5, 'pass'), util('M2', 'g', 0.95, 'pass'), util('M3', 'g', 1.2, 'fail'), util('M4', 'g', null, 'not checked')],
      'metric',
    );
    const buf = await toXlsx(table, {
      project: 'Demo project', model: '@model', version: 3, run: 7, date: '2026-12-01 10:00 UTC', code: 'en1993-1-1', units: 'metric',
      counts: { pass: 2, fail: 1, notChecked: 1 }, reviewStatus: 'draft',
    });
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(buf as unknown as ArrayBuffer);
    const ws = wb.worksheets[0];
    const labels = new Map<string, unknown>();
    for (let r = 2; r <= 12; r++) labels.set(String(ws.getCell(r, 1).value), ws.getCell(r, 2).value);
    expect(labels.get('Project')).toBe('Demo project');
    expect(labels.get('Model')).toBe("'@model");
    expect(labels.get('Model version')).toBe(3);
    expect(labels.get('Run')).toBe(7);
    expect(labels.get('Design code')).toBe('EN 1993-1-1'); // the code's name, not its settings key
    expect(labels.get('Units')).toBe('Metric (kN, m, MPa)');
    expect(labels.get('Members failing')).toBe(1);
    expect(ws.getCell(13, 1).value).toBe(CAUTION);
    const headerRow = 15;
    expect(ws.getCell(headerRow, 1).value).toBe('member');
    expect(ws.views[0]).toMatchObject({ state: 'frozen', ySplit: headerRow });
    expect(ws.autoFilter).toBeTruthy();
    expect(ws.getCell(headerRow + 1, 2).value).toBe('\'=HYPERLINK("x")');
    expect(ws.getCell(headerRow + 1, 6).value).toBe(0.5);
    const fill = (r: number) => (ws.getCell(r, 6).fill as { fgColor?: { argb?: string } }).fgColor?.argb;
    expect([fill(16), fill(17), fill(18), fill(19)]).toEqual([BAND_FILLS.ok, BAND_FILLS.near, BAND_FILLS.over, BAND_FILLS.unchecked]);
  });
});

describe('GET /api/runs/:id/exports', () => {
  let t: TestApp;
  let runId: number;
  beforeAll(async () => {
    t = await createTestApp();
    const projectId = await newProject(t, 'Export project');
    const preview = await upload(t, projectId, { ...CSV, 'members.csv': CSV['members.csv'].replace(',beams', ',=cmd|calc') });
    const commit = await t.as('engineer').post(`/api/projects/${projectId}/imports/${preview.body.id}/commit`).send({});
    const start = await t.as('engineer').post(`/api/models/${commit.body.model.id}/runs`).send({});
    runId = start.body.id;
    await settle(t, runId);
  }, 90_000);
  afterAll(async () => {
    await closeRunPool();
    await t.close();
  });

  it('exports the utilisation schedule as XLSX with the header block and one row per member', async () => {
    const res = await t.as('engineer').get(`/api/runs/${runId}/exports/utilisation.xlsx`).buffer(true).parse(binary as never);
    expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(200);
    expect(res.headers['content-disposition']).toMatch(/attachment/);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(res.body as unknown as ArrayBuffer);
    const ws = wb.worksheets[0];
    expect(ws.getCell(2, 2).value).toBe('Export project');
    // the table starts below the header block (its length follows the block's lines)
    const h = tableHeaderRow(ws);
    expect(h).toBeGreaterThan(10);
    expect(ws.getCell(h + 1, 1).value).toBe('M1');
    expect(ws.getCell(h + 1, 2).value).toBe("'=cmd|calc");
    expect(ws.getCell(h + 2, 1).value).toBe('M2');
    // the header block: the settings that apply to EN 1993-1-1 with readable labels, who ran and approved it, the software
    const block = new Map<string, unknown>();
    for (let r = 2; r < h; r++) block.set(String(ws.getCell(r, 1).value), ws.getCell(r, 2).value);
    expect(block.get('Design code')).toBe('EN 1993-1-1');
    expect(block.get('Analysis')).toBeTruthy();
    // tables.md defaults: γM0 = 1.0, γM1 = 1.0, γM2 = 1.25 (EN 1993-1-1 6.1 recommended values)
    expect([block.get('Partial factor γM0'), block.get('Partial factor γM1'), block.get('Partial factor γM2')]).toEqual(['1.00', '1.00', '1.25']);
    expect(block.get('Deflection limit')).toBe('span / 360');
    expect(String(block.get('Run by'))).toMatch(/ UTC$/);
    expect(block.get('Approved by / on')).toBe('not approved (review status: draft)');
    const pkg = JSON.parse(readFileSync(new URL('../../../package.json', import.meta.url), 'utf8')) as { version: string };
    expect(block.get('Software')).toBe(`Trestle ${pkg.version}`);
    expect([...block.keys()].some((k) => /gamma|design_code|_/.test(k))).toBe(false);
  });

  it('exports checks, displacements, reactions and member forces as CSV with bracketed units', async () => {
    for (const [kind, head] of [
      ['checks', 'member,combination,check,clause,demand,capacity,ratio,status,note,unit,details'],
      ['displacements', 'loading,node,ux [mm],uy [mm],uz [mm],rx [rad],ry [rad],rz [rad]'],
      ['reactions', 'loading,node,fx [kN],fy [kN],fz [kN],mx [kNm],my [kNm],mz [kNm]'],
      ['forces', 'loading,member,x [m],N [kN],V_major [kN],V_minor [kN],T [kNm],M_major [kNm],M_minor [kNm],d_major [mm],d_minor [mm]'],
    ]) {
      const res = await t.as('engineer').get(`/api/runs/${runId}/exports/${kind}.csv`);
      expect(res.status, kind).toBe(200);
      expect(res.text.split('\r\n')[0]).toBe(head);
    }
    const reactions = await t.as('engineer').get(`/api/runs/${runId}/exports/reactions.csv?loading=L`);
    // statics: the supports carry the whole live load, 12 kN/m over 12 m = 144 kN upward; 0.1 % tolerance
    const fy = reactions.text.trim().split('\r\n').slice(1).reduce((s, line) => s + Number(line.split(',')[3]), 0);
    expect(Math.abs(fy - 144)).toBeLessThan(0.144);
  });

  it('exports the detailed checks as XLSX with a details column of symbol=value unit parts', async () => {
    const res = await t.as('engineer').get(`/api/runs/${runId}/exports/checks.xlsx`).buffer(true).parse(binary as never);
    expect(res.status).toBe(200);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(res.body as unknown as ArrayBuffer);
    const ws = wb.worksheets[0];
    const headerRow = tableHeaderRow(ws);
    const header = (ws.getRow(headerRow).values as unknown[]).slice(1);
    const at = header.indexOf('details') + 1;
    expect(at).toBeGreaterThan(0);
    const details = String(ws.getCell(headerRow + 1, at).value);
    for (const part of details.split('; ')) expect(part).toMatch(/^[^=]+=.+/);
  });

  it('answers 404 for an unknown export', async () => {
    const res = await t.as('engineer').get(`/api/runs/${runId}/exports/everything.pdf`);
    expect(res.status).toBe(404);
  });
});
