/**
 * Suggest until stable: analyse → suggest → apply every change → analyse again, until no
 * suggestion changes a section (converged) or the cap is reached. The forces of an
 * indeterminate frame move with the stiffness of its members, so a proposal made with the
 * old forces is confirmed only by the next analysis. Uses the run's own entry points:
 * analyseModel (shared/stability) and, through suggestSections, checkModel.
 */
import type { Model, Section } from '../../model/types.js';
import { resolveSection } from '../../reader/library.js';
import { analyseModel } from '../../stability/index.js';
import { suggestSections } from './suggest.js';
import type { IterateResult, IterationStep, SectionProposal, SuggestOptions, SuggestResult } from './types.js';

export const MAX_ITERATIONS = 10;

/**
 * The model with some members' sections replaced, by the reader's rules (a catalogue
 * designation not yet in the sections is added as the reader adds it). Throws for an unknown
 * section (a proposal always names a known one).
 */
export function applySections(model: Model, sections: Record<string, string>): Model {
  const own = new Map(model.sections.map((s) => [s.id, s]));
  const used = new Map<string, Section>();
  const added: Section[] = [];
  const members = model.members.map((m) => {
    const id = sections[m.id];
    if (id === undefined || id === m.section) return m;
    const before = used.size;
    const s = resolveSection(id, own, used);
    if (!s) throw new Error(`member ${m.id}: unknown section "${id}"`);
    if (used.size > before) added.push(s);
    return { ...m, section: s.id };
  });
  return { ...model, members, sections: [...model.sections, ...added] };
}

/** Member → proposed section, for the proposals that change something. */
export function changesOf(result: SuggestResult): Record<string, string> {
  const out: Record<string, string> = {};
  for (const p of result.proposals) if (p.change && p.proposed) for (const m of p.members) out[m] = p.proposed;
  return out;
}

export interface IterateOptions extends SuggestOptions {
  /** analyses at most (default MAX_ITERATIONS) */
  maxIterations?: number;
}

export function iterateSuggestions(input: Model, options: IterateOptions = {}): IterateResult {
  const max = Math.max(1, Math.min(50, Math.floor(options.maxIterations ?? MAX_ITERATIONS)));
  let model = input;
  let first: SuggestResult | null = null;
  let last: SuggestResult | null = null;
  let converged = false;
  let iterations = 0;
  const steps: IterationStep[] = [];
  while (iterations < max) {
    iterations++;
    const { analysis, stability, model: analysed } = analyseModel(model);
    last = suggestSections(analysed, analysis, { ...options, stability });
    first ??= last;
    const changes = changesOf(last);
    const changed = Object.keys(changes).length;
    const ratios = last.proposals.map((p) => p.currentRatio).filter((r): r is number => r !== null);
    steps.push({ iteration: iterations, changed, maxRatio: ratios.length ? Math.max(...ratios) : null, massChange: last.totals.massChange });
    if (changed === 0) {
      converged = true;
      break;
    }
    if (iterations === max) break;
    model = applySections(model, changes);
  }
  const sections: Record<string, string> = {};
  const original = new Map(input.members.map((m) => [m.id, m.section]));
  for (const m of model.members) if (original.get(m.id) !== m.section) sections[m.id] = m.section;
  return { iterations, converged, result: fromOriginal(first!, last!, original), sections, steps };
}

/**
 * The proposals from the original sections to those of the last analysis: the ratio is the
 * last analysis's own (the section with its own forces: no approximation).
 */
function fromOriginal(first: SuggestResult, last: SuggestResult, original: Map<string, string>): SuggestResult {
  const before = new Map(first.proposals.map((p) => [`${p.unit}\u0000${p.key}`, p]));
  const proposals: SectionProposal[] = last.proposals.map((p) => {
    const start = before.get(`${p.unit}\u0000${p.key}`) ?? p;
    const was = [...new Set(p.members.map((m) => original.get(m) ?? ''))];
    const now = p.current;
    const moved = now.length === 1 && p.members.some((m) => original.get(m) !== now[0]);
    const still = p.change ? `still changing after the last pass (${p.current.join(', ')} → ${p.proposed})` : '';
    const common = { ...p, current: was, currentRatio: start.currentRatio, currentMassPerLength: start.currentMassPerLength, currentMass: start.currentMass };
    if (!moved) {
      return { ...common, proposed: null, proposedRatio: null, proposedMassPerLength: null, governing: '', massChange: 0, change: false,
        reason: still || (p.proposed === now[0] && now.length === 1 ? 'the current section is the lightest that passes' : p.reason || start.reason) };
    }
    return {
      ...common,
      proposed: now[0],
      // the last analysis's own ratio of this section (its own forces: no approximation)
      proposedRatio: p.currentRatio,
      proposedMassPerLength: p.currentMassPerLength,
      governing: p.proposed === now[0] ? p.governing : '',
      massChange: p.currentMass - start.currentMass,
      change: true,
      reason: still,
    };
  });
  const changed = proposals.filter((p) => p.change);
  return {
    ...last,
    proposals,
    totals: {
      changes: changed.length,
      members: changed.reduce((n, p) => n + p.members.filter((m) => original.get(m) !== p.proposed).length, 0),
      massChange: changed.reduce((s, p) => s + p.massChange, 0),
      massBefore: first.totals.massBefore,
    },
  };
}
