import { describe, expect, it } from 'vitest';
import { decideNavigation, safeRedirect, type GuardTarget } from '../../src/router/guard.js';
import type { Role, User } from '../../shared/schemas/users.js';

const user = (role: Role): User => ({ id: 1, email: `${role}@example.com`, name: role, role, active: true });
const target = (name: string, fullPath: string, meta: GuardTarget['meta'] = {}, query: Record<string, unknown> = {}): GuardTarget => ({ name, fullPath, meta, query });

describe('decideNavigation', () => {
  it('sends a signed-out visitor to sign-in, remembering the page', () => {
    expect(decideNavigation(target('project', '/projects/3'), null)).toEqual({
      kind: 'redirect',
      to: { name: 'sign-in', query: { redirect: '/projects/3' } },
    });
  });

  it('lets anyone open public pages and the sign-in page', () => {
    expect(decideNavigation(target('about', '/about', { public: true }), null)).toEqual({ kind: 'allow' });
    expect(decideNavigation(target('sign-in', '/sign-in', { public: true }), null)).toEqual({ kind: 'allow' });
  });

  it('sends a signed-in user away from sign-in to the remembered page, or projects', () => {
    expect(decideNavigation(target('sign-in', '/sign-in', { public: true }, { redirect: '/about' }), user('viewer'))).toEqual({ kind: 'redirect', to: '/about' });
    expect(decideNavigation(target('sign-in', '/sign-in', { public: true }, { redirect: 'https://evil.example' }), user('viewer'))).toEqual({
      kind: 'redirect',
      to: { name: 'projects' },
    });
  });

  it('lets only admins open admin pages', () => {
    const admin = target('admin-users', '/admin/users', { minRole: 'admin' });
    expect(decideNavigation(admin, user('admin'))).toEqual({ kind: 'allow' });
    for (const role of ['lead', 'engineer', 'viewer'] as const) {
      expect(decideNavigation(admin, user(role))).toEqual({ kind: 'redirect', to: { name: 'forbidden' } });
    }
  });
});

describe('safeRedirect', () => {
  it('accepts only paths on this site', () => {
    expect(safeRedirect('/projects/2?tab=x')).toBe('/projects/2?tab=x');
    expect(safeRedirect(['/about'])).toBe('/about');
    expect(safeRedirect('//evil.example/x')).toBeNull();
    expect(safeRedirect('/\\evil.example')).toBeNull();
    expect(safeRedirect('https://evil.example')).toBeNull();
    expect(safeRedirect(undefined)).toBeNull();
  });
});
