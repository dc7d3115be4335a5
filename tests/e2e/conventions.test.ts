/**
 * In a real browser at 1440×900: the help page on axes, signs and units with its drawings;
 * its links from the import page and from import problems about directions; the workbook
 * download of a model version, read back by the importer.
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { readWorkbook } from '../../shared/reader/index.js';
import { CSV } from '../server/models/fixture.js';
import { apiFromPage, chromiumAvailable, screenshot, signIn, startApp, stopApp, type TrestleApp, createProject } from './harness.js';

const enabled = chromiumAvailable('conventions');

describe.skipIf(!enabled)('conventions page and model workbook in the browser', () => {
  let app: TrestleApp;
  let page: Page;
  let work: string;
  let projectId = 0;

  beforeAll(async () => {
    app = await startApp();
    work = mkdtempSync(path.join(tmpdir(), 'trestle-e2e-conventions-'));
    page = await app.newPage();
    await page.setViewportSize({ width: 1440, height: 900 });
    await signIn(page, app.baseUrl, 'engineer@example.com');
    projectId = await createProject(page, 'Conventions test project');
  }, 240_000);

  afterAll(async () => {
    await stopApp(app);
    if (work) rmSync(work, { recursive: true, force: true });
  });

  it('shows every section with its drawing, opening at the section a link names', async () => {
    await app.goto(page, '/help/conventions');
    await page.locator('[data-test=conventions-page]').waitFor();
    for (const f of ['global-axes', 'local-axes', 'roll', 'internal-forces', 'beam-signs', 'load-directions']) {
      const box = await page.locator(`[data-test=figure-${f}]`).boundingBox();
      expect(box, f).not.toBeNull();
      expect(box!.width, f).toBeGreaterThan(300);
    }
    expect(await page.locator('[data-test=units-table] tbody tr').count()).toBe(17);
    await screenshot(page, 'conventions-01-full-page');
    await page.screenshot({ path: path.join('test-artifacts', 'conventions-02-top.png') });
    for (const [i, id] of ['local-axes', 'internal-forces', 'load-directions', 'units'].entries()) {
      await app.goto(page, `/help/conventions#${id}`);
      await page.locator(`#${id}`).waitFor();
      await page.waitForTimeout(300);
      const top = (await page.locator(`#${id}`).boundingBox())!.y;
      expect(top, id).toBeGreaterThanOrEqual(0);
      expect(top, id).toBeLessThan(200);
      await page.screenshot({ path: path.join('test-artifacts', `conventions-0${i + 3}-${id}.png`) });
    }
    expect(app.externalRequests).toEqual([]);
  }, 120_000);

  it('links to the page from the import page and from a problem about a load direction', async () => {
    await app.goto(page, `/projects/${projectId}/import`);
    const link = page.locator('[data-test=import-conventions]');
    await link.waitFor();
    expect(await link.getAttribute('href')).toBe('/help/conventions');
    const files = Object.entries({ ...CSV, 'member_loads.csv': 'case,member,kind,direction,w1\nD,M1,uniform,down,-5\nD,M2,uniform,global_y,-5\n' }).map(([name, text]) => {
      const file = path.join(work, name);
      writeFileSync(file, text);
      return file;
    });
    await page.locator('[data-test=import-files] input[type=file]').setInputFiles(files);
    await page.locator('[data-test=import-upload]').click();
    await page.locator('[data-test=import-blocked]').waitFor();
    const hint = page.locator('[data-test=conventions-link-load-directions]');
    await hint.waitFor();
    expect(await hint.getAttribute('href')).toBe('/help/conventions#load-directions');
    await page.locator('[data-test=conventions-hint]').scrollIntoViewIfNeeded();
    await screenshot(page, 'conventions-07-import-hint');
  }, 120_000);

  it('downloads a version as the import workbook, which reads back as the same model', async () => {
    const files = Object.entries(CSV).map(([name, text]) => {
      const file = path.join(work, name);
      writeFileSync(file, text);
      return file;
    });
    await app.goto(page, `/projects/${projectId}/import`);
    await page.locator('[data-test=import-files] input[type=file]').setInputFiles(files);
    await page.locator('[data-test=import-upload]').click();
    await page.locator('[data-test=import-ok]').waitFor();
    await page.locator('[data-test=import-commit]').click();
    await page.waitForURL((u) => /^\/models\/\d+$/.test(u.pathname));
    const modelId = Number(new URL(page.url()).pathname.split('/').pop());
    await page.locator('[data-test=workbook-menu]').click();
    await page.locator('[data-test=workbook-v1]').waitFor();
    await screenshot(page, 'conventions-08-workbook-menu');
    const [download] = await Promise.all([page.waitForEvent('download'), page.locator('[data-test=workbook-v1]').click()]);
    const saved = path.join(work, 'downloaded.xlsx');
    await download.saveAs(saved);
    expect(download.suggestedFilename()).toMatch(/-v1\.xlsx$/);
    const back = await readWorkbook(readFileSync(saved));
    expect(back.ok).toBe(true);
    if (back.ok) expect(back.model.members.map((m) => m.section)).toEqual(['B300', 'B300']);
    expect(modelId).toBeGreaterThan(0);
  }, 120_000);
});
