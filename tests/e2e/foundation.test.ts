/** The foundation in a real browser: sign-in, roles, projects, sign-out. */
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { apiFromPage, chromiumAvailable, screenshot, screenshotOpenPages, signIn, signOut, slug, startApp, stopApp, type TrestleApp } from './harness.js';

const enabled = chromiumAvailable('foundation');

describe.skipIf(!enabled)('foundation in the browser', () => {
  let app: TrestleApp;

  beforeAll(async () => {
    app = await startApp();
  });

  afterEach(async (ctx) => {
    if (ctx.task.result?.state !== 'fail' || !app) return;
    const files = await screenshotOpenPages(app, `failed-${slug(ctx.task.name)}`);
    console.warn(`screenshots of the failed test: ${files.join(', ')}\nserver output:\n${app.server.output().slice(-2000)}`);
    for (const page of app.browser.context.pages()) await page.close().catch(() => undefined);
  });

  afterAll(async () => {
    await stopApp(app);
  });

  it('sends a signed-out visitor to sign-in, shows a wrong password, then returns to the page asked for', async () => {
    const page = await app.newPage();
    await app.goto(page, '/projects/1');
    await page.waitForURL((u) => u.pathname === '/sign-in');
    expect(new URL(page.url()).searchParams.get('redirect')).toBe('/projects/1');
    await page.locator('[data-test=sign-in-email] input').fill('engineer@example.com');
    await page.locator('[data-test=sign-in-password] input').fill('not-the-password');
    await page.locator('[data-test=sign-in-submit]').click();
    await page.locator('[data-test=sign-in-error]').waitFor();
    await screenshot(page, 'foundation-01-sign-in-error');

    await page.locator('[data-test=sign-in-password] input').fill('trestle-demo');
    await page.locator('[data-test=sign-in-submit]').click();
    await page.waitForURL((u) => u.pathname === '/projects/1');
    await page.locator('[data-test=project-title]').waitFor();
    await signOut(page);
    await page.close();
  });

  it('lets an engineer create a project, see it listed, and sign out', async () => {
    const page = await app.newPage();
    await signIn(page, app.baseUrl, 'engineer@example.com');
    await page.locator('[data-test=projects-table]').waitFor();
    await screenshot(page, 'foundation-02-projects-engineer');

    await page.locator('[data-test=new-project]').click();
    await page.locator('[data-test=project-name] input').fill('Harbour crane rail girder');
    await page.locator('[data-test=project-job-number] input').fill('E2E-7');
    await page.locator('[data-test=project-client] input').fill('Test client');
    await screenshot(page, 'foundation-03-new-project-dialog');
    await page.locator('[data-test=project-save]').click();

    await page.waitForURL((u) => /^\/projects\/\d+$/.test(u.pathname));
    await expect.poll(() => page.locator('[data-test=project-title]').textContent()).toBe('Harbour crane rail girder');
    await page.locator('[data-test=project-models]').waitFor();
    expect(await page.locator('[data-test=breadcrumbs]').textContent()).toContain('Harbour crane rail girder');
    await screenshot(page, 'foundation-04-project-page');

    await page.locator('[data-test=nav-projects]').click();
    await page.waitForURL((u) => u.pathname === '/projects');
    const row = page.locator('[data-test=project-row]', { hasText: 'Harbour crane rail girder' });
    await row.waitFor();
    expect(await row.textContent()).toContain('E2E-7');

    await signOut(page);
    expect((await apiFromPage(page, 'GET', '/api/auth/me')).status).toBe(401);
    await page.close();
  });

  it('shows a viewer no create button, and the API refuses the viewer a new project', async () => {
    await app.clearSession();
    const page = await app.newPage();
    await signIn(page, app.baseUrl, 'viewer@example.com');
    // Projects are visible to their members; the demo footbridge project lists the viewer.
    const row = page.locator('[data-test=project-row]', { hasText: 'Kestrel Creek footbridge' });
    await row.waitFor();
    expect(await page.locator('[data-test=new-project]').count()).toBe(0);
    expect(await page.locator('[data-test=nav-admin-users]').count()).toBe(0);
    await screenshot(page, 'foundation-05-projects-viewer');

    const refused = await apiFromPage(page, 'POST', '/api/projects', { name: 'Should not exist' });
    expect(refused.status).toBe(403);
    expect(refused.body).toMatchObject({ error: { code: 'forbidden' } });
    const list = await apiFromPage(page, 'GET', '/api/projects');
    expect((list.body as { name: string }[]).some((p) => p.name === 'Should not exist')).toBe(false);

    await row.click();
    await page.locator('[data-test=project-models]').waitFor();
    expect(await page.locator('[data-test=edit-project]').count()).toBe(0);

    await app.goto(page, '/admin/users');
    await page.waitForURL((u) => u.pathname === '/not-allowed');
    await screenshot(page, 'foundation-06-viewer-not-allowed');
    await signOut(page);
    await page.close();
  });

  it('lets a user change their own password from the user menu', async () => {
    await app.clearSession();
    const page = await app.newPage();
    await signIn(page, app.baseUrl, 'lead@example.com');
    await page.locator('[data-test=user-menu]').click();
    await page.locator('[data-test=change-password]').click();
    const dialog = page.locator('[data-test=password-dialog]');
    await dialog.locator('[data-test=current-password] input').fill('trestle-demo');
    await dialog.locator('[data-test=new-password] input').fill('lead-new-password');
    await dialog.locator('[data-test=repeat-password] input').fill('lead-new-password');
    await dialog.locator('[data-test=password-save]').click();
    await page.locator('.v-snackbar', { hasText: 'password has been changed' }).waitFor();

    await app.goto(page, '/about');
    await page.locator('text=Before you rely on a result').waitFor();
    await screenshot(page, 'foundation-08-about');
    await signOut(page);
    await signIn(page, app.baseUrl, 'lead@example.com', 'lead-new-password');
    await signOut(page);
    await page.close();
  });

  it('lets an admin create a user, change a role and deactivate an account', async () => {
    await app.clearSession();
    const page = await app.newPage();
    await signIn(page, app.baseUrl, 'admin@example.com');
    await page.locator('[data-test=nav-admin-users]').click();
    await page.waitForURL((u) => u.pathname === '/admin/users');
    await expect.poll(() => page.locator('[data-test=user-row]').count()).toBe(4);

    await page.locator('[data-test=new-user]').click();
    await page.locator('[data-test=user-name] input').fill('Nia Newcomer');
    await page.locator('[data-test=user-email] input').fill('nia@example.com');
    await page.locator('[data-test=user-password] input').fill('a-long-password');
    await page.locator('[data-test=user-save]').click();
    const nia = page.locator('[data-test=user-row]', { hasText: 'nia@example.com' });
    await nia.waitFor();
    expect(await nia.textContent()).toContain('Engineer');

    const lena = page.locator('[data-test=user-row]', { hasText: 'lead@example.com' });
    await lena.locator('.v-select').click();
    await page.locator('.v-overlay--active .v-list-item', { hasText: 'Viewer' }).click();
    await expect.poll(() => lena.textContent()).toContain('Viewer');

    await nia.locator('.v-switch input').click();
    await expect.poll(() => nia.textContent()).toContain('Deactivated');
    await screenshot(page, 'foundation-07-admin-users');

    const users = (await apiFromPage(page, 'GET', '/api/users')).body as { email: string; role: string; active: boolean }[];
    expect(users.find((u) => u.email === 'lead@example.com')?.role).toBe('viewer');
    expect(users.find((u) => u.email === 'nia@example.com')?.active).toBe(false);

    await signOut(page);
    await page.close();
    expect(app.serverErrors).toEqual([]);
  });

  it('loaded every font, icon and script from its own server', () => {
    expect(app.externalRequests).toEqual([]);
  });
});
