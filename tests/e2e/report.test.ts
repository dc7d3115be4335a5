/**
 * The calculation package in a real browser: import the two-span demo beam, run it, open the
 * "Calculation package" dialog, write the PDF for all members with progress, download it and
 * read its pages (count, cover, one record's clause and ratio as the member page shows them);
 * then the member page under the print stylesheet (no app bar or navigation, records open).
 */
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { CSV } from '../server/models/fixture.js';
import { readPdf } from '../server/reports/pdf-text.js';
import { ARTIFACTS_DIR, apiFromPage, chromiumAvailable, screenshot, signIn, startApp, stopApp, type TrestleApp, createProject } from './harness.js';

const enabled = chromiumAvailable('report');

describe.skipIf(!enabled)('calculation package in the browser', () => {
  let app: TrestleApp;
  let page: Page;
  let work: string;
  let projectId = 0;
  let runId = 0;

  beforeAll(async () => {
    app = await startApp();
    work = mkdtempSync(path.join(tmpdir(), 'trestle-e2e-report-'));
    page = await app.newPage();
    await signIn(page, app.baseUrl, 'engineer@example.com');
    projectId = await createProject(page, 'Package test project');
  }, 300_000);

  afterAll(async () => {
    await stopApp(app);
    if (work) rmSync(work, { recursive: true, force: true });
  });

  it('writes the package for all members and downloads it', async () => {
    const dir = path.join(work, 'beam');
    mkdirSync(dir, { recursive: true });
    const files = Object.entries(CSV).map(([name, text]) => {
      writeFileSync(path.join(dir, name), text);
      return path.join(dir, name);
    });
    await app.goto(page, `/projects/${projectId}`);
    await page.locator('[data-test=import-model]').click();
    await page.waitForURL((u) => u.pathname.endsWith('/import'));
    await page.locator('[data-test=import-files] input[type=file]').setInputFiles(files);
    await page.locator('[data-test=import-upload]').click();
    await page.locator('[data-test=import-ok]').waitFor();
    await page.locator('[data-test=import-commit]').click();
    await page.waitForURL((u) => /^\/models\/\d+$/.test(u.pathname));
    await page.locator('[data-test=run-model]').click();
    await page.locator('[data-test=results-caption]').waitFor({ timeout: 90_000 });

    await page.locator('[data-test=calc-package-open]').click();
    const dialog = page.locator('[data-test=calc-package-dialog]');
    await dialog.waitFor();
    await expect.poll(() => dialog.textContent()).toMatch(/All members \(2\)/);
    await page.locator('[data-test=calc-package-all] input').check();
    await page.locator('[data-test=calc-package-generate]').click();
    await page.locator('[data-test=calc-package-download]').waitFor({ timeout: 90_000 });
    expect(await page.locator('[data-test=calc-package-progress]').textContent()).toMatch(/Ready: \d+ pages/);
    await screenshot(page, 'report-01-dialog-ready');
    const [download] = await Promise.all([page.waitForEvent('download'), page.locator('[data-test=calc-package-download]').click()]);
    expect(download.suggestedFilename()).toMatch(/-run\d+-calculation-package\.pdf$/);
    mkdirSync(ARTIFACTS_DIR, { recursive: true });
    const saved = path.join(ARTIFACTS_DIR, 'report-e2e-package.pdf');
    await download.saveAs(saved);
    runId = Number(/-run(\d+)-/.exec(download.suggestedFilename())![1]);

    const pdf = readPdf(readFileSync(saved));
    expect(pdf.pageCount).toBeGreaterThanOrEqual(5);
    expect(pdf.pageCount).toBeLessThanOrEqual(12);
    const cover = pdf.pages[0].join('\n');
    for (const text of ['Calculation package', 'Package test project', 'Two-span demo beam', 'Model version 1', `Run ${runId}`, 'Analysis order first order', 'Run by', 'all members (2)']) {
      expect(cover).toContain(text);
    }
    const detail = await apiFromPage(page, 'GET', `/api/runs/${runId}/members/M2`);
    const rec = (detail.body as { governingRecords: { clause: string; title: string; ratio: number | null; status: string }[] }).governingRecords.find((r) => r.ratio !== null)!;
    const all = pdf.pages.map((p) => p.join('\n')).join('\n');
    expect(all).toContain(`${rec.clause} — ${rec.title}`);
    expect(all).toContain(`ratio ${rec.ratio!.toFixed(3)} · ${rec.status}`);
  }, 240_000);

  it('prints the member page without app bar or navigation, every record open', async () => {
    await app.goto(page, `/runs/${runId}/members/M1`);
    await page.locator('[data-test=check-record]').first().waitFor();
    await page.emulateMedia({ media: 'print' });
    expect(await page.locator('.v-app-bar').isVisible()).toBe(false);
    expect(await page.locator('.v-navigation-drawer').isVisible()).toBe(false);
    expect(await page.locator('[data-test=member-comments]').isVisible()).toBe(false);
    const records = page.locator('[data-test=check-record]');
    const count = await records.count();
    expect(count).toBeGreaterThan(0);
    for (let i = 0; i < count; i++) expect(await records.nth(i).locator('.equation').isVisible()).toBe(true);
    await screenshot(page, 'report-02-member-print');
    await page.emulateMedia({ media: 'screen' });
    expect(await records.first().locator('.equation').isVisible()).toBe(false);
  }, 120_000);
});
