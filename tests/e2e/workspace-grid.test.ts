/**
 * The workspace defects of issue 13 about the grids and the main flow, in a real browser:
 * the main flow driven with the keyboard only (import, run, grid, member, back), the cell
 * editor pop-ups opaque in both themes, a not-checked member's reason and a combination's
 * factors in the grid, member ids as links (Ctrl+click opens a new tab, Enter opens one),
 * undo and the prompt before unsaved edits are lost, the people card's name, what a viewer
 * is told before any approved run, and the dark theme remembered per user.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { FileChooser, Page } from 'playwright-core';
import { apiFromPage, chromiumAvailable, screenshot, signIn, startApp, stopApp, writeCsvs, type TrestleApp, createProject } from './harness.js';

const enabled = chromiumAvailable('workspace-grid');

// Browser globals used inside page.evaluate callbacks (the tests' tsconfig has no DOM library).
declare const document: any; // eslint-disable-line @typescript-eslint/no-explicit-any
declare const window: any; // eslint-disable-line @typescript-eslint/no-explicit-any
declare const getComputedStyle: any; // eslint-disable-line @typescript-eslint/no-explicit-any
declare const Event: any; // eslint-disable-line @typescript-eslint/no-explicit-any
declare const DataTransfer: any; // eslint-disable-line @typescript-eslint/no-explicit-any
declare const ClipboardEvent: any; // eslint-disable-line @typescript-eslint/no-explicit-any

/**
 * A two-span beam of our own (invented numbers: demo data), EN 1993-1-1. M2's web is so thin
 * (hw/tw = 876/3 = 292 > 72ε/η) that its shear resistance needs EN 1993-1-5 shear buckling,
 * which is outside our scope: M2 is `not checked` with that reason (EN 1993-1-1 6.2.6(6)).
 */
const CSV: Record<string, string> = {
  'settings.csv': 'key,value\ntitle,Keyboard demo beam\nunits,metric\ndesign_code,en1993-1-1\n',
  'materials.csv': 'material,E [MPa],nu,fy [MPa],fu [MPa],density [kg/m3],alpha [1/C]\nSteel355,210000,0.3,355,490,7850,0.000012\n',
  'sections.csv': 'section,shape,d [mm],bf [mm],tf [mm],tw [mm]\nB300,i,300,150,10.7,7.1\nB400,i,400,180,13.5,8.6\nTHINWEB,i,900,200,12,3\n',
  'nodes.csv': 'node,x [m],y [m]\nN1,0,0\nN2,6,0\nN3,12,0\n',
  'supports.csv': 'node,ux,uy\nN1,1,1\nN2,0,1\nN3,0,1\n',
  'members.csv': 'member,start,end,section,material,group\nM1,N1,N2,B300,Steel355,beams\nM2,N2,N3,THINWEB,Steel355,beams\n',
  'cases.csv': 'case,category,title,self_weight\nD,dead,Dead load,1\nL,live,Floor load,0\n',
  'member_loads.csv': 'case,member,kind,direction,w1\nD,M1,uniform,global_y,-5\nD,M2,uniform,global_y,-5\nL,M1,uniform,global_y,-12\nL,M2,uniform,global_y,-12\n',
  'combinations.csv': 'combination,case,factor,limit_state\nULS,D,1.35,strength\nULS,L,1.5,strength\nSLS,D,1,service\nSLS,L,1,service\n',
};

function cell(page: Page, member: string, colId: string) {
  return page.locator(`[data-test=results-grid] .ag-row[row-id="${member}"] [col-id="${colId}"]`);
}

/** Presses Tab until the focused element matches (or is inside) the selector; fails after `max` presses. */
async function tabTo(page: Page, selector: string, max = 80): Promise<void> {
  for (let i = 0; i < max; i++) {
    const found = await page.evaluate((sel) => !!document.activeElement?.closest(sel), selector);
    if (found) return;
    await page.keyboard.press('Tab');
  }
  throw new Error(`Tab never reached ${selector}`);
}

