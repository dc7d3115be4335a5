/**
 * GET /api/models/:id/versions/:version/workbook.xlsx: a version (grid edits included) as
 * the importer's workbook; reading it back gives the stored model (tests/shared/reader/
 * model-compare.ts says what "identical" leaves out: rows, and which settings were defaulted).
 */
import { readFileSync, readdirSync } from 'node:fs';
import { crc32, inflateRawSync } from 'node:zlib';
import { join } from 'node:path';
import type { Response } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readCsvFiles, readWorkbook, workbookTables } from '../../../shared/reader/index.js';
import { loadModel } from '../../../server/models/model.service.js';
import { modelWorkbook, workbookFileName } from '../../../server/models/model-workbook.js';
import { closeRunPool } from '../../../server/runs/worker-pool.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { comparable, expectSame } from '../../shared/reader/model-compare.js';
import { importDemo, newProject } from './fixture.js';

let t: TestApp;
let projectId: number;
let modelId: number;
beforeAll(async () => {
  t = await createTestApp();
  projectId = await newProject(t);
  modelId = await importDemo(t, projectId);
  // the project's creator (an engineer) leads it; admins add the viewer as a member
  const added = await t.as('admin').post(`/api/projects/${projectId}/members`).send({ email: 'viewer@example.com', role: 'viewer' });
  if (added.status !== 201) throw new Error(`member: ${added.status} ${JSON.stringify(added.body)}`);
}, 120_000);
afterAll(async () => {
  await closeRunPool();
  await t.close();
});

/** The entries of a ZIP archive, read from its local headers (APPNOTE 6.3 section 4.3.7). */
function unzip(buf: Buffer): { name: string; text: string }[] {
  const out: { name: string; text: string }[] = [];
  let at = 0;
  while (buf.readUInt32LE(at) === 0x04034b50) {
    const method = buf.readUInt16LE(at + 8);
    const crc = buf.readUInt32LE(at + 14);
    const size = buf.readUInt32LE(at + 18);
    const nameLength = buf.readUInt16LE(at + 26);
    const extra = buf.readUInt16LE(at + 28);
    const name = buf.subarray(at + 30, at + 30 + nameLength).toString('utf8');
    const start = at + 30 + nameLength + extra;
    const packed = buf.subarray(start, start + size);
    const data = method === 8 ? inflateRawSync(packed) : packed;
    expect(crc32(data), name).toBe(crc);
    out.push({ name, text: data.toString('utf8') });
    at = start + size;
  }
  expect(buf.readUInt32LE(buf.length - 22)).toBe(0x06054b50); // end of central directory
  expect(buf.readUInt16LE(buf.length - 22 + 10)).toBe(out.length);
  return out;
}

function binary(res: Response, cb: (err: Error | null, body: Buffer) => void): void {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
}

async function download(id: number, version: number, role: 'viewer' | 'engineer' = 'viewer') {
  return t.as(role).get(`/api/models/${id}/versions/${version}/workbook.xlsx`).buffer(true).parse(binary as never);
}

