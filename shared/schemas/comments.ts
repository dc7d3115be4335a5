/**
 * Comments on a run, or on one member of a run.
 *
 *   GET  /api/runs/:runId/comments[?member=]   → Comment[] (oldest first)
 *   POST /api/runs/:runId/comments             NewCommentInput → 201 Comment (engineer+ on the project)
 */
import { z } from 'zod';

export const newCommentSchema = z
  .object({
    body: z.string().trim().min(1, 'Write a comment').max(4000),
    /** a member id of the run's model; absent for a comment on the whole run */
    member: z.string().trim().min(1).max(100).optional(),
  })
  .strict();
export type NewCommentInput = z.input<typeof newCommentSchema>;

export const commentSchema = z.object({
  id: z.number().int(),
  runId: z.number().int(),
  member: z.string().nullable(),
  body: z.string(),
  userId: z.number().int().nullable(),
  userName: z.string().nullable(),
  createdAt: z.string(),
});
export type Comment = z.infer<typeof commentSchema>;
