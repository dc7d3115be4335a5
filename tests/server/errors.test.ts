import express from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { errorBodySchema } from '../../shared/schemas/error.js';
import { createLogger, type Logger } from '../../server/config/logger.js';
import { AppError } from '../../server/errors/app-error.js';
import { errorHandler } from '../../server/errors/error-handler.js';
import { createTestApp, type TestApp } from './helpers/test-app.js';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('error shapes', () => {
  it('answers malformed JSON with 400 bad_request in the error shape', async () => {
    const res = await t.as('engineer').post('/api/projects').set('Content-Type', 'application/json').send('{"name": ');
    expect(res.status).toBe(400);
    expect(errorBodySchema.parse(res.body).error.code).toBe('bad_request');
    expect(res.body.error.message).toMatch(/not valid JSON/);
  });

  it('answers a mistyped field with 400 and a message per field', async () => {
    const res = await t.as('engineer').post('/api/projects').send({ name: 42, units: 'furlongs' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.details.fieldErrors.name[0]).toMatch(/string/i);
    expect(res.body.error.details.fieldErrors.units[0]).toMatch(/metric/);
  });

  it('answers an oversized body with 413', async () => {
    const res = await t.as('engineer').post('/api/projects').send({ name: 'x', description: 'y'.repeat(6 * 1024 * 1024) });
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
  });

  it('answers unknown /api routes with 404 JSON, whatever the method', async () => {
    for (const [method, url] of [['get', '/api/nothing-here'], ['post', '/api/projects/1/unknown'], ['delete', '/api']] as const) {
      const res = await request(t.app)[method](url);
      expect(res.status).toBe(404);
      expect(res.type).toBe('application/json');
      expect(res.body.error.code).toBe('not_found');
    }
  });
});

describe('error middleware', () => {
  function appThrowing(err: unknown, logger: Logger) {
    const app = express();
    app.get('/boom', async () => {
      throw err;
    });
    app.use(errorHandler(logger));
    return app;
  }

  it('turns an unexpected error into 500 with an error id that is logged, and no stack trace', async () => {
    const logged: string[] = [];
    const logger: Logger = { ...createLogger('silent'), error: (m) => logged.push(m) };
    const res = await request(appThrowing(new Error('secret internals at /srv/x.ts:12'), logger)).get('/boom');
    expect(res.status).toBe(500);
    expect(res.body.error.code).toBe('internal');
    const id = res.body.error.details.errorId as string;
    expect(res.body.error.message).toContain(id);
    expect(logged.join('\n')).toContain(id);
    expect(res.text).not.toMatch(/secret internals|at .*\.ts|stack/);
  });

  it('passes an AppError through with its status, code and details', async () => {
    const res = await request(appThrowing(new AppError(409, 'conflict', 'Already there', { x: 1 }), createLogger('silent'))).get('/boom');
    expect(res.status).toBe(409);
    expect(res.body).toEqual({ error: { code: 'conflict', message: 'Already there', details: { x: 1 } } });
  });

  it('keys zod messages by dotted path', async () => {
    const schema = z.object({ rows: z.array(z.object({ x: z.number() })) });
    const err = schema.safeParse({ rows: [{ x: 1 }, { x: 'a' }] }).error;
    const res = await request(appThrowing(err, createLogger('silent'))).get('/boom');
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.details.fieldErrors)).toEqual(['rows.1.x']);
  });
});
