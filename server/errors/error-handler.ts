/**
 * The final error middleware and the /api 404. Every failure leaves the server as
 * `{ "error": { "code", "message", "details"? } }`; unexpected errors are logged with an id
 * that the client also receives, and never expose a stack trace.
 */
import { randomUUID } from 'node:crypto';
import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import type { ErrorBody, ValidationDetails } from '../../shared/schemas/error.js';
import type { Logger } from '../config/logger.js';
import { AppError } from './app-error.js';

/** Messages of a ZodError keyed by dotted path (`''` paths go to formErrors). */
export function zodDetails(err: ZodError): ValidationDetails {
  const fieldErrors: Record<string, string[]> = {};
  const formErrors: string[] = [];
  for (const issue of err.issues) {
    const key = issue.path.map(String).join('.');
    if (!key) formErrors.push(issue.message);
    else (fieldErrors[key] ??= []).push(issue.message);
  }
  return { fieldErrors, formErrors };
}

function describeFields(details: ValidationDetails): string {
  const fields = Object.keys(details.fieldErrors);
  if (fields.length === 0) return details.formErrors[0] ?? 'The request is not valid';
  const first = fields[0]!;
  const more = fields.length > 1 ? ` (and ${fields.length - 1} more)` : '';
  return `${first}: ${details.fieldErrors[first]![0]}${more}`;
}

/** Body-parser errors carry `type` and `status`. */
interface HttpParserError {
  type?: string;
  status?: number;
  expose?: boolean;
}

export function toErrorResponse(err: unknown, logger: Logger): { status: number; body: ErrorBody } {
  if (err instanceof AppError) {
    const error: ErrorBody['error'] = { code: err.code, message: err.message };
    if (err.details !== undefined) error.details = err.details;
    return { status: err.status, body: { error } };
  }
  if (err instanceof ZodError) {
    const details = zodDetails(err);
    return {
      status: 400,
      body: { error: { code: 'validation_failed', message: `Invalid request: ${describeFields(details)}`, details } },
    };
  }
  if (err instanceof URIError) {
    // a malformed percent-encoding in the path (`/%ff`): the router could not decode a parameter
    return { status: 400, body: { error: { code: 'bad_request', message: 'The address holds a malformed percent-encoding (such as %ff)' } } };
  }
  const parser = err as HttpParserError;
  if (parser && typeof parser === 'object' && typeof parser.type === 'string') {
    if (parser.type === 'entity.parse.failed') {
      return { status: 400, body: { error: { code: 'bad_request', message: 'The request body is not valid JSON' } } };
    }
    if (parser.type === 'encoding.unsupported') {
      return { status: 415, body: { error: { code: 'bad_request', message: 'The request body uses a Content-Encoding the server does not read (use gzip, deflate, br or none)' } } };
    }
    if (parser.type === 'entity.too.large') {
      return { status: 413, body: { error: { code: 'payload_too_large', message: 'The request body is too large' } } };
    }
    if (parser.expose && parser.status && parser.status >= 400 && parser.status < 500) {
      return { status: parser.status, body: { error: { code: 'bad_request', message: 'The request could not be read' } } };
    }
  }
  const id = randomUUID();
  logger.error(`unexpected error ${id}`, err);
  return {
    status: 500,
    body: { error: { code: 'internal', message: `Something went wrong on the server (error id ${id})`, details: { errorId: id } } },
  };
}

export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, _req, res, next) => {
    if (res.headersSent) return next(err);
    const { status, body } = toErrorResponse(err, logger);
    if (status === 429 && !res.get('Retry-After')) {
      const after = (body.error.details as { retryAfterSeconds?: unknown } | undefined)?.retryAfterSeconds;
      res.set('Retry-After', String(typeof after === 'number' ? Math.ceil(after) : 60));
    }
    res.status(status).json(body);
  };
}

/** Any /api path no router answered. */
export const apiNotFound: RequestHandler = (req, res) => {
  const body: ErrorBody = { error: { code: 'not_found', message: `No API route ${req.method} ${req.originalUrl.split('?')[0]}` } };
  res.status(404).json(body);
};
