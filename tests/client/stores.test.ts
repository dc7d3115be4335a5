import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { useAuthStore } from '../../src/stores/auth.js';
import { sortProjects, useProjectsStore } from '../../src/stores/projects.js';
import { useUsersStore } from '../../src/stores/users.js';
import type { Project } from '../../shared/schemas/projects.js';
import type { User } from '../../shared/schemas/users.js';

type Route = (method: string, url: string, body: unknown) => { status: number; body?: unknown };

function serve(route: Route) {
  const fetchMock = vi.fn(async (url: string, init: RequestInit) => {
    const { status, body } = route(init.method ?? 'GET', url, init.body ? JSON.parse(String(init.body)) : undefined);
    return new Response(status === 204 ? null : JSON.stringify(body ?? {}), { status });
  });
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

const engineer: User = { id: 3, email: 'engineer@example.com', name: 'Eli', role: 'engineer', active: true };
const project = (id: number, name: string, updatedAt: string): Project => ({
  id, name, jobNumber: '', client: '', description: '', designCode: 'none', units: 'metric', createdBy: 1, createdAt: updatedAt, updatedAt,
});

beforeEach(() => setActivePinia(createPinia()));
afterEach(() => vi.unstubAllGlobals());

describe('auth store', () => {
  it('signs in, knows the role, and signs out', async () => {
    serve((method, url) => {
      if (url === '/api/auth/login') return { status: 200, body: engineer };
      if (url === '/api/auth/logout') return { status: 204 };
      return { status: 404 };
    });
    const auth = useAuthStore();
    expect(await auth.signIn({ email: 'engineer@example.com', password: 'x' })).toBe(true);
    expect(auth.canEdit).toBe(true);
    expect(auth.canDelete).toBe(false);
    expect(auth.isAdmin).toBe(false);
    expect(auth.loading).toBe(false);
    await auth.signOut();
    expect(auth.user).toBeNull();
    expect(auth.canEdit).toBe(false);
  });

  it('shows the server message when sign-in fails and resets loading', async () => {
    serve(() => ({ status: 401, body: { error: { code: 'unauthorized', message: 'E-mail or password is wrong' } } }));
    const auth = useAuthStore();
    expect(await auth.signIn({ email: 'a@b.c', password: 'x' })).toBe(false);
    expect(auth.error).toBe('E-mail or password is wrong');
    expect(auth.loading).toBe(false);
  });

  it('treats 401 from who-am-I as signed out without an error, and asks only once', async () => {
    const fetchMock = serve(() => ({ status: 401, body: { error: { code: 'unauthorized', message: 'Sign in first' } } }));
    const auth = useAuthStore();
    expect(await auth.fetchMe()).toBeNull();
    expect(await auth.fetchMe()).toBeNull();
    expect(fetchMock).toHaveBeenCalledTimes(1);
    expect(auth.checked).toBe(true);
    expect(auth.error).toBeNull();
  });
});

describe('projects store', () => {
  it('sorts newest change first, then by name', () => {
    const list = [project(1, 'B', '2026-01-01T00:00:00Z'), project(2, 'A', '2026-01-01T00:00:00Z'), project(3, 'C', '2026-02-01T00:00:00Z')];
    expect(sortProjects(list).map((p) => p.id)).toEqual([3, 2, 1]);
  });

  it('loads, creates and updates, keeping the list in step', async () => {
    const stored = [project(1, 'Old', '2026-01-01T00:00:00Z')];
    serve((method, url, body) => {
      if (method === 'GET' && url === '/api/projects') return { status: 200, body: stored };
      if (method === 'POST') return { status: 201, body: project(2, (body as { name: string }).name, '2026-03-01T00:00:00Z') };
      if (method === 'PATCH') return { status: 200, body: { ...stored[0], ...(body as object) } };
      return { status: 404 };
    });
    const projects = useProjectsStore();
    await projects.load();
    expect(projects.items).toHaveLength(1);
    await projects.create({ name: 'New' });
    expect(projects.sorted.map((p) => p.name)).toEqual(['New', 'Old']);
    await projects.update(1, { name: 'Renamed' });
    expect(projects.items.find((p) => p.id === 1)?.name).toBe('Renamed');
    expect(projects.saving).toBe(false);
  });

  it('puts a refused write into error and rethrows it for the form', async () => {
    serve(() => ({ status: 403, body: { error: { code: 'forbidden', message: 'Viewers cannot create projects' } } }));
    const projects = useProjectsStore();
    await expect(projects.create({ name: 'X' })).rejects.toMatchObject({ code: 'forbidden' });
    expect(projects.error).toBe('Viewers cannot create projects');
    expect(projects.saving).toBe(false);
    expect(projects.items).toEqual([]);
  });

  it('shows a failed load as an error and stops loading', async () => {
    serve(() => ({ status: 500, body: { error: { code: 'internal', message: 'Something failed on the server' } } }));
    const projects = useProjectsStore();
    await projects.load();
    expect(projects.error).toBe('Something failed on the server');
    expect(projects.loading).toBe(false);
  });
});

describe('users store', () => {
  it('updates one user in place and counts the active ones', async () => {
    const viewer: User = { id: 4, email: 'viewer@example.com', name: 'Vic', role: 'viewer', active: true };
    serve((method, url, body) => {
      if (method === 'GET') return { status: 200, body: [engineer, viewer] };
      if (method === 'PATCH' && url === '/api/users/4') return { status: 200, body: { ...viewer, ...(body as object) } };
      return { status: 404 };
    });
    const users = useUsersStore();
    await users.load();
    expect(users.activeCount).toBe(2);
    const saved = await users.update(4, { active: false });
    expect(saved?.active).toBe(false);
    expect(users.activeCount).toBe(1);
    expect(users.sorted.map((u) => u.email)).toEqual(['engineer@example.com', 'viewer@example.com']);
  });
});