/**
 * Tabs to a file input and opens its chooser with Space. The focus must sit on the input
 * itself (not on another part of the field); on a loaded machine Space is pressed again if
 * the chooser has not opened within ten seconds (once the page has settled, the first press does).
 */
async function chooserFromKeyboard(page: Page, input: string): Promise<FileChooser> {
  for (let attempt = 1; ; attempt++) {
    await tabTo(page, input);
    try {
      const [chooser] = await Promise.all([page.waitForEvent('filechooser', { timeout: 10_000 }), page.keyboard.press('Space')]);
      return chooser;
    } catch (err) {
      if (attempt >= 3) throw err;
    }
  }
}

/** Alpha of an element's computed background colour (1 = opaque). */
function backgroundOf(page: Page, selector: string): Promise<{ color: string; alpha: number }> {
  return page.evaluate((sel) => {
    const color: string = getComputedStyle(document.querySelector(sel)).backgroundColor;
    const m = /rgba?\(([^)]+)\)/.exec(color);
    const parts = m ? m[1].split(/[ ,/]+/).filter(Boolean).map(Number) : [];
    return { color, alpha: parts.length === 4 ? parts[3] : parts.length === 3 ? 1 : 0 };
  }, selector);
}

async function tooltipOf(page: Page, target: ReturnType<typeof cell>): Promise<string> {
  await page.mouse.move(0, 0);
  await page.locator('.ag-tooltip').waitFor({ state: 'detached' }).catch(() => undefined);
  await target.hover();
  const tip = page.locator('.ag-tooltip');
  await tip.waitFor();
  return (await tip.textContent()) ?? '';
}

