/**
 * The Model tab in a real browser, before any rerun: a demo sample's tables, a grid filtered,
 * a member load edited (a bad value refused as it is typed, then a good one), saved as one new
 * version and shown in the grid.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { apiFromPage, chromiumAvailable, screenshot, signIn, startApp, stopApp, type TrestleApp } from './harness.js';

const enabled = chromiumAvailable('model-tab');

// Browser globals used inside page.evaluate callbacks (the tests' tsconfig has no DOM library).
declare const document: any; // eslint-disable-line @typescript-eslint/no-explicit-any

/** Row ids shown in the member-loads grid (a row split over pinned and centre parts counts once). */
function shownRowIds(page: Page): Promise<string[]> {
  return page.evaluate(() => [...new Set(([...document.querySelectorAll('[data-test=table-member_loads] .ag-row')] as { getAttribute(n: string): string | null }[]).map((r) => r.getAttribute('row-id') ?? ''))]);
}

type Table = { name: string; columns: { name: string }[]; rows: { row: number; cells: unknown[] }[] };

describe.skipIf(!enabled)('model tab in the browser', () => {
  let app: TrestleApp;
  let page: Page;
  let modelId = 0;
  let version = 0;

  beforeAll(async () => {
    app = await startApp();
    page = await app.newPage();
    page.setDefaultTimeout(30_000);
    await page.setViewportSize({ width: 1440, height: 900 });
    await signIn(page, app.baseUrl, 'engineer@example.com');
    const projects = (await apiFromPage(page, 'GET', '/api/projects')).body as { id: number }[];
    for (const p of projects) {
      const models = (await apiFromPage(page, 'GET', `/api/projects/${p.id}/models`)).body as { id: number; currentVersion: number; name: string }[];
      const m = models.find((x) => /portal/i.test(x.name)) ?? models[0];
      if (m) {
        modelId = m.id;
        version = m.currentVersion;
        if (/portal/i.test(m.name)) break;
      }
    }
    expect(modelId).toBeGreaterThan(0);
  }, 180_000);

  afterAll(async () => {
    await stopApp(app);
  });

  it('shows the tables, filters member loads, edits one, saves one new version and shows it', async () => {
    const tables = (await apiFromPage(page, 'GET', `/api/models/${modelId}/tables`)).body as { tables: Table[] };
    const loads = tables.tables.find((t) => t.name === 'member_loads')!;
    expect(loads.rows.length).toBeGreaterThan(1);
    const memberOfFirst = String(loads.rows[0].cells[1]);

    await page.goto(`${app.baseUrl}/models/${modelId}?tab=model`);
    await page.locator('[data-test=model-tables]').waitFor();
    await page.locator('[data-test=table-chooser]').waitFor();
    await screenshot(page, 'model-tab-01-tables');

    // nodes first: read only, units in the headers
    await page.locator('[data-test=choose-nodes]').click();
    await page.locator('[data-test=table-nodes] .ag-header-cell-text', { hasText: /^x \[(m|ft)\]$/ }).waitFor();

    // member loads, filtered by the first row's member
    await page.locator('[data-test=choose-member_loads]').click();
    const grid = page.locator('[data-test=table-member_loads]');
    await grid.locator('.ag-row').first().waitFor();
    const all = loads.rows.length;
    await grid.locator('[data-test=table-filter] input').fill(memberOfFirst);
    const matching = loads.rows.filter((r) => r.cells.some((c) => c !== null && String(c).toLowerCase().includes(memberOfFirst.toLowerCase()))).length;
    expect(matching).toBeLessThan(all);
    expect(matching).toBeLessThanOrEqual(15);
    await expect.poll(() => shownRowIds(page)).toHaveLength(matching);
    await screenshot(page, 'model-tab-02-filtered');
    await grid.locator('[data-test=table-filter] input').fill('');

    // a bad value is refused as it is typed, with the reader's message
    const w1 = grid.locator('.ag-row[row-id="1"] [col-id="w1"]');
    await w1.dblclick();
    const input = page.locator('[data-test=table-cell-input]');
    await input.fill('abc');
    await expect.poll(() => page.locator('[data-test=table-cell-message]').textContent()).toContain('is not a number');
    await screenshot(page, 'model-tab-03-refused');
    await input.fill('-3.25');
    await input.press('Enter');
    await expect.poll(() => page.locator('[data-test=tables-pending-count]').textContent()).toBe('1');
    await expect.poll(() => w1.getAttribute('class')).toContain('table-cell-changed');
    await screenshot(page, 'model-tab-04-pending');

    await page.locator('[data-test=tables-save]').click();
    await page.locator('[data-test=tables-saved]').waitFor();
    await expect.poll(() => page.locator('[data-test=model-version]').textContent()).toBe(String(version + 1));
    await expect.poll(() => grid.locator('.ag-row[row-id="1"] [col-id="w1"]').textContent()).toBe('-3.25');
    const versions = (await apiFromPage(page, 'GET', `/api/models/${modelId}/versions`)).body as { version: number; origin: string; message: string }[];
    expect(versions[0]).toMatchObject({ version: version + 1, origin: 'edit' });
    expect(versions[0].message).toContain('member loads');
    await screenshot(page, 'model-tab-05-saved');
  }, 180_000);
});
