/** Section suggestions of a run: one function per route (shared/schemas/suggestions.ts). Numbers are SI. */
import type { ApplySuggestions, AppliedSuggestions, SuggestRequest, Suggestions } from '../../shared/schemas/suggestions.js';
import { http } from './http.js';

/** POST /api/runs/:id/suggestions → proposals for the run's forces (or repeated until stable). */
export function suggestSections(runId: number, input: SuggestRequest): Promise<Suggestions> {
  return http.post<Suggestions>(`/api/runs/${runId}/suggestions`, input);
}

/** POST /api/runs/:id/suggestions/apply → the new model version and the run started on it. */
export function applySuggestions(runId: number, input: ApplySuggestions): Promise<AppliedSuggestions> {
  return http.post<AppliedSuggestions>(`/api/runs/${runId}/suggestions/apply`, input);
}
