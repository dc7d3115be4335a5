import { mkdtempSync, rmSync, writeFileSync, mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from './helpers/test-app.js';

describe('health and the single-page app', () => {
  let t: TestApp;
  let dist: string;
  beforeAll(async () => {
    dist = mkdtempSync(path.join(tmpdir(), 'trestle-dist-'));
    writeFileSync(path.join(dist, 'index.html'), '<!doctype html><title>Trestle test shell</title>');
    mkdirSync(path.join(dist, 'assets'));
    writeFileSync(path.join(dist, 'assets', 'app-abc123.js'), 'console.log(1)');
    t = await createTestApp({ seed: 'none', config: { distDir: dist } });
  });
  afterAll(async () => {
    await t.close();
    rmSync(dist, { recursive: true, force: true });
  });

  it('GET /api/health answers 200 {"status":"ok"} without signing in', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok' });
  });

  it('serves index.html for client routes and built assets as files', async () => {
    for (const url of ['/', '/projects/12', '/admin/users?x=1']) {
      const res = await request(t.app).get(url);
      expect(res.status).toBe(200);
      expect(res.text).toContain('Trestle test shell');
    }
    const asset = await request(t.app).get('/assets/app-abc123.js');
    expect(asset.status).toBe(200);
    expect(asset.headers['cache-control']).toMatch(/immutable/);
  });

  it('sends security headers and no X-Powered-By', async () => {
    const res = await request(t.app).get('/');
    expect(res.headers['content-security-policy']).toMatch(/default-src 'self'/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});

describe('without a built client', () => {
  it('says how to build it instead of failing', async () => {
    const t = await createTestApp({ seed: 'none' });
    const res = await request(t.app).get('/projects');
    expect(res.status).toBe(404);
    expect(res.text).toMatch(/npm run build/);
    await t.close();
  });
});
