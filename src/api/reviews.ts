/** Review and comment endpoints of a run: one function per route. */
import type { Comment, NewCommentInput } from '../../shared/schemas/comments.js';
import type { ReviewAction, RunReview } from '../../shared/schemas/reviews.js';
import { http } from './http.js';

/** GET /api/runs/:runId/review. */
export function getReview(runId: number): Promise<RunReview> {
  return http.get<RunReview>(`/api/runs/${runId}/review`);
}

/** POST /api/runs/:runId/review/(submit|return|approve). */
export function reviewStep(runId: number, action: ReviewAction, message: string): Promise<RunReview> {
  return http.post<RunReview>(`/api/runs/${runId}/review/${action}`, { message });
}

/** GET /api/runs/:runId/comments[?member=] ('' = comments on the whole run). */
export function listComments(runId: number, member?: string): Promise<Comment[]> {
  const q = member === undefined ? '' : `?member=${encodeURIComponent(member)}`;
  return http.get<Comment[]>(`/api/runs/${runId}/comments${q}`);
}

/** POST /api/runs/:runId/comments. */
export function addComment(runId: number, input: NewCommentInput): Promise<Comment> {
  return http.post<Comment>(`/api/runs/${runId}/comments`, input);
}