describe.skipIf(!enabled)('workspace grid and main flow in the browser', () => {
  let app: TrestleApp;
  let page: Page;
  let work: string;
  let projectId = 0;
  let modelId = 0;
  let runId = 0;

  beforeAll(async () => {
    work = mkdtempSync(path.join(tmpdir(), 'trestle-workspace-'));
    app = await startApp();
    page = await app.newPage();
    await page.setViewportSize({ width: 1440, height: 900 });
    await signIn(page, app.baseUrl, 'engineer@example.com');
    projectId = await createProject(page, 'Keyboard project');
  }, 180_000);

  afterAll(async () => {
    await stopApp(app);
    if (work) rmSync(work, { recursive: true, force: true });
  });

  it('imports, runs, opens a member from the grid and comes back with the keyboard only', async () => {
    const files = writeCsvs(path.join(work, 'model'), CSV);
    await app.goto(page, `/projects/${projectId}`);
    await page.locator('[data-test=import-model]').waitFor();

    // project page → import page
    await tabTo(page, '[data-test=import-model]');
    await page.keyboard.press('Enter');
    await page.waitForURL((u) => u.pathname.endsWith('/import'));
    await page.locator('[data-test=import-files]').waitFor();

    // the file input is reachable and opens the file chooser from the keyboard
    const chooser = await chooserFromKeyboard(page, '[data-test=import-files] input[type=file]');
    await chooser.setFiles(files);
    await tabTo(page, '[data-test=import-upload]');
    await page.keyboard.press('Enter');
    await page.locator('[data-test=import-ok]').waitFor();
    await tabTo(page, '[data-test=import-commit]');
    await page.keyboard.press('Enter');
    await page.waitForURL((u) => /^\/models\/\d+$/.test(u.pathname));
    modelId = Number(new URL(page.url()).pathname.split('/').pop());
    await page.locator('[data-test=not-run]').waitFor();

    // run
    await tabTo(page, '[data-test=run-model]');
    await page.keyboard.press('Enter');
    await page.locator('[data-test=results-caption]').waitFor();
    await expect.poll(() => cell(page, 'M1', 'ratio').textContent(), { timeout: 60_000 }).toMatch(/^\d/);
    runId = Number(/Run #(\d+)/.exec((await page.locator('[data-test=results-caption]').textContent()) ?? '')?.[1]);
    expect(runId).toBeGreaterThan(0);
    expect(await page.locator('[data-test=not-run]').count()).toBe(0);

    // into the grid (header first), down to the second row, Enter opens that member
    await tabTo(page, '[data-test=results-grid] .ag-header-cell');
    await page.keyboard.press('ArrowDown');
    await page.keyboard.press('ArrowDown');
    const focusedMember = await page.evaluate(() => document.activeElement?.closest('.ag-row')?.getAttribute('row-id'));
    expect(['M1', 'M2']).toContain(focusedMember);
    await screenshot(page, 'workspace-01-keyboard-grid');
    await page.keyboard.press('Enter');
    await page.waitForURL((u) => u.pathname === `/runs/${runId}/members/${focusedMember}`);
    await page.locator('[data-test=member-title]').waitFor();

    // and back to the model
    await tabTo(page, 'a[href="/models/' + modelId + '"]:not(.v-breadcrumbs-item--link)');
    await page.keyboard.press('Enter');
    await page.waitForURL((u) => u.pathname === `/models/${modelId}`);
    await page.locator('[data-test=results-grid]').waitFor();
  }, 240_000);

  it('shows why a member was not checked and a combination\'s factors', async () => {
    await expect.poll(() => cell(page, 'M2', 'status').textContent()).toBe('not checked');
    // EN 1993-1-1 6.2.6(6): a web with hw/tw > 72ε/η needs the shear buckling check of EN 1993-1-5 (outside our scope)
    expect(await cell(page, 'M2', 'reason').textContent()).toMatch(/shear buckling \(EN 1993-1-5\) not implemented/);
    expect(await cell(page, 'M1', 'reason').textContent()).toBe('');
    expect(await tooltipOf(page, cell(page, 'M2', 'status'))).toMatch(/^not checked: hw\/tw = /);
    // the combination as imported above: ULS = 1.35 D + 1.5 L (EN 1990 Eq. 6.10 with γG = 1.35, γQ = 1.5, Table A1.2(B))
    const governing = (await cell(page, 'M1', 'combination').textContent()) ?? '';
    expect(governing).toBe('ULS');
    expect(await tooltipOf(page, cell(page, 'M1', 'combination'))).toBe('ULS (strength) = 1.35 × D + 1.5 × L');
    await screenshot(page, 'workspace-02-combination-hover');
  }, 60_000);

  it('links member ids: Ctrl+click opens a new tab, a plain click opens the member here', async () => {
    const link = cell(page, 'M1', 'member').locator('a[data-test=member-link]');
    expect(await link.getAttribute('href')).toBe(`/runs/${runId}/members/M1`);
    const [tab] = await Promise.all([app.browser.context.waitForEvent('page'), link.click({ modifiers: ['Control'] })]);
    await tab.waitForURL((u) => u.pathname === `/runs/${runId}/members/M1`);
    await tab.close();
    expect(new URL(page.url()).pathname).toBe(`/models/${modelId}`);
    await link.click();
    await page.waitForURL((u) => u.pathname === `/runs/${runId}/members/M1`);
    await page.goBack();
    await page.locator('[data-test=results-grid]').waitFor();
  }, 60_000);

  it('opens the cell editor pop-up on an opaque surface, in the results grid and the Model tab', async () => {
    await cell(page, 'M1', 'section').dblclick();
    await page.locator('[data-test=cell-editor-input]').fill('B');
    const light = await backgroundOf(page, '[data-test=cell-editor]');
    expect(light.alpha).toBe(1);
    expect(light.color).toBe('rgb(255, 255, 255)');
    // the list moves with the arrow keys and takes a value with Enter
    await page.keyboard.press('ArrowDown');
    expect(await page.locator('[data-test=cell-editor] li.active').count()).toBe(1);
    await screenshot(page, 'workspace-03-editor-light');
    await page.keyboard.press('Escape');

    await page.locator('[data-test=tab-model]').click();
    await page.locator('[data-test=choose-member_loads]').click();
    const w1 = page.locator('[data-test=table-member_loads] .ag-row[row-id="1"] [col-id="w1"]');
    await w1.dblclick();
    await page.locator('[data-test=table-cell-input]').fill('x');
    expect((await backgroundOf(page, '[data-test=table-cell-editor]')).alpha).toBe(1);
    await page.keyboard.press('Escape');
    await page.locator('[data-test=tab-results]').click();
  }, 60_000);

  it('undoes the last edit and paste with Ctrl+Z and asks before unsaved edits are lost', async () => {
    await cell(page, 'M1', 'group').dblclick();
    await page.locator('[data-test=cell-editor-input]').fill('girders');
    await page.keyboard.press('Enter');
    await expect.poll(() => page.locator('[data-test=pending-count]').textContent()).toBe('1');
    await page.keyboard.press('Control+z');
    await page.locator('[data-test=pending-bar]').waitFor({ state: 'detached' });
    expect(await cell(page, 'M1', 'group').textContent()).toBe('beams');

    // a paste of two cells is one step
    await cell(page, 'M1', 'group').click();
    await page.evaluate(() => {
      const dt = new DataTransfer();
      dt.setData('text/plain', 'girders\r\nspans\r\n');
      document.querySelector('[data-test=results-grid] .ag-cell-focus')?.dispatchEvent(new ClipboardEvent('paste', { clipboardData: dt, bubbles: true, cancelable: true }));
    });
    await expect.poll(() => page.locator('[data-test=pending-count]').textContent()).toBe('2');
    await page.keyboard.press('Control+z');
    await page.locator('[data-test=pending-bar]').waitFor({ state: 'detached' });

    // an unsaved edit: closing or reloading the tab is held back, leaving the page asks
    await cell(page, 'M1', 'group').dblclick();
    await page.locator('[data-test=cell-editor-input]').fill('girders');
    await page.keyboard.press('Enter');
    await expect.poll(() => page.locator('[data-test=pending-count]').textContent()).toBe('1');
    const held = await page.evaluate(() => {
      const e = new Event('beforeunload', { cancelable: true });
      window.dispatchEvent(e);
      return e.defaultPrevented;
    });
    expect(held).toBe(true);

    const questions: string[] = [];
    page.once('dialog', (d) => {
      questions.push(d.message());
      void d.dismiss();
    });
    await page.locator('[data-test=breadcrumbs] a', { hasText: 'Keyboard project' }).click();
    await expect.poll(() => questions.length).toBe(1);
    expect(questions[0]).toContain('1 unsaved edit');
    expect(new URL(page.url()).pathname).toBe(`/models/${modelId}`);
    expect(await page.locator('[data-test=pending-count]').textContent()).toBe('1');

    page.once('dialog', (d) => void d.accept());
    await page.locator('[data-test=breadcrumbs] a', { hasText: 'Keyboard project' }).click();
    await page.waitForURL((u) => u.pathname === `/projects/${projectId}`);
  }, 90_000);

  it('names the card of people so it is not read as structural members', async () => {
    await page.locator('[data-test=project-members]').waitFor();
    expect((await page.locator('[data-test=project-people-title]').textContent())?.trim()).toBe('People on this project');
  }, 30_000);

  it('switches to the dark theme, the grid and editor follow, and the choice is remembered for this user only', async () => {
    await app.goto(page, `/models/${modelId}`);
    await page.locator('[data-test=results-grid] .ag-row').first().waitFor();
    await page.locator('[data-test=theme-toggle]').click();
    await expect.poll(() => page.evaluate(() => document.documentElement.dataset.agThemeMode)).toBe('dark');
    await expect.poll(async () => (await backgroundOf(page, '[data-test=results-grid] .ag-root-wrapper')).color).toBe('rgb(31, 38, 40)');
    await cell(page, 'M1', 'section').dblclick();
    await page.locator('[data-test=cell-editor-input]').fill('B');
    expect(await backgroundOf(page, '[data-test=cell-editor]')).toEqual({ color: 'rgb(31, 38, 40)', alpha: 1 });
    await screenshot(page, 'workspace-04-dark-editor');
    await page.keyboard.press('Escape');

    await page.reload();
    await page.locator('[data-test=results-grid] .ag-row').first().waitFor();
    expect(await page.evaluate(() => document.documentElement.dataset.agThemeMode)).toBe('dark');
    expect(await page.locator('.v-application.v-theme--trestleDark').count()).toBe(1);
    await screenshot(page, 'workspace-05-dark-results');

    // another user on the same browser keeps their own (light) choice
    await signIn(page, app.baseUrl, 'lead@example.com');
    await expect.poll(() => page.evaluate(() => document.documentElement.dataset.agThemeMode)).toBe('light');
    await signIn(page, app.baseUrl, 'engineer@example.com');
    await expect.poll(() => page.evaluate(() => document.documentElement.dataset.agThemeMode)).toBe('dark');
    await page.locator('[data-test=theme-toggle]').click();
    await expect.poll(() => page.evaluate(() => document.documentElement.dataset.agThemeMode)).toBe('light');
  }, 120_000);

  it('tells a viewer what they can see when the model has only draft runs', async () => {
    await signIn(page, app.baseUrl, 'viewer@example.com');
    const projects = (await apiFromPage(page, 'GET', '/api/projects')).body as { id: number }[];
    let demoModel = 0;
    for (const p of projects) {
      const models = (await apiFromPage(page, 'GET', `/api/projects/${p.id}/models`)).body as { id: number; lastRun: unknown }[];
      const m = models.find((x) => !x.lastRun);
      if (m) {
        demoModel = m.id;
        break;
      }
    }
    expect(demoModel).toBeGreaterThan(0);
    await app.goto(page, `/models/${demoModel}`);
    const note = page.locator('[data-test=no-approved-run]');
    await note.waitFor();
    expect(await note.textContent()).toContain('No approved run yet');
    expect(await page.locator('[data-test=not-run]').count()).toBe(0);
    expect(await page.getByText('Press “Run”').count()).toBe(0);
    await screenshot(page, 'workspace-06-viewer');
  }, 60_000);

  it('treats an engineer who is only a viewer on a project as a viewer there', async () => {
    // effective project role = the lower of the account role and the project role (DEVELOPERS.md, project scope)
    await signIn(page, app.baseUrl, 'admin@example.com');
    const projects = (await apiFromPage(page, 'GET', '/api/projects')).body as { id: number }[];
    let project = 0;
    let modelId = 0;
    for (const p of projects) {
      const models = (await apiFromPage(page, 'GET', `/api/projects/${p.id}/models`)).body as { id: number }[];
      if (models.length > 0) {
        project = p.id;
        modelId = models[0].id;
        break;
      }
    }
    expect(modelId).toBeGreaterThan(0);
    const people = (await apiFromPage(page, 'GET', `/api/projects/${project}/members`)).body as { userId: number; email: string }[];
    const engineer = people.find((p) => p.email === 'engineer@example.com')!;
    expect((await apiFromPage(page, 'PATCH', `/api/projects/${project}/members/${engineer.userId}`, { role: 'viewer' })).status).toBe(200);
    try {
      await signIn(page, app.baseUrl, 'engineer@example.com');
      await app.goto(page, `/models/${modelId}`);
      await page.locator('[data-test=no-approved-run]').waitFor();
      expect(await page.locator('[data-test=run-model]').count()).toBe(0);
      expect(await page.locator('[data-test=not-run]').count()).toBe(0);
    } finally {
      await signIn(page, app.baseUrl, 'admin@example.com');
      await apiFromPage(page, 'PATCH', `/api/projects/${project}/members/${engineer.userId}`, { role: 'engineer' });
    }
  }, 90_000);
});
