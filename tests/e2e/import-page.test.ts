/**
 * The import page in a real browser at 1440×900 (issue 13): after "read and check" the
 * problems come first, above the fold, errors first, with counts by table and a chip that
 * jumps to a table's problems; a capped list says "showing 1,000 of N"; an unusable header is
 * one error with the square-bracket hint; the settings list only what applies to the code,
 * with readable names.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { CSV } from '../server/models/fixture.js';
import { apiFromPage, chromiumAvailable, screenshot, signIn, startApp, stopApp, writeCsvs, type TrestleApp, createProject } from './harness.js';

const enabled = chromiumAvailable('import page');

/** The demo beam with problems in several tables: a round-bracket header, bad numbers, an unknown node, an unknown column. */
const BROKEN: Record<string, string> = {
  ...CSV,
  'materials.csv': 'material,E [MPa],nu,fy (MPa),fu [MPa],density [kg/m3],colour\nSteel355,210000,0.3,355,490,7850,blue\n',
  'nodes.csv': 'node,x [m],y [m]\nN1,0,0\nN2,six,0\nN3,12,0\n',
  'members.csv': 'member,start,end,section,material,group\nM1,N1,N2,B300,Steel355,beams\nM2,N2,N9,B300,Steel355,beams\n',
};

describe.skipIf(!enabled)('import page in the browser', () => {
  let app: TrestleApp;
  let page: Page;
  let work: string;
  let projectId = 0;

  beforeAll(async () => {
    app = await startApp();
    work = mkdtempSync(path.join(tmpdir(), 'trestle-e2e-import-'));
    page = await app.newPage();
    await page.setViewportSize({ width: 1440, height: 900 });
    await signIn(page, app.baseUrl, 'engineer@example.com');
    projectId = await createProject(page, 'Import page test project');
  }, 240_000);

  afterAll(async () => {
    await stopApp(app);
    if (work) rmSync(work, { recursive: true, force: true });
  });

  /** The grid's rows in display order, as { severity, table, message }. */
  async function gridRows(): Promise<{ severity: string; table: string; message: string }[]> {
    return page.locator('[data-test=import-problems] .ag-row').evaluateAll((rows) =>
      rows
        .map((r) => ({
          index: Number(r.getAttribute('row-index')),
          severity: r.querySelector('[col-id=severity]')?.textContent ?? '',
          table: r.querySelector('[col-id=table]')?.textContent ?? '',
          message: r.querySelector('[col-id=message]')?.textContent ?? '',
        }))
        .sort((a, b) => a.index - b.index),
    );
  }

  async function readAndCheck(files: Record<string, string>, dir: string): Promise<void> {
    await app.goto(page, `/projects/${projectId}/import`);
    await page.locator('[data-test=import-files] input[type=file]').setInputFiles(writeCsvs(path.join(work, dir), files));
    await page.locator('[data-test=import-upload]').click();
    await page.locator('[data-test=import-preview]').waitFor();
  }

  it('shows the problems first, above the fold, errors first, with counts by table and a jump to each table', async () => {
    await readAndCheck(BROKEN, 'broken');
    await page.locator('[data-test=import-blocked]').waitFor();
    const grid = page.locator('[data-test=import-problems]');
    await grid.waitFor();
    await page.locator('[data-test=import-problems] .ag-row').first().waitFor();
    const gridBox = (await grid.boundingBox())!;
    expect(gridBox.y).toBeLessThan(900 - 150); // its top rows are on the first screen
    // errors before the row counts and the settings
    const countsBox = (await page.locator('[data-test=import-counts]').boundingBox())!;
    expect(gridBox.y).toBeLessThan(countsBox.y);
    // the first rows are errors
    const severities = (await gridRows()).map((r) => r.severity);
    expect(severities[0]).toBe('error');
    expect(severities.indexOf('warning')).toBeGreaterThan(severities.lastIndexOf('error'));
    // counts by table, tables with errors first
    const chips = await page.locator('[data-test=problem-tables] .v-chip').allTextContents();
    expect(chips.map((c) => c.trim())).toEqual(expect.arrayContaining([expect.stringMatching(/^materials: 1 error · 1 warning$/), expect.stringMatching(/^nodes: 1 error$/), expect.stringMatching(/^members: 1 error$/)]));
    await screenshot(page, 'import-page-01-problems-first');
    await page.screenshot({ path: '/tmp/import-page-01-problems-first.png' });

    // the round-bracket header: one error with the hint, no "has no fy" follow-on
    await page.locator('[data-test=problem-table-materials]').click();
    await page.waitForTimeout(300);
    const rows = await gridRows();
    const messages = rows.map((r) => r.message);
    const tables = rows.map((r) => r.table);
    expect(new Set(tables)).toEqual(new Set(['materials']));
    expect(messages.some((m) => m.includes('units go in square brackets, as in fy [MPa]'))).toBe(true);
    expect(messages.some((m) => /has no fy/.test(m))).toBe(false);
    await screenshot(page, 'import-page-02-materials-chip');
    await page.screenshot({ path: '/tmp/import-page-02-materials-chip.png' });
    await page.locator('[data-test=problem-table-all]').click();
    expect(await page.locator('[data-test=problem-table-all]').count()).toBe(0);
  }, 120_000);

  it('says "showing 1,000 of N problems" with the counts by table when the list is capped', async () => {
    const rows = Array.from({ length: 1200 }, (_, i) => `P${i},x${i},0`).join('\n');
    await readAndCheck({ ...CSV, 'nodes.csv': `node,x [m],y [m]\nN1,0,0\nN2,6,0\nN3,12,0\n${rows}\n` }, 'capped');
    const note = page.locator('[data-test=import-capped]');
    await note.waitFor();
    expect(await note.textContent()).toMatch(/Showing 1,000 of 1,\d{3} problems/);
    const nodes = (await page.locator('[data-test=problem-table-nodes]').textContent())!.trim();
    expect(nodes).toMatch(/^nodes: 1,200 errors/);
    await page.screenshot({ path: '/tmp/import-page-03-capped.png' });
  }, 120_000);

  it('lists only the settings that apply to the code, with readable names', async () => {
    await readAndCheck(CSV, 'en');
    await page.locator('[data-test=import-ok]').waitFor();
    const settings = page.locator('[data-test=import-settings]');
    const text = (await settings.textContent())!;
    expect(text).toContain('EN 1993-1-1');
    expect(text).toContain('Metric (kN, m, MPa)');
    expect(await page.locator('[data-test=setting-gamma_m1]').count()).toBe(1);
    expect(text).not.toMatch(/en1993-1-1|\bmetric\b|first_order/);
    await page.screenshot({ path: '/tmp/import-page-04-settings-en.png' });

    await readAndCheck({ ...CSV, 'settings.csv': 'key,value\ntitle,AISC beam\nunits,metric\ndesign_code,aisc360-lrfd\n' }, 'aisc');
    await page.locator('[data-test=import-ok]').waitFor();
    const aisc = (await page.locator('[data-test=import-settings]').textContent())!;
    expect(aisc).toContain('AISC 360-22 (LRFD)');
    expect(await page.locator('[data-test=setting-gamma_m1]').count()).toBe(0);
    expect(aisc).not.toContain('γM');
  }, 120_000);

  it('gives lengths in feet in the problems of a US model', async () => {
    const us: Record<string, string> = {
      'settings.csv': 'key,value\ntitle,US beam\nunits,us\ndesign_code,aisc360-lrfd\n',
      'materials.csv': 'material,E,nu,fy,fu,density\nA992,29000,0.3,50,65,490\n',
      'nodes.csv': 'node,x,y\nN1,0,0\nN2,20,0\nN3,40,0\n',
      'supports.csv': 'node,ux,uy\nN1,1,1\nN2,0,1\nN3,0,1\n',
      'members.csv': 'member,start,end,section,material\nM1,N1,N2,W12X26,A992\nM2,N2,N3,W12X26,A992\n',
      'cases.csv': 'case,category,title\nL,live,Floor\n',
      'member_loads.csv': 'case,member,kind,direction,w1,a\nL,M1,point,global_y,-10,25\n',
    };
    await readAndCheck(us, 'us');
    await page.locator('[data-test=import-blocked]').waitFor();
    await page.locator('[data-test=import-problems] .ag-row').first().waitFor();
    const messages = (await gridRows()).map((r) => r.message);
    expect(messages).toContain('a = 25 ft is beyond the end of member M1, whose length is 20 ft');
    expect(messages.some((m) => / m\b/.test(m))).toBe(false);
    await page.screenshot({ path: '/tmp/import-page-05-us-feet.png' });
  }, 120_000);

  it('reads the blank workbook from the page without a warning or an error', async () => {
    await app.goto(page, `/projects/${projectId}/import`);
    const [download] = await Promise.all([page.waitForEvent('download'), page.locator('[data-test=template-metric]').click()]);
    const file = path.join(work, 'blank-metric.xlsx');
    await download.saveAs(file);
    await page.locator('[data-test=import-files] input[type=file]').setInputFiles([file]);
    await page.locator('[data-test=import-upload]').click();
    const ok = page.locator('[data-test=import-ok]');
    await ok.waitFor();
    expect((await ok.textContent())!.trim()).toBe('No errors. Ready to save.');
    expect(await page.locator('[data-test=import-problems]').count()).toBe(0);
  }, 120_000);
});
