/** Runs store with a stubbed fetch: a mode or buckled shape is loaded for the picture, and a missing one is said plainly. */
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { useRunsStore } from '../../src/stores/runs.js';

function serve(route: (url: string) => { status: number; body: unknown }) {
  const fetchMock = vi.fn(async (url: string) => {
    const r = route(url);
    return new Response(JSON.stringify(r.body), { status: r.status });
  });
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

beforeEach(() => setActivePinia(createPinia()));
afterEach(() => vi.unstubAllGlobals());

describe('runs store: shapes', () => {
  it('asks for the shape by kind, number and loading and keeps it', async () => {
    const shape = { runId: 4, kind: 'buckling', index: 1, loading: 'ULS 1', label: 'ULS 1 buckling mode 1: αcr = 8.300', displacements: [0, 1, 0, 0, 0, 0] };
    const fetchMock = serve(() => ({ status: 200, body: shape }));
    const runs = useRunsStore();
    await runs.loadShape(4, { kind: 'buckling', index: 1, loading: 'ULS 1' });
    expect(fetchMock.mock.calls[0][0]).toBe('/api/runs/4/shapes?kind=buckling&index=1&loading=ULS%201');
    expect(runs.shape).toEqual(shape);
    expect(runs.shapeLoading).toBe(false);
    await runs.loadShape(4, null);
    expect(runs.shape).toBeNull();
  });

  it('shows the server message when the shape does not exist', async () => {
    serve(() => ({ status: 404, body: { error: { code: 'not_found', message: 'mode 9 does not exist: this run has 3 natural modes' } } }));
    const runs = useRunsStore();
    await runs.loadShape(4, { kind: 'mode', index: 9 });
    expect(runs.shape).toBeNull();
    expect(runs.error).toBe('mode 9 does not exist: this run has 3 natural modes');
  });
});
