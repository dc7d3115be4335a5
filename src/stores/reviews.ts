/** The review of the run being shown, and its comments (whole run and per member). */
import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import * as api from '../api/reviews.js';
import type { Comment } from '../../shared/schemas/comments.js';
import type { ReviewAction, RunReview } from '../../shared/schemas/reviews.js';
import { errorMessage } from '../utils/format.js';

/** Comment counts per member id (comments on the whole run are left out). */
export function countByMember(comments: readonly Comment[]): Record<string, number> {
  const out: Record<string, number> = {};
  for (const c of comments) if (c.member) out[c.member] = (out[c.member] ?? 0) + 1;
  return out;
}

export const useReviewsStore = defineStore('reviews', () => {
  const review = ref<RunReview | null>(null);
  const comments = ref<Comment[]>([]);
  const loading = ref(false);
  const saving = ref(false);
  const error = ref<string | null>(null);

  const memberCounts = computed(() => countByMember(comments.value));
  const runComments = computed(() => comments.value.filter((c) => c.member === null));
  const forMember = (member: string) => comments.value.filter((c) => c.member === member);

  async function load(runId: number): Promise<void> {
    loading.value = true;
    error.value = null;
    if (review.value?.runId !== runId) {
      review.value = null;
      comments.value = [];
    }
    try {
      const [r, c] = await Promise.all([api.getReview(runId), api.listComments(runId)]);
      review.value = r;
      comments.value = c;
    } catch (err) {
      error.value = errorMessage(err);
    } finally {
      loading.value = false;
    }
  }

  /** Takes a review step; rethrows so the dialog can show field messages. */
  async function step(runId: number, action: ReviewAction, message: string): Promise<RunReview> {
    saving.value = true;
    error.value = null;
    try {
      review.value = await api.reviewStep(runId, action, message);
      return review.value;
    } catch (err) {
      error.value = errorMessage(err);
      throw err;
    } finally {
      saving.value = false;
    }
  }

  async function comment(runId: number, body: string, member?: string): Promise<Comment> {
    saving.value = true;
    error.value = null;
    try {
      const c = await api.addComment(runId, member ? { body, member } : { body });
      comments.value = [...comments.value, c];
      return c;
    } catch (err) {
      error.value = errorMessage(err);
      throw err;
    } finally {
      saving.value = false;
    }
  }

  return { review, comments, loading, saving, error, memberCounts, runComments, forMember, load, step, comment };
});
