/**
 * The one error body every API route answers with on failure:
 * `{ "error": { "code", "message", "details"? } }`.
 */
import { z } from 'zod';

/** Machine-readable error codes. Add new ones at the end; never rename. */
export const ERROR_CODES = [
  'bad_request',
  'validation_failed',
  'unauthorized',
  'forbidden',
  'not_found',
  'conflict',
  'payload_too_large',
  'rate_limited',
  'internal',
  'locked',
] as const;
export type ErrorCode = (typeof ERROR_CODES)[number];

/** Details of a `validation_failed` error: messages keyed by dotted field path. */
export const validationDetailsSchema = z.object({
  fieldErrors: z.record(z.string(), z.array(z.string())),
  formErrors: z.array(z.string()),
});
export type ValidationDetails = z.infer<typeof validationDetailsSchema>;

export const errorBodySchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    details: z.unknown().optional(),
  }),
});
export type ErrorBody = z.infer<typeof errorBodySchema>;
