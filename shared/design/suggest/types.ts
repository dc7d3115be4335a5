/**
 * Section suggestions (issue 16): for a run's forces, the lightest section of each member's
 * family that passes every check. Masses in kg and kg/m, depths and widths in m (SI).
 */
import type { ShapeKind } from '../../model/types.js';

/** Limits the engineer sets on the candidates. */
export interface SuggestLimits {
  /** largest overall depth allowed (m); undefined = any */
  maxDepth?: number;
  /** the governing ratio a proposal must stay at or below (0 < target ≤ 1; default 1) */
  targetRatio?: number;
  /** keep each member's width (flange width bf; b of hollow and solid rectangles and angles; D of round shapes) */
  keepWidth?: boolean;
}

/** Per member, or per `group` (members without a group are proposed on their own). */
export type SuggestBy = 'member' | 'group';

export interface SuggestOptions {
  by?: SuggestBy;
  limits?: SuggestLimits;
}

export interface SectionProposal {
  /** what is proposed for: one member, or every member of a group */
  unit: 'member' | 'group';
  /** the member id, or the group name */
  key: string;
  members: string[];
  shape: ShapeKind | null;
  /** where the candidates came from, e.g. "IPE series and the model's own i sections" */
  family: string;
  /** the members' sections now (distinct, in member order) */
  current: string[];
  /** the governing ratio now (largest over the members); null when nothing could be checked */
  currentRatio: number | null;
  /** mass per length of the (heaviest) current section, kg/m */
  currentMassPerLength: number | null;
  /** total mass of the members now, kg */
  currentMass: number;
  /** the lightest candidate that passes; null when none does (see `reason`) */
  proposed: string | null;
  /** the governing ratio with the proposed section and the run's forces (deflection scaled by stiffness) */
  proposedRatio: number | null;
  proposedMassPerLength: number | null;
  /** what governs the proposed ratio: check title and clause */
  governing: string;
  /** total mass change over the members, kg (negative = saved); 0 without a proposal */
  massChange: number;
  /** true when the proposal changes at least one member's section */
  change: boolean;
  /** candidates checked (after the limits) */
  candidates: number;
  /** why there is no proposal, or a remark */
  reason: string;
}

export interface SuggestResult {
  by: SuggestBy;
  limits: Required<Pick<SuggestLimits, 'targetRatio'>> & Omit<SuggestLimits, 'targetRatio'>;
  proposals: SectionProposal[];
  totals: {
    /** proposals that change a section */
    changes: number;
    /** members whose section changes */
    members: number;
    /** kg, negative = saved */
    massChange: number;
    /** total steel mass of the members now, kg */
    massBefore: number;
  };
  /** the approximations the proposals rest on (stated on every result) */
  notes: string[];
}

/** One pass of analyse → suggest → apply. */
export interface IterationStep {
  iteration: number;
  /** members whose section changed in this pass */
  changed: number;
  /** largest governing ratio of the analysis of this pass (before applying), null when none */
  maxRatio: number | null;
  massChange: number;
}

export interface IterateResult {
  /** passes of analyse → suggest → apply made (the last one changes nothing when converged) */
  iterations: number;
  converged: boolean;
  /** the proposals from the original sections to the final ones; ratios from the final analysis (no approximation) */
  result: SuggestResult;
  /** member → final section, for members whose section changed */
  sections: Record<string, string>;
  steps: IterationStep[];
}
