import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError, request, setUnauthorizedHandler, toApiError } from '../../src/api/http.js';

function answer(status: number, body?: unknown, raw?: string): Response {
  const text = raw ?? (body === undefined ? '' : JSON.stringify(body));
  return new Response(status === 204 ? null : text, { status, headers: { 'Content-Type': 'application/json' } });
}

afterEach(() => {
  vi.unstubAllGlobals();
  setUnauthorizedHandler(null);
});

describe('request', () => {
  it('sends JSON with the same-origin cookie and returns the parsed body', async () => {
    const fetchMock = vi.fn(async () => answer(201, { id: 5, name: 'P' }));
    vi.stubGlobal('fetch', fetchMock);
    await expect(request('POST', '/api/projects', { name: 'P' })).resolves.toEqual({ id: 5, name: 'P' });
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/projects');
    expect(init.method).toBe('POST');
    expect(init.credentials).toBe('same-origin');
    expect(init.body).toBe('{"name":"P"}');
    expect((init.headers as Record<string, string>)['Content-Type']).toBe('application/json');
  });

  it('returns undefined for 204', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => answer(204)));
    await expect(request('DELETE', '/api/projects/1')).resolves.toBeUndefined();
  });

  it('turns the error body into an ApiError with code, message and details', async () => {
    const details = { fieldErrors: { name: ['Name is required'] }, formErrors: [] };
    vi.stubGlobal('fetch', vi.fn(async () => answer(400, { error: { code: 'validation_failed', message: 'Check the fields', details } })));
    const err = await request('POST', '/api/projects', {}).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ApiError);
    expect(err).toMatchObject({ status: 400, code: 'validation_failed', message: 'Check the fields', details });
  });

  it('still gives a readable error when the body is not the error shape', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => answer(502, undefined, '<html>Bad gateway</html>')));
    await expect(request('GET', '/api/projects')).rejects.toMatchObject({ status: 502, code: 'http_502' });
  });

  it('reports a network failure as status 0', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => { throw new TypeError('Failed to fetch'); }));
    await expect(request('GET', '/api/projects')).rejects.toMatchObject({ status: 0, code: 'network' });
  });

  it('calls the session-ended handler on 401, except for sign-in and who-am-I', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => answer(401, { error: { code: 'unauthorized', message: 'Sign in first' } })));
    const handler = vi.fn();
    setUnauthorizedHandler(handler);
    await expect(request('GET', '/api/projects')).rejects.toBeInstanceOf(ApiError);
    await expect(request('GET', '/api/auth/me')).rejects.toBeInstanceOf(ApiError);
    await expect(request('POST', '/api/auth/login', {})).rejects.toBeInstanceOf(ApiError);
    expect(handler).toHaveBeenCalledTimes(1);
    expect(handler).toHaveBeenCalledWith('/api/projects');
  });
});

describe('toApiError', () => {
  it('ignores an error object without code and message', () => {
    expect(toApiError(500, { error: { code: 1 } })).toMatchObject({ code: 'http_500' });
    expect(toApiError(404, null)).toMatchObject({ code: 'http_404', status: 404 });
  });
});
