/** Reports store with a stubbed fetch: a package is started, polled to the end, then offered for download. */
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { useReportsStore } from '../../src/stores/reports.js';

function serve(route: (url: string, init?: RequestInit) => { status: number; body: unknown }) {
  const fetchMock = vi.fn(async (url: string, init?: RequestInit) => {
    const r = route(url, init);
    return new Response(JSON.stringify(r.body), { status: r.status });
  });
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

const job = (phase: string, done: number, pages: number | null = null) => ({ id: 'abc', runId: 7, phase, done, total: 2, pages, message: '', fileName: 'beam-v1-run7-calculation-package.pdf' });

beforeEach(() => {
  setActivePinia(createPinia());
  vi.useFakeTimers();
});
afterEach(() => {
  vi.useRealTimers();
  vi.unstubAllGlobals();
});

describe('reports store', () => {
  it('starts the package, follows its progress and gives the file address when done', async () => {
    const answers = [job('gathering', 0), job('gathering', 1), job('writing', 1), job('done', 2, 6)];
    const fetchMock = serve(() => ({ status: answers.length === 4 ? 202 : 200, body: answers.shift() }));
    const store = useReportsStore();
    const done = store.generate(7, { members: 'failing' });
    expect(store.writing).toBe(true);
    await vi.runAllTimersAsync();
    await done;
    expect(fetchMock.mock.calls[0][0]).toBe('/api/runs/7/reports');
    expect(JSON.parse(String(fetchMock.mock.calls[0][1]?.body))).toEqual({ members: 'failing' });
    expect(fetchMock.mock.calls[1][0]).toBe('/api/runs/7/reports/abc');
    expect(store.job?.pages).toBe(6);
    expect(store.progress).toBe(1);
    expect(store.fileUrl).toBe('/api/runs/7/reports/abc/file');
    expect(store.writing).toBe(false);
  });

  it('shows the server message when members are unknown', async () => {
    serve(() => ({ status: 400, body: { error: { code: 'bad_request', message: 'members: M99 is not in this run' } } }));
    const store = useReportsStore();
    await store.generate(7, { members: ['M99'] });
    expect(store.error).toBe('members: M99 is not in this run');
    expect(store.fileUrl).toBeNull();
    expect(store.writing).toBe(false);
  });
});
