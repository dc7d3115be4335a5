/**
 * How a model version is kept: the validated Model (SI) as JSON, gzip-compressed into a
 * BLOB, with a SHA-256 of the JSON as its content hash. Pure functions over Buffers.
 */
import { createHash } from 'node:crypto';
import { gunzipSync, gzipSync } from 'node:zlib';
import { withModelDefaults } from '../../shared/model/defaults.js';
import type { Model } from '../../shared/model/types.js';
import { validationFailed } from '../errors/app-error.js';
import { findNonFinite } from './finite-numbers.js';

export function encodeJson(value: unknown): Buffer {
  return gzipSync(Buffer.from(JSON.stringify(value), 'utf8'), { level: 1 });
}

export function decodeJson<T>(blob: Buffer | Uint8Array): T {
  return JSON.parse(gunzipSync(blob).toString('utf8')) as T;
}

/** The model's JSON text from its stored blob (what the worker threads receive). */
export function decodeText(blob: Buffer | Uint8Array): string {
  return gunzipSync(blob).toString('utf8');
}

export interface EncodedModel {
  data: Buffer;
  hash: string;
}

/** Refuses (400) a model holding a number that is not finite: JSON would store it as null. */
export function encodeModel(model: Model): EncodedModel {
  const bad = findNonFinite(model);
  if (bad) throw validationFailed(bad.message, { problems: [{ severity: 'error', table: bad.table, row: bad.row, column: bad.column, message: bad.message }] });
  const json = JSON.stringify(model);
  return { data: gzipSync(Buffer.from(json, 'utf8'), { level: 1 }), hash: createHash('sha256').update(json).digest('hex') };
}

export function decodeModel(blob: Buffer | Uint8Array): Model {
  return withModelDefaults(decodeJson<Model>(blob));
}
