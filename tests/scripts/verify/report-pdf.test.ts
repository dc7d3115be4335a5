/**
 * The PDF of the verification report is laid out from the same report as the HTML: every
 * problem appears with its source and comparisons; version, date, counts and the caution on
 * the title page; "Page i of n" on every page. Served beside the HTML under /verification.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import express from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { buildReport, num, type VitestJson } from '../../../scripts/verify/report.js';
import { renderPdf } from '../../../scripts/verify/report-pdf.js';
import { verificationRouter } from '../../../server/verification/verification.router.js';
import { readPdf } from '../../server/reports/pdf-text.js';

const ROOT = '/repo';
const many = (n: number) =>
  Array.from({ length: n }, (_, i) => ({
    ancestorTitles: ['cantilever'],
    fullName: `cantilever case ${i + 1}`,
    title: `case ${i + 1}: δ = PL³/(3EI) (closed form)`,
    status: i === 3 ? 'failed' : 'passed',
    location: { line: 1 + i, column: 1 },
    meta: { verification: [{ kind: 'within', quantity: 'δ', expected: 20.8333 + i, computed: 20.8334 + i, difference: 1e-4, tolerance: 'rtol 1e-5' }] },
  }));
const JSON_REPORT: VitestJson = {
  testResults: [
    { name: `${ROOT}/tests/shared/engine/cantilever.test.ts`, assertionResults: many(60) },
    {
      name: `${ROOT}/tests/shared/design/en.test.ts`,
      assertionResults: [
        { ancestorTitles: [], fullName: 'χ per EN 1993-1-1 6.3.1', title: 'χ per EN 1993-1-1 6.3.1', status: 'passed', location: { line: 1, column: 1 },
          meta: { verification: [{ kind: 'bound', value: 3e-12, bound: 1e-9, relation: '≤' }] } },
        { ancestorTitles: [], fullName: 'not yet', title: 'not yet', status: 'skipped', location: { line: 6, column: 1 } },
      ],
    },
  ],
};
const report = buildReport(JSON_REPORT, { software: 'Trestle', version: '0.1.0 (commit abc1234)', date: '2026-12-05 18:00:00 UTC', root: ROOT, readFile: () => undefined });

describe('verification report PDF', () => {
  it('lists every problem of the report with its numbers, over numbered pages', async () => {
    const pdf = readPdf(await renderPdf(report, { compress: false }));
    const text = pdf.pages.map((p) => p.join(' ')).join('\n');
    const all = text.replace(/\s+/g, ' ');
    const problems = report.chapters.flatMap((c) => c.files.flatMap((f) => f.problems));
    expect(problems).toHaveLength(62);
    for (const p of problems) expect(all).toContain(p.description.replace(/\s+/g, ' '));
    expect(all.match(/PASSED/g)).toHaveLength(60);
    expect(all.match(/FAILED/g)).toHaveLength(1);
    expect(all.match(/SKIPPED/g)).toHaveLength(1);
    for (let i = 0; i < 60; i++) expect(all).toContain(num(20.8333 + i)); // the registered expected values, as the HTML prints them
    expect(all).toContain('rtol 1e-5');
    expect(all).toContain('≤ 1e-9');
    expect(pdf.pages[0].join(' ')).toMatch(/Software version 0\.1\.0 \(commit abc1234\)/);
    expect(pdf.pages[0].join(' ')).toMatch(/62 problems: 60 passed, 1 failed, 1 skipped/);
    expect(pdf.pageCount).toBeGreaterThan(2);
    pdf.pages.forEach((p, i) => {
      expect(p.join(' ')).toContain(`Page ${i + 1} of ${pdf.pageCount}`);
      expect(p.join(' ')).toMatch(/competent engineer/);
    });
  });

  it('is served at /verification/report.pdf once generated', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'trestle-verify-pdf-'));
    try {
      const app = express().use('/verification', verificationRouter(dir));
      expect((await request(app).get('/verification/report.pdf')).status).toBe(404);
      writeFileSync(path.join(dir, 'report.pdf'), await renderPdf(report));
      const res = await request(app).get('/verification/report.pdf');
      expect(res.status).toBe(200);
      expect(res.headers['content-type']).toMatch(/application\/pdf/);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
