/**
 * The JSON body parser, with every failure to read a body turned into a clean 4xx: a body
 * whose Content-Encoding does not match its bytes (zlib fails on it) is 400, never a 500 with
 * a stack trace in the log. body-parser's own errors (bad JSON, too large, unsupported
 * encoding) keep their status and are mapped by the error handler.
 */
import express, { type RequestHandler } from 'express';
import { badRequest } from '../errors/app-error.js';

export function jsonBody(limit: string): RequestHandler {
  const parse = express.json({ limit });
  return (req, res, next) => {
    parse(req, res, (err?: unknown) => {
      if (!err) return next();
      const { status, type } = err as { status?: unknown; type?: unknown };
      // body-parser's own refusals carry a `type`; a zlib failure is wrapped as a bare 400
      if (typeof status === 'number' && status >= 400 && status < 500 && typeof type === 'string') return next(err);
      const encoding = req.get('content-encoding');
      next(badRequest(`The request body could not be read${encoding ? ` as Content-Encoding: ${encoding}` : ''}`));
    });
  };
}
