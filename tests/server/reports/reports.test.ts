/** Calculation package (PDF) of a run: job, progress, streamed file, its pages and text. */
import { writeFileSync, mkdirSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { REPORT_CAUTION } from '../../../server/reports/report-pdf.js';
import { reportSettled } from '../../../server/reports/report.service.js';
import { closeRunPool } from '../../../server/runs/worker-pool.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { importDemo, newProject } from '../models/fixture.js';
import { settle } from '../runs/poll.js';
import { readPdf } from './pdf-text.js';

let t: TestApp;
let runId: number;
let modelId: number;

const binary = (r: NodeJS.ReadableStream, cb: (err: Error | null, body: Buffer) => void) => {
  const parts: Buffer[] = [];
  r.on('data', (c: Buffer) => parts.push(c));
  r.on('end', () => cb(null, Buffer.concat(parts)));
};

async function pdfOf(role: 'engineer' | 'viewer' | 'lead', members: unknown) {
  const start = await t.as(role).post(`/api/runs/${runId}/reports`).send({ members });
  expect(start.status).toBe(202);
  await reportSettled(start.body.id);
  const job = await t.as(role).get(`/api/runs/${runId}/reports/${start.body.id}`);
  const file = await t.as(role).get(`/api/runs/${runId}/reports/${start.body.id}/file`).buffer(true).parse(binary as never);
  return { start: start.body, job: job.body, file };
}

beforeAll(async () => {
  t = await createTestApp();
  const projectId = await newProject(t, 'Harbour shed');
  for (const role of ['lead', 'viewer']) {
    expect((await t.as('admin').post(`/api/projects/${projectId}/members`).send({ email: `${role}@example.com`, role })).status).toBe(201);
  }
  modelId = await importDemo(t, projectId);
  runId = (await t.as('engineer').post(`/api/models/${modelId}/runs`).send({})).body.id;
  await settle(t, runId);
  expect((await t.as('engineer').post(`/api/runs/${runId}/review/submit`).send({ message: 'ready for checking' })).status).toBe(200);
  expect((await t.as('lead').post(`/api/runs/${runId}/review/approve`).send({ message: 'checked' })).status).toBe(200);
}, 120_000);
afterAll(async () => {
  await closeRunPool();
  await t.close();
});

describe('calculation package', () => {
  it('writes every member’s record with cover, contents, schedule and the caution on every page', async () => {
    const { start, job, file } = await pdfOf('engineer', 'all');
    expect(start).toMatchObject({ runId, phase: 'gathering', total: 2 });
    expect(job).toMatchObject({ phase: 'done', done: 2, total: 2 });
    expect(file.status).toBe(200);
    expect(file.headers['content-type']).toBe('application/pdf');
    expect(file.headers['content-disposition']).toMatch(/calculation-package\.pdf/);
    const body = file.body as Buffer;
    expect(body.subarray(0, 5).toString()).toBe('%PDF-');
    mkdirSync('test-artifacts', { recursive: true });
    writeFileSync('test-artifacts/calculation-package.pdf', body);
    const pdf = readPdf(body);
    // cover, contents, inputs, schedule, and the two members' records (several pages each at most)
    expect(pdf.pageCount).toBe(job.pages);
    expect(pdf.pageCount).toBeGreaterThanOrEqual(5);
    expect(pdf.pageCount).toBeLessThanOrEqual(12);
    expect(pdf.pages).toHaveLength(pdf.pageCount);
    pdf.pages.forEach((lines, i) => {
      expect(lines.join('\n')).toContain(REPORT_CAUTION);
      expect(lines.join('\n')).toContain(`Page ${i + 1} of ${pdf.pageCount}`);
    });
    const cover = pdf.pages[0].join('\n');
    for (const text of ['Calculation package', 'Harbour shed', 'Two-span demo beam', 'Model version 1', `Run ${runId}`, 'en1993-1-1', 'Analysis order first order', 'Run by', 'submitted by', 'ready for checking', 'approved by', 'Trestle 0.1.0']) {
      expect(cover).toContain(text);
    }
    const all = pdf.pages.map((p) => p.join('\n')).join('\n');
    expect(all).toContain('Utilisation schedule');
    expect(all).toContain('Member M1');
    // one record as the member page shows it: its clause and its ratio to three decimals
    const detail = await t.as('engineer').get(`/api/runs/${runId}/members/M1`);
    const rec = (detail.body.governingRecords as { clause: string; title: string; ratio: number | null; status: string }[]).find((r) => r.ratio !== null)!;
    expect(all).toContain(`${rec.clause} — ${rec.title}`);
    expect(all).toContain(`ratio ${rec.ratio!.toFixed(3)} · ${rec.status}`);
  }, 120_000);

  it('takes failing or selected members only, and names them on the cover', async () => {
    const counts = (await t.as('engineer').get(`/api/runs/${runId}/members`)).body.counts as { fail: number };
    const failing = await pdfOf('engineer', 'failing');
    expect(failing.job).toMatchObject({ phase: 'done', total: counts.fail });
    expect(readPdf(failing.file.body).pages[0].join('\n')).toContain(`failing members (${counts.fail})`);
    const chosen = await pdfOf('engineer', ['M2']);
    const text = readPdf(chosen.file.body).pages.map((p) => p.join('\n')).join('\n');
    expect(text).toContain('selected members (1)');
    expect(text).toContain('Member M2');
    expect(text).not.toContain('Member M1');
  }, 120_000);

  it('lets a viewer print an approved run, and finds a package only under its own run', async () => {
    const { start, file } = await pdfOf('viewer', 'failing');
    expect(file.status).toBe(200);
    const otherRun = (await t.as('engineer').post(`/api/models/${modelId}/runs`).send({})).body.id as number;
    await settle(t, otherRun);
    expect((await t.as('engineer').get(`/api/runs/${otherRun}/reports/${start.id}/file`)).status).toBe(404);
    expect((await t.as('engineer').get(`/api/runs/${runId}/reports/00000000-0000-0000-0000-000000000000`)).status).toBe(404);
  }, 120_000);

  it('refuses unknown members and bad selections with 400 and no stack trace', async () => {
    const unknown = await t.as('engineer').post(`/api/runs/${runId}/reports`).send({ members: ['M99'] });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.message).toContain('M99');
    const bad = await t.as('engineer').post(`/api/runs/${runId}/reports`).send({ members: 'some' });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).not.toMatch(/at .*\.ts:\d+/);
  });
});