describe('model workbook download', () => {
  it('gives a viewer the workbook of a version, one sheet per table with units in the headers', async () => {
    const res = await download(modelId, 1);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/spreadsheetml/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="[\w.-]+-v1\.xlsx"$/);
    const sheets = await workbookTables(res.body as Buffer);
    expect(sheets.map((s) => s.name)).toEqual(['settings', 'nodes', 'supports', 'materials', 'sections', 'members', 'cases', 'node_loads', 'member_loads', 'settlements', 'combinations']);
    const nodes = sheets.find((s) => s.name === 'nodes')!;
    expect(nodes.rows[0]).toEqual(['node', 'x [m]', 'y [m]', 'z [m]']);
    expect(nodes.rows[2]).toEqual(['N2', 6, 0, 0]);
    const sections = sheets.find((s) => s.name === 'sections')!;
    expect(sections.rows[0]).toEqual(['section', 'shape', 'd [mm]', 'bf [mm]', 'tf [mm]', 'tw [mm]', 'An [mm2]', 'U', 'Ae [mm2]']);
    expect(sections.rows[1]).toEqual(['B300', 'i', 300, 150, 10.7, 7.1]);
  });

  it('reads back as the stored version after a grid edit (catalogue section, lb, k_major, group)', async () => {
    const edit = await t.as('engineer').patch(`/api/models/${modelId}/members`).send({
      baseVersion: 1,
      edits: [
        { member: 'M1', field: 'section', value: 'IPE300' },
        { member: 'M1', field: 'lb', value: '2.5' },
        { member: 'M2', field: 'k_major', value: 0.85 },
        { member: 'M2', field: 'group', value: 'end span' },
      ],
    });
    expect(edit.status).toBe(200);
    const res = await download(modelId, 2);
    expect(res.status).toBe(200);
    const back = await readWorkbook(res.body as Buffer);
    if (!back.ok) throw new Error(JSON.stringify(back.problems));
    const stored = (await loadModel(t.dataSource, modelId, 2)).model;
    expect(back.model.members[0]).toMatchObject({ section: 'IPE300', lb: 2.5 });
    // the catalogue section is no row of the workbook: the member's designation brings it back
    const sheet = (await workbookTables(res.body as Buffer)).find((s) => s.name === 'sections')!;
    expect(sheet.rows.map((r) => r[0])).toEqual(['section', 'B300', 'B400']);
    expectSame(comparable(back.model), comparable(stored));
    // version 1 is still there as it was
    const v1 = await readWorkbook((await download(modelId, 1)).body as Buffer);
    expect(v1.ok && v1.model.members[0].section).toBe('B300');
  });

  it('re-imports as a next version identical to the stored one (US sample)', async () => {
    const file = readFileSync(join('samples', 'portal-frame-building', 'portal-frame-building.xlsx'));
    const preview = await t.as('engineer').post(`/api/projects/${projectId}/imports`).attach('files', file, 'portal-frame-building.xlsx');
    expect(preview.status).toBe(201);
    const commit = await t.as('engineer').post(`/api/projects/${projectId}/imports/${preview.body.id}/commit`).send({});
    expect(commit.status).toBe(201);
    const id = commit.body.model.id as number;
    const res = await download(id, 1, 'engineer');
    const again = await t.as('engineer').post(`/api/projects/${projectId}/imports`).field('modelId', String(id))
      .attach('files', res.body as Buffer, 'round-trip.xlsx');
    expect(again.status).toBe(201);
    expect(again.body.canCommit).toBe(true);
    const next = await t.as('engineer').post(`/api/projects/${projectId}/imports/${again.body.id}/commit`).send({});
    expect(next.status).toBe(201);
    const v1 = (await loadModel(t.dataSource, id, 1)).model;
    const v2 = (await loadModel(t.dataSource, id, 2)).model;
    expect(v2.settings.units).toBe('us');
    expectSame(comparable(v2), comparable(v1));
  });

  it('gives the same tables as CSV files in a ZIP, which read back as the stored version', async () => {
    const res = await t.as('viewer').get(`/api/models/${modelId}/versions/2/workbook.zip`).buffer(true).parse(binary as never);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/zip');
    expect(res.headers['content-disposition']).toMatch(/-v2\.zip"$/);
    const files = unzip(res.body as Buffer);
    expect(files.map((f) => f.name)).toContain('members.csv');
    expect(files.find((f) => f.name === 'nodes.csv')!.text.split('\n')[0]).toBe('node,x [m],y [m],z [m]');
    const back = readCsvFiles(files);
    if (!back.ok) throw new Error(JSON.stringify(back.problems));
    expectSame(comparable(back.model), comparable((await loadModel(t.dataSource, modelId, 2)).model));
  });

  it('writes every sample as XLSX bytes that read back as the same model', async () => {
    for (const name of readdirSync('samples').filter((d) => !d.startsWith('.'))) {
      const original = await readWorkbook(readFileSync(join('samples', name, `${name}.xlsx`)), { fileName: name });
      if (!original.ok) throw new Error(`${name}: ${JSON.stringify(original.problems)}`);
      const back = await readWorkbook(await modelWorkbook(original.model));
      if (!back.ok) throw new Error(`${name}: ${JSON.stringify(back.problems)}`);
      expectSame(comparable(back.model), comparable(original.model), name);
    }
  }, 60_000);

  it('answers 404 for a version that does not exist, without a stack trace', async () => {
    const res = await t.as('viewer').get(`/api/models/${modelId}/versions/99/workbook.xlsx`);
    expect(res.status).toBe(404);
    expect(res.body.error.message).toMatch(/no version 99/);
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts/);
  });

  it('names the file after the model and version with plain characters', () => {
    expect(workbookFileName('Hall 3 / roof "A"', 4)).toBe('Hall-3-roof-A-v4.xlsx');
    expect(workbookFileName('///', 1)).toBe('model-v1.xlsx');
  });
});
