/**
 * Stability results in a real browser: import a small portal frame with `modes = 3` and
 * `buckling_modes = 2` under EN 1993-1-1 (first order), run it, see the stability banner over
 * the grid, open the summary (analysis order, αcr lowest first coloured against 10, the
 * modes table), draw mode 1 in the picture and let it swing, and read the member detail's
 * statement of which analysis its diagrams come from. Screenshots in test-artifacts/.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { apiFromPage, chromiumAvailable, screenshot, signIn, startApp, stopApp, type TrestleApp, writeCsvs, createProject } from './harness.js';

const enabled = chromiumAvailable('stability');

/**
 * A fixed-base portal frame of our own (invented numbers: demo data), Y up, 6 m × 4 m, with a
 * heavy roof load so that the lowest αcr of each strength combination falls below 10.
 */
const CSV: Record<string, string> = {
  'settings.csv': 'key,value\ntitle,Stability portal\nunits,metric\ndesign_code,en1993-1-1\nmodes,3\nbuckling_modes,2\n',
  'materials.csv': 'material,E [MPa],nu,fy [MPa],fu [MPa],density [kg/m3]\nS355,210000,0.3,355,490,7850\n',
  'sections.csv': 'section,shape,d [mm],bf [mm],tf [mm],tw [mm]\nCOL,i,200,200,15,9\nBM,i,300,150,10.7,7.1\n',
  'nodes.csv': 'node,x [m],y [m]\nA,0,0\nB,0,4\nC,6,4\nD,6,0\n',
  'supports.csv': 'node,ux,uy,rz\nA,1,1,1\nD,1,1,1\n',
  'members.csv': 'member,start,end,section,material,group\nC1,A,B,COL,S355,columns\nB1,B,C,BM,S355,beams\nC2,D,C,COL,S355,columns\n',
  'cases.csv': 'case,category,title,self_weight,mass\nG,dead,Roof and plant,1,yes\nW,wind,Wind from the left,0,no\n',
  'member_loads.csv': 'case,member,kind,direction,w1\nG,B1,uniform,global_y,-150\n',
  'node_loads.csv': 'case,node,fx [kN]\nW,B,10\n',
  'combinations.csv': 'combination,case,factor,limit_state\nULS-1,G,1.35,strength\nULS-1,W,1.5,strength\nULS-2,G,1.35,strength\nSLS-1,G,1,service\n',
};

describe.skipIf(!enabled)('stability results in the browser', () => {
  let app: TrestleApp;
  let page: Page;
  let work: string;
  let projectId = 0;

  beforeAll(async () => {
    app = await startApp();
    work = mkdtempSync(path.join(tmpdir(), 'trestle-e2e-stability-'));
    page = await app.newPage();
    await signIn(page, app.baseUrl, 'engineer@example.com');
    projectId = await createProject(page, 'Stability test project');
  }, 300_000);

  afterAll(async () => {
    await stopApp(app);
    if (work) rmSync(work, { recursive: true, force: true });
  });

  it('imports the frame, runs it and warns over the grid', async () => {
    await app.goto(page, `/projects/${projectId}`);
    await page.locator('[data-test=import-model]').click();
    await page.waitForURL((u) => u.pathname.endsWith('/import'));
    await page.locator('[data-test=import-files] input[type=file]').setInputFiles(writeCsvs(path.join(work, 'portal'), CSV));
    await page.locator('[data-test=import-upload]').click();
    await page.locator('[data-test=import-ok]').waitFor();
    await page.locator('[data-test=import-commit]').click();
    await page.waitForURL((u) => /^\/models\/\d+$/.test(u.pathname));

    await page.locator('[data-test=run-model]').click();
    await page.locator('[data-test=results-caption]').waitFor({ timeout: 90_000 });
    expect(await page.locator('[data-test=results-analysis-order]').textContent()).toBe('first order');
    const banner = page.locator('[data-test=results-stability-banner]');
    await banner.waitFor();
    expect(await banner.textContent()).toMatch(/ULS-1/);
    await screenshot(page, 'stability-01-results-banner');
  }, 180_000);

  it('shows the summary: order, αcr lowest first coloured against 10, and the modes table', async () => {
    await page.locator('[data-test=tab-summary]').click();
    await page.locator('[data-test=stability-summary]').waitFor();
    expect(await page.locator('[data-test=analysis-order]').textContent()).toBe('First order');
    expect(await page.locator('[data-test=analysis-method]').textContent()).toMatch(/first-order elastic/);
    const alphas = page.locator('[data-test=alpha-row]');
    await expect.poll(() => alphas.count()).toBe(2);
    const values = (await page.locator('[data-test=alpha-value]').allTextContents()).map((v) => Number(v.trim()));
    expect(values[0]).toBeLessThanOrEqual(values[1]);
    expect(values[0]).toBeGreaterThan(1);
    expect(values[0]).toBeLessThan(10);
    expect(await page.locator('[data-test=alpha-value]').first().getAttribute('data-band')).toBe('low');
    const modes = page.locator('[data-test=mode-row]');
    await expect.poll(() => modes.count()).toBe(3);
    const f = (await modes.locator('td:nth-child(2)').allTextContents()).map(Number);
    expect(f[0]).toBeGreaterThan(0);
    expect(f[0]).toBeLessThanOrEqual(f[1]);
    await page.locator('[data-test=stability-warnings]').waitFor();
    await screenshot(page, 'stability-02-summary');
  }, 60_000);

  it('draws mode 1 in the picture and swings it with play and pause', async () => {
    await page.locator('[data-test=show-mode-1]').click();
    await page.locator('[data-test=picture-canvas]').waitFor();
    const label = page.locator('[data-test=picture-shape-label]');
    await label.waitFor();
    expect(await label.textContent()).toMatch(/^mode 1: [\d.]+ Hz/);
    const play = page.locator('[data-test=picture-shape-play]');
    await play.click();
    expect(await play.textContent()).toMatch(/Pause/);
    await page.waitForTimeout(500);
    await screenshot(page, 'stability-03-mode-shape');
    await play.click();
    expect(await play.textContent()).toMatch(/Play/);
  }, 60_000);

  it('says in the member detail which analysis the diagrams come from', async () => {
    const models = (await apiFromPage(page, 'GET', `/api/projects/${projectId}/models`)).body as { lastRun: { id: number } | null }[];
    const id = models[0]?.lastRun?.id ?? 0;
    expect(id).toBeGreaterThan(0);
    await app.goto(page, `/runs/${id}/members/C1`);
    const line = page.locator('[data-test=member-analysis]');
    await line.waitFor();
    expect(await line.textContent()).toMatch(/first-order analysis/);
    await screenshot(page, 'stability-04-member-detail');
  }, 60_000);
});
