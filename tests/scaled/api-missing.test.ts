/**
 * Stands in for the `scaled-api` project (the API suite against PostgreSQL and Redis) when
 * an engine is not installed: vitest.config.ts runs this file instead, which says what is missing.
 */
import { describe, it } from 'vitest';
import { missingEngines } from './engines.js';

const missing = missingEngines();
if (missing) console.warn(`API suite on PostgreSQL and Redis skipped: ${missing} not installed`);

describe('API suite on PostgreSQL and Redis', () => {
  it.skip(`skipped: ${missing || 'nothing'} missing`, () => undefined);
});
