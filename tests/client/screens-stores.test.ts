/** Models, imports and runs stores with a stubbed fetch: one version per save, 409 made plain, polling until done. */
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { useModelsStore } from '../../src/stores/models.js';
import { useRunsStore } from '../../src/stores/runs.js';
import { useImportsStore } from '../../src/stores/imports.js';

type Route = (method: string, url: string, body: unknown) => { status: number; body?: unknown };

function serve(route: Route) {
  const fetchMock = vi.fn(async (url: string, init: RequestInit) => {
    const body = init.body && typeof init.body === 'string' ? JSON.parse(init.body) : init.body;
    const r = route(init.method ?? 'GET', url, body);
    return new Response(r.status === 204 ? null : JSON.stringify(r.body ?? {}), { status: r.status });
  });
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

const detail = { id: 7, projectId: 1, name: 'Beam', currentVersion: 1, designCode: 'en1993-1-1', units: 'metric', counts: {}, createdBy: 1, createdAt: '', updatedAt: '', lastRun: null };
const members = (version: number) => ({
  modelId: 7, version, units: 'metric', lengthUnit: 'm', sections: ['B300', 'B400'], catalogue: [], materials: ['S'], builtInMaterials: [],
  members: [{ member: 'M1', start: 'N1', end: 'N2', type: 'frame', section: 'B300', material: 'S', group: '', k_major: 1, k_minor: 1, l_major: null, l_minor: null, lb: null, cb: null, deflection_limit: null, length: 6 }],
});

beforeEach(() => setActivePinia(createPinia()));
afterEach(() => {
  vi.unstubAllGlobals();
  vi.useRealTimers();
});

describe('models store', () => {
  it('sends every pending edit in one call with the base version, then reloads the new version', async () => {
    let version = 1;
    const fetchMock = serve((method, url, body) => {
      if (url === '/api/models/7') return { status: 200, body: { ...detail, currentVersion: version } };
      if (url === '/api/models/7/members' && method === 'GET') return { status: 200, body: members(version) };
      if (url === '/api/models/7/versions') return { status: 200, body: [] };
      if (url === '/api/models/7/members' && method === 'PATCH') {
        expect(body).toEqual({ baseVersion: 1, edits: [{ member: 'M1', field: 'section', value: 'B400' }, { member: 'M1', field: 'lb', value: 2 }] });
        version = 2;
        return { status: 200, body: { ...detail, currentVersion: 2 } };
      }
      return { status: 404 };
    });
    const models = useModelsStore();
    await models.open(7);
    models.setEdit('M1', 'section', 'B400');
    models.setEdit('M1', 'lb', 2);
    models.setEdit('M1', 'group', ''); // same as before: not an edit
    expect(models.pendingCount).toBe(2);
    const saved = await models.saveEdits();
    expect(saved?.currentVersion).toBe(2);
    expect(models.pendingCount).toBe(0);
    expect(models.members?.version).toBe(2);
    expect(fetchMock.mock.calls.filter(([, init]) => (init as RequestInit).method === 'PATCH')).toHaveLength(1);
  });

  it('keeps the edits and says plainly that the model moved on when the save is stale (409)', async () => {
    serve((method, url) => {
      if (url === '/api/models/7') return { status: 200, body: detail };
      if (url === '/api/models/7/members' && method === 'GET') return { status: 200, body: members(1) };
      if (url === '/api/models/7/versions') return { status: 200, body: [] };
      return { status: 409, body: { error: { code: 'conflict', message: 'the model is at version 3, not 1' } } };
    });
    const models = useModelsStore();
    await models.open(7);
    models.setEdit('M1', 'section', 'B400');
    expect(await models.saveEdits()).toBeNull();
    expect(models.stale).toBe(true);
    expect(models.error).toMatch(/newer version/);
    expect(models.error).toMatch(/version 3/);
    expect(models.pendingCount).toBe(1);
  });
});

describe('runs store', () => {
  it('polls a started run through its phases, then loads its rows and the history', async () => {
    vi.useFakeTimers();
    const states = [
      { status: 'queued', phase: null },
      { status: 'running', phase: 'solving' },
      { status: 'done', phase: 'saving' },
    ];
    let polls = 0;
    serve((method, url) => {
      if (url === '/api/models/7/runs' && method === 'POST') return { status: 202, body: { id: 5, modelId: 7, status: 'queued', phase: null } };
      if (url === '/api/runs/5') return { status: 200, body: { id: 5, modelId: 7, ...states[Math.min(polls++, 2)] } };
      if (url === '/api/runs/5/members?layout=table') {
        const empty = { member: [], group: [], section: [], material: [], check: [], clause: [], combination: [], status: [], length: [], ratio: [], previousRatio: [] };
        return { status: 200, body: { runId: 5, families: [], counts: { pass: 0, fail: 0, notChecked: 0 }, count: 0, strings: [], ...empty, familyRatios: {}, familyStatus: {}, extras: {} } };
      }
      if (url === '/api/models/7/runs') return { status: 200, body: [{ id: 5 }] };
      return { status: 404 };
    });
    const runs = useRunsStore();
    await runs.start(7);
    await vi.advanceTimersByTimeAsync(0);
    expect(runs.running).toBe(true);
    await vi.advanceTimersByTimeAsync(2000);
    expect(runs.current?.status).toBe('done');
    expect(runs.members?.runId).toBe(5);
    expect(runs.history).toHaveLength(1);
  });

  it('shows the failure message of a failed run', async () => {
    serve((method, url) => {
      if (url === '/api/runs/9') return { status: 200, body: { id: 9, modelId: 7, status: 'failed', message: 'mechanism at node N4, freedom uy' } };
      if (url === '/api/models/7/runs') return { status: 200, body: [] };
      return { status: 404 };
    });
    const runs = useRunsStore();
    await runs.watchRun(9);
    expect(runs.error).toMatch(/mechanism at node N4/);
  });
});

describe('imports store', () => {
  it('uploads the files as multipart and keeps the preview until committed', async () => {
    serve((method, url, body) => {
      if (url === '/api/projects/1/imports') {
        expect(body).toBeInstanceOf(FormData);
        expect((body as FormData).getAll('files')).toHaveLength(2);
        expect((body as FormData).get('modelId')).toBe('7');
        return { status: 201, body: { id: 'abc', projectId: 1, canCommit: true } };
      }
      if (url === '/api/projects/1/imports/abc/commit') return { status: 201, body: { model: detail, version: 2 } };
      return { status: 404 };
    });
    const imports = useImportsStore();
    const files = [new File(['a'], 'nodes.csv'), new File(['b'], 'members.csv')];
    expect((await imports.upload(1, files, { modelId: 7 }))?.id).toBe('abc');
    expect((await imports.commit())?.version).toBe(2);
    expect(imports.preview).toBeNull();
  });
});
