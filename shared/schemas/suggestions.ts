/**
 * Section suggestions of a run (issue 16):
 *
 *   POST /api/runs/:id/suggestions         SuggestRequest → Suggestions (computed in a run worker)
 *   POST /api/runs/:id/suggestions/apply   ApplySuggestions → AppliedSuggestions (one new model
 *                                          version with the chosen sections, then a run of it, 202)
 *
 * Numbers are SI (maxDepth in m, masses in kg and kg/m); `units` says how to show them.
 */
import { z } from 'zod';
import type { ModelSummary } from './models.js';
import type { RunSummary } from './runs.js';
import type { SectionProposal, SuggestResult } from '../design/suggest/types.js';
import type { DesignCode, UnitSystem } from '../model/types.js';

export const suggestRequestSchema = z
  .object({
    by: z.enum(['member', 'group']).default('member'),
    limits: z
      .object({
        /** the governing ratio a proposal must stay at or below */
        targetRatio: z.number().gt(0, 'give a ratio above 0').lte(1, 'at most 1').optional(),
        /** m */
        maxDepth: z.number().positive('give a positive depth').finite().optional(),
        keepWidth: z.boolean().optional(),
      })
      .strict()
      .default({}),
    /** analyse → suggest → apply until nothing changes (at most 10 passes), from this run's version */
    repeat: z.boolean().default(false),
  })
  .strict();
export type SuggestRequest = z.input<typeof suggestRequestSchema>;

export type { SectionProposal };

export interface Suggestions extends SuggestResult {
  runId: number;
  modelId: number;
  version: number;
  designCode: DesignCode;
  units: UnitSystem;
  /** with `repeat`: analysis passes made and whether the last changed nothing; null otherwise */
  iterations: number | null;
  converged: boolean | null;
}

export const applySuggestionsSchema = z
  .object({
    changes: z
      .array(z.object({ member: z.string().trim().min(1).max(200), section: z.string().trim().min(1).max(200) }).strict())
      .min(1, 'choose at least one proposal')
      .max(100_000),
    /** what the new version says about itself (default: how many members from which run) */
    message: z.string().trim().max(500).optional(),
  })
  .strict();
export type ApplySuggestions = z.input<typeof applySuggestionsSchema>;

export interface AppliedSuggestions {
  model: ModelSummary;
  run: RunSummary;
}
