import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import express from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { verificationRouter } from '../../../server/verification/verification.router.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

describe('GET /verification/report.html', () => {
  let dir: string;
  beforeAll(() => {
    dir = mkdtempSync(path.join(tmpdir(), 'trestle-verify-'));
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('answers 404 with the command to run while the report has not been generated', async () => {
    const app = express().use('/verification', verificationRouter(dir));
    const res = await request(app).get('/verification/report.html');
    expect(res.status).toBe(404);
    expect(res.text).toMatch(/npm run verify/);
  });
  it('serves the generated HTML and JSON without signing in', async () => {
    writeFileSync(path.join(dir, 'report.html'), '<!doctype html><title>report</title>');
    writeFileSync(path.join(dir, 'report.json'), '{"counts":{"tests":1}}');
    const app = express().use('/verification', verificationRouter(dir));
    const html = await request(app).get('/verification/report.html');
    expect(html.status).toBe(200);
    expect(html.headers['content-type']).toMatch(/text\/html/);
    expect(html.text).toContain('<title>report</title>');
    const json = await request(app).get('/verification/report.json');
    expect(json.body).toEqual({ counts: { tests: 1 } });
  });
  describe('in the app', () => {
    let t: TestApp;
    beforeAll(async () => {
      t = await createTestApp({ seed: 'none' });
    });
    afterAll(async () => t.close());
    it('is mounted at /verification, not swallowed by the client fallback', async () => {
      const res = await request(t.app).get('/verification/report.html');
      expect([200, 404]).toContain(res.status);
      if (res.status === 404) expect(res.text).toMatch(/npm run verify/);
      else expect(res.text).toMatch(/verification report/);
    });
  });
});
