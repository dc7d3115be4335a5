/**
 * Review of a run: draft → submitted → returned | approved; returned → submitted.
 *
 *   GET  /api/runs/:runId/review           → RunReview
 *   POST /api/runs/:runId/review/submit    { message } (engineer+ on the project)
 *   POST /api/runs/:runId/review/return    { message } (lead+)
 *   POST /api/runs/:runId/review/approve   { message? } (lead+, not the submitter unless admin)
 *
 * An approved run is final; it locks its model version (no member edits, no new version of
 * that model, no deletion of the project).
 */
import { z } from 'zod';
import { REVIEW_STATUSES } from './runs.js';

export const REVIEW_ACTIONS = ['submit', 'return', 'approve'] as const;
export type ReviewAction = (typeof REVIEW_ACTIONS)[number];

export const reviewMessageSchema = z
  .object({ message: z.string().trim().min(1, 'Write a message for the reviewer').max(4000) })
  .strict();
export const approveSchema = z.object({ message: z.string().trim().max(4000).default('') }).strict();
export type ReviewMessageInput = z.input<typeof reviewMessageSchema>;

export const reviewEventSchema = z.object({
  id: z.number().int(),
  action: z.enum(REVIEW_ACTIONS),
  fromStatus: z.enum(REVIEW_STATUSES),
  toStatus: z.enum(REVIEW_STATUSES),
  message: z.string(),
  userId: z.number().int().nullable(),
  userName: z.string().nullable(),
  createdAt: z.string(),
});
export type ReviewEvent = z.infer<typeof reviewEventSchema>;

export const runReviewSchema = z.object({
  runId: z.number().int(),
  status: z.enum(REVIEW_STATUSES),
  submittedBy: z.number().int().nullable(),
  /** the caller's effective role on the run's project */
  role: z.string(),
  /** what the caller may do now */
  allowed: z.array(z.enum(REVIEW_ACTIONS)),
  /** true when the run's model version is locked by an approval */
  locked: z.boolean(),
  events: z.array(reviewEventSchema),
});
export type RunReview = z.infer<typeof runReviewSchema>;
