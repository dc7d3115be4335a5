/**
 * Review and sign-off in the browser: the engineer submits a run → the lead finds the
 * notification in the mail outbox and returns the run with a comment → the engineer sees it
 * and resubmits → the lead approves → the run and its model version are locked. Throughout,
 * the page must log no Content-Security-Policy violation and the server no 5xx.
 */
import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { apiFromPage, chromiumAvailable, screenshot, screenshotOpenPages, signIn, slug, startApp, stopApp, type TrestleApp } from './harness.js';

const enabled = chromiumAvailable('review');

describe.skipIf(!enabled)('review and sign-off in the browser', () => {
  let app: TrestleApp;
  let modelId: number;
  let runId: number;
  const cspViolations: string[] = [];

  const watchCsp = (page: Page) => {
    page.on('console', (msg) => {
      if (/Content.Security.Policy|Refused to (load|execute|apply)/i.test(msg.text())) cspViolations.push(msg.text());
    });
  };

  async function openMail(page: Page, subject: string): Promise<string> {
    await app.goto(page, '/outbox');
    const item = page.locator('[data-test=outbox-message]', { hasText: subject });
    await expect.poll(async () => {
      await page.locator('[data-test=outbox-refresh]').click();
      return item.count();
    }, { timeout: 20_000 }).toBeGreaterThan(0);
    await item.first().click();
    return (await page.locator('[data-test=outbox-body]').textContent()) ?? '';
  }

  async function step(page: Page, action: 'submit' | 'return' | 'approve', message: string, after: string): Promise<void> {
    await page.locator(`[data-test=review-${action}]`).click();
    await page.locator('[data-test=review-dialog-message] textarea').first().fill(message);
    await page.locator('[data-test=review-dialog-confirm]').click();
    await expect.poll(() => page.locator('[data-test=review-status]').getAttribute('data-status')).toBe(after);
  }

  beforeAll(async () => {
    app = await startApp();
  }, 240_000);

  afterEach(async (ctx) => {
    if (ctx.task.result?.state !== 'fail' || !app) return;
    const files = await screenshotOpenPages(app, `failed-${slug(ctx.task.name)}`);
    console.warn(`screenshots of the failed test: ${files.join(', ')}\nserver output:\n${app.server.output().slice(-2000)}`);
  });

  afterAll(async () => {
    await stopApp(app);
  });

  it('engineer submits, lead returns with a comment, engineer resubmits, lead approves, the run is locked', async () => {
    // 1. The engineer submits the demo model's run for review.
    const page = await app.newPage();
    watchCsp(page);
    await signIn(page, app.baseUrl, 'engineer@example.com');
    const models = (await apiFromPage(page, 'GET', '/api/projects/1/models')).body as { id: number; lastRun: { id: number } | null }[];
    const withRun = models.find((m) => m.lastRun)!;
    modelId = withRun.id;
    runId = withRun.lastRun!.id;
    await app.goto(page, `/models/${modelId}?tab=review`);
    await page.locator('[data-test=review-panel]').waitFor();
    await expect.poll(() => page.locator('[data-test=review-status]').getAttribute('data-status')).toBe('draft');
    await step(page, 'submit', 'First check of the footbridge, please look at the chords.', 'submitted');
    await screenshot(page, 'review-01-engineer-submitted');

    // 2. The lead finds the notification and follows its link.
    await signIn(page, app.baseUrl, 'lead@example.com');
    const body = await openMail(page, `Review requested: run ${runId}`);
    expect(body).toContain('First check of the footbridge');
    await screenshot(page, 'review-02-lead-outbox');
    const link = /https?:\/\/[^\s]+\/runs\/(\d+)/.exec(body);
    expect(link?.[1]).toBe(String(runId));
    await app.goto(page, `/runs/${runId}`);
    await page.waitForURL((u) => u.pathname === `/models/${modelId}` && u.searchParams.get('tab') === 'review');
    await page.locator('[data-test=review-return]').waitFor();
    expect(await page.locator('[data-test=review-approve]').count()).toBe(1);

    // A comment on one member, then the return.
    // the member with the largest ratio: the first row of the grid (sorted by ratio), so its marker is on screen
    const rows = ((await apiFromPage(page, 'GET', `/api/runs/${runId}/members`)).body as { members: { member: string; ratio: number | null }[] }).members;
    const member = [...rows].sort((a, b) => (b.ratio ?? -1) - (a.ratio ?? -1))[0]!.member;
    await app.goto(page, `/runs/${runId}/members/${encodeURIComponent(member)}`);
    await page.locator('[data-test=member-comments] [data-test=comment-input] textarea').first().fill('Effective length of this chord looks short.');
    await page.locator('[data-test=member-comments] [data-test=comment-send]').click();
    await page.locator('[data-test=member-comments] [data-test=comment]').waitFor();
    await screenshot(page, 'review-03-lead-member-comment');
    await app.goto(page, `/models/${modelId}?tab=review`);
    await step(page, 'return', 'Please revisit the chord buckling lengths (see the member comment).', 'returned');
    await screenshot(page, 'review-04-lead-returned');

    // 3. The engineer reads the return, sees the marker in the grid, and resubmits.
    await signIn(page, app.baseUrl, 'engineer@example.com');
    const returned = await openMail(page, `Returned: run ${runId}`);
    expect(returned).toContain('Please revisit the chord buckling lengths');
    await app.goto(page, `/runs/${runId}`);
    await page.waitForURL((u) => u.pathname === `/models/${modelId}`);
    await expect.poll(() => page.locator('[data-test=review-history]').textContent()).toContain('Please revisit the chord buckling lengths');
    await page.locator('[data-test=tab-results]').click();
    await page.locator('[data-test=comment-marker]').first().waitFor();
    await screenshot(page, 'review-05-engineer-grid-marker');
    await page.locator('[data-test=tab-review]').click();
    await step(page, 'submit', 'Checked: lengths are as built, bracing at every panel point.', 'submitted');

    // 4. The lead approves; the run and its model version are locked.
    await signIn(page, app.baseUrl, 'lead@example.com');
    await app.goto(page, `/models/${modelId}?tab=review&run=${runId}`);
    await step(page, 'approve', 'Approved for issue.', 'approved');
    await page.locator('[data-test=review-locked]').waitFor();
    await screenshot(page, 'review-06-lead-approved-locked');

    await signIn(page, app.baseUrl, 'engineer@example.com');
    const approvedMail = await openMail(page, `Approved: run ${runId}`);
    expect(approvedMail).toContain('now locked');
    const detail = (await apiFromPage(page, 'GET', `/api/models/${modelId}`)).body as { currentVersion: number };
    const edit = await apiFromPage(page, 'PATCH', `/api/models/${modelId}/members`, { baseVersion: detail.currentVersion, edits: [{ member, field: 'k_major', value: 0.9 }] });
    expect(edit.status).toBe(423);
    expect(JSON.stringify(edit.body)).toMatch(/approved .* locked/);
    expect((await apiFromPage(page, 'POST', `/api/runs/${runId}/review/submit`, { message: 'again' })).status).toBe(409);
    await app.goto(page, `/models/${modelId}?tab=review&run=${runId}`);
    await page.locator('[data-test=review-locked]').waitFor();
    expect(await page.locator('[data-test^=review-submit]').count()).toBe(0);
    await screenshot(page, 'review-07-engineer-locked');

    // The 3D picture and the audit trail also work under the content security policy.
    await app.goto(page, `/models/${modelId}?tab=picture&run=${runId}`);
    await page.locator('canvas').first().waitFor();
    await signIn(page, app.baseUrl, 'lead@example.com');
    await app.goto(page, '/audit');
    await expect.poll(() => page.locator('[data-test=audit-table]').textContent()).toContain('approve');
    await screenshot(page, 'review-08-lead-audit');

    expect(cspViolations).toEqual([]);
    expect(app.serverErrors).toEqual([]);
    expect(app.externalRequests).toEqual([]);
    await page.close();
  }, 240_000);

  it('admin invites a new member by e-mail; the link sets a password and the new member signs in to that project', async () => {
    const page = await app.newPage();
    watchCsp(page);
    await signIn(page, app.baseUrl, 'admin@example.com');
    await app.goto(page, '/projects/2');
    await page.locator('[data-test=invite-open]').click();
    const form = page.locator('[data-test=invite-form]');
    await form.locator('input').nth(0).fill('Nora Newcomer');
    await form.locator('input').nth(1).fill('nora@example.com');
    await page.locator('[data-test=invite-send]').click();
    await page.locator('[data-test=invite-sent]').waitFor();
    await expect.poll(() => page.locator('[data-test=member-row]', { hasText: 'nora@example.com' }).count()).toBe(1);
    await screenshot(page, 'review-09-admin-invited');
    const mail = await openMail(page, 'You are invited to Trestle');
    const token = /set-password\?token=([A-Za-z0-9_-]+)/.exec(mail)?.[1];
    expect(token).toBeTruthy();

    await app.clearSession();
    await app.goto(page, `/set-password?token=${token}`);
    await page.locator('[data-test=set-password-new] input').fill('nora-chooses-this');
    await page.locator('[data-test=set-password-repeat] input').fill('nora-chooses-this');
    await page.locator('[data-test=set-password-submit]').click();
    await page.locator('[data-test=set-password-done]').waitFor();
    await screenshot(page, 'review-10-password-set');
    await signIn(page, app.baseUrl, 'nora@example.com', 'nora-chooses-this');
    const projects = (await apiFromPage(page, 'GET', '/api/projects')).body as { id: number }[];
    expect(projects.map((p) => p.id)).toEqual([2]);
    expect((await apiFromPage(page, 'GET', '/api/projects/1')).status).toBe(404);
    expect(cspViolations).toEqual([]);
    await page.close();
  }, 120_000);
});
