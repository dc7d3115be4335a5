/**
 * The one error type of the server. Throw it anywhere (services too); the final error
 * middleware turns it into `{ "error": { "code", "message", "details"? } }` with `status`.
 */
import type { ErrorCode } from '../../shared/schemas/error.js';

export class AppError extends Error {
  override name = 'AppError';
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
  }
}

export const badRequest = (message: string, details?: unknown) => new AppError(400, 'bad_request', message, details);
export const validationFailed = (message: string, details?: unknown) => new AppError(400, 'validation_failed', message, details);
export const unauthorized = (message = 'Sign in to continue') => new AppError(401, 'unauthorized', message);
export const forbidden = (message = 'Your role does not allow this') => new AppError(403, 'forbidden', message);
export const notFound = (message = 'Not found') => new AppError(404, 'not_found', message);
export const conflict = (message: string, details?: unknown) => new AppError(409, 'conflict', message, details);
