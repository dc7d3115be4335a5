/**
 * The lightest adequate section per member or per group, for the forces of one analysis.
 *
 * Each candidate is checked by the design checks themselves (checkModel, ../index.ts) with
 * the run's member forces: the model is copied with the candidate in place of the member's
 * section and checked against the same analysis; no check formula lives here. Candidates of
 * a unit (member or group) are tried lightest first and the first that passes every check of
 * every member of the unit, at or below the target ratio, is proposed. Rounds: in round k
 * every undecided unit tries its k-th candidate, so one checkModel call serves all units.
 *
 * Approximations (stated in `notes` of every result; the rerun confirms them):
 * - forces are the run's: a different section changes the forces of an indeterminate
 *   structure and its self weight;
 * - deflection relative to the chord: each local component of the run's deflection scaled by
 *   the stiffness ratio of its axis, d_major·I_major/I_major,candidate and
 *   d_minor·I_minor/I_minor,candidate (linear elastic bending of the member itself); a
 *   cantilever's tip deflection by the larger of the two ratios.
 * A candidate with any check `not checked` is never proposed.
 */
import type { AnalysisResult } from '../../engine/types.js';
import type { Material, Member, Model, Section } from '../../model/types.js';
import { builtInMaterial } from '../../materials/index.js';
import type { StabilitySummary } from '../../stability/types.js';
import { checkModel } from '../index.js';
import type { CheckRecord } from '../types.js';
import { familyLabel, familyOf, familySections, sectionById, withinLimits } from './candidates.js';
import type { SectionProposal, SuggestBy, SuggestLimits, SuggestOptions, SuggestResult } from './types.js';

export const SUGGEST_NOTES = [
  'Candidates: the catalogue series of each member\'s section and the model\'s own sections of the same shape, lightest (A·ρ per metre) first; a candidate is proposed only if every check of every member it would replace passes at or below the target ratio.',
  'Each candidate is checked with the member forces of this run. A different section changes the forces of an indeterminate structure and the self weight: rerun (or repeat until stable) to confirm.',
  'Deflection of a candidate: each local component of the run\'s deflection relative to the chord scaled by the stiffness ratio of its axis (d_major × I_major/I_major,candidate, d_minor × I_minor/I_minor,candidate); a cantilever\'s tip deflection by the larger of the two ratios. Approximation; the rerun computes it.',
  'A candidate any check of which is not checked is never proposed.',
];

/** A section id no model or catalogue has: members outside a round are left unchecked. */
const SKIP = '\u0000not-in-this-round';

export interface SuggestInput extends SuggestOptions {
  /** the run's stability summary, passed to the checks as the run had it */
  stability?: StabilitySummary;
}

export function normaliseLimits(limits: SuggestLimits = {}): SuggestResult['limits'] {
  const targetRatio = limits.targetRatio ?? 1;
  if (!(targetRatio > 0 && targetRatio <= 1)) throw new Error(`targetRatio: give a ratio above 0 and at most 1 (got ${targetRatio})`);
  if (limits.maxDepth !== undefined && !(limits.maxDepth > 0 && Number.isFinite(limits.maxDepth))) throw new Error(`maxDepth: give a positive depth (got ${limits.maxDepth})`);
  return { targetRatio, ...(limits.maxDepth !== undefined ? { maxDepth: limits.maxDepth } : {}), ...(limits.keepWidth ? { keepWidth: true } : {}) };
}

interface Unit {
  unit: 'member' | 'group';
  key: string;
  indices: number[];
  sections: Section[];
  candidates: Section[];
  family: string;
  shape: Section['shape'] | null;
  reason: string;
  next: number;
  /** best (lowest) ratio reached by a checked candidate, for the reason when none passes */
  best: { id: string; ratio: number } | null;
  notChecked: number;
  result: { section: Section; ratio: number; governing: string } | null;
}

/** Groups of members: by group name (blank = the member alone) or every member alone. */
function unitsOf(model: Model, by: SuggestBy): { unit: 'member' | 'group'; key: string; indices: number[] }[] {
  if (by === 'member') return model.members.map((m, i) => ({ unit: 'member' as const, key: m.id, indices: [i] }));
  const out: { unit: 'member' | 'group'; key: string; indices: number[] }[] = [];
  const groups = new Map<string, number[]>();
  model.members.forEach((m, i) => {
    const g = m.group?.trim();
    if (!g) out.push({ unit: 'member', key: m.id, indices: [i] });
    else {
      let list = groups.get(g);
      if (!list) {
        groups.set(g, (list = []));
        out.push({ unit: 'group', key: g, indices: list });
      }
      list.push(i);
    }
  });
  return out;
}

function materialOf(model: Model, member: Member, cache: Map<string, Material | undefined>): Material | undefined {
  if (!cache.has(member.material)) cache.set(member.material, model.materials.find((m) => m.id === member.material) ?? builtInMaterial(member.material));
  return cache.get(member.material);
}

/** Largest ratio of a member's records with `candidate` in place of `current`; null = a check is not checked. */
function evaluate(
  recs: CheckRecord[], mi: number, analysis: AnalysisResult, current: Section, candidate: Section, service: number[],
): { ratio: number; governing: string } | { notChecked: string } {
  let ratio = -1;
  let governing = '';
  for (const r of recs) {
    if (r.family === 'slenderness') continue;
    if (r.status === 'not checked' || r.ratio === null) return { notChecked: r.note ?? `${r.title} not checked` };
    let v = r.ratio;
    if (r.family === 'deflection') v = scaledDeflection(r, mi, analysis, current, candidate, service);
    if (v > ratio) {
      ratio = v;
      governing = `${r.title}${r.clause ? ` (${r.clause})` : ''}`;
    }
  }
  return ratio < 0 ? { notChecked: 'no check applies' } : { ratio, governing };
}

/** The deflection ratio of a candidate, scaled by the stiffness ratio of each axis (see the header). */
export function scaledDeflection(r: CheckRecord, mi: number, analysis: AnalysisResult, current: Section, candidate: Section, service: number[]): number {
  const fMaj = candidate.props.I_major > 0 ? current.props.I_major / candidate.props.I_major : Infinity;
  const fMin = candidate.props.I_minor > 0 ? current.props.I_minor / candidate.props.I_minor : Infinity;
  const ratio = r.ratio ?? 0;
  if (current.id === candidate.id) return ratio;
  if (r.clause === 'service: cantilever tip' || !(r.capacity && r.capacity > 0)) return ratio * Math.max(fMaj, fMin);
  let worst = 0;
  for (const li of service) {
    const sf = analysis.memberForces(mi, li);
    for (let i = 0; i < sf.x.length; i++) {
      const a = sf.d_major[i] * fMaj, b = sf.d_minor[i] * fMin;
      const v = a * a + b * b;
      if (v > worst) worst = v;
    }
  }
  return Math.sqrt(worst) / r.capacity;
}

export function suggestSections(model: Model, analysis: AnalysisResult, input: SuggestInput = {}): SuggestResult {
  const by = input.by ?? 'member';
  const limits = normaliseLimits(input.limits);
  const stability = input.stability;
  const base = checkModel(model, analysis, { stability });
  const materials = new Map<string, Material | undefined>();
  const lengths = model.members.map((_, i) => analysis.memberLength(i));
  const service = analysis.loadings.map((l, i) => ({ l, i })).filter(({ l }) => l.kind === 'combination' && l.limitState === 'service').map(({ i }) => i);
  const density = (m: Member) => materialOf(model, m, materials)?.density ?? NaN;

  let massBefore = 0;
  const current: (Section | undefined)[] = model.members.map((m, i) => {
    const s = sectionById(model, m.section);
    if (s) massBefore += s.props.A * density(m) * lengths[i];
    return s;
  });

  const units: Unit[] = unitsOf(model, by).map((u) => {
    const unit: Unit = { ...u, sections: [], candidates: [], family: '', shape: null, reason: '', next: 0, best: null, notChecked: 0, result: null };
    const members = u.indices.map((i) => model.members[i]);
    const missing = members.find((m, k) => !current[u.indices[k]]);
    if (model.settings.designCode === 'none') { unit.reason = 'no design code selected'; return unit; }
    if (missing) { unit.reason = `section ${missing.section} not found`; return unit; }
    unit.sections = u.indices.map((i) => current[i]!);
    const tapered = members.find((m) => m.sectionEnd !== undefined && m.sectionEnd !== m.section);
    if (tapered) { unit.reason = `member ${tapered.id} is tapered: sections of tapered members are not proposed`; return unit; }
    const families = unit.sections.map(familyOf);
    unit.shape = families[0].shape;
    unit.family = familyLabel(families[0]);
    if (families.some((f) => f.key !== families[0].key)) {
      unit.reason = `the group's members are of different families (${[...new Set(families.map(familyLabel))].join('; ')}): propose per member`;
      return unit;
    }
    if (members.some((m) => !Number.isFinite(density(m)))) { unit.reason = 'material not found'; return unit; }
    const distinct = [...new Map(unit.sections.map((s) => [s.id, s])).values()];
    unit.candidates = familySections(model, families[0]).filter((c) => withinLimits(c, distinct, limits) === null);
    if (unit.candidates.length === 0) unit.reason = 'no section of the family is within the limits';
    return unit;
  });

  // rounds: every undecided unit tries its next candidate; one checkModel call per round
  for (;;) {
    const open = units.filter((u) => !u.result && u.next < u.candidates.length);
    if (open.length === 0) break;
    const sections = new Array<string>(model.members.length).fill(SKIP);
    for (const u of open) for (const i of u.indices) sections[i] = u.candidates[u.next].id;
    const trial: Model = { ...model, members: model.members.map((m, i) => (sections[i] === m.section ? m : { ...m, section: sections[i] })) };
    const design = checkModel(trial, analysis, { stability });
    const byMember = new Map<string, CheckRecord[]>();
    for (const r of design.records) {
      let list = byMember.get(r.member);
      if (!list) byMember.set(r.member, (list = []));
      list.push(r);
    }
    for (const u of open) {
      const candidate = u.candidates[u.next];
      let ratio = -1;
      let governing = '';
      let unchecked = false;
      for (const i of u.indices) {
        const e = evaluate(byMember.get(model.members[i].id) ?? [], i, analysis, current[i]!, candidate, service);
        if ('notChecked' in e) { unchecked = true; break; }
        if (e.ratio > ratio) {
          ratio = e.ratio;
          governing = e.governing;
        }
      }
      if (unchecked) u.notChecked++;
      else if (ratio <= limits.targetRatio) u.result = { section: candidate, ratio, governing };
      else if (!u.best || ratio < u.best.ratio) u.best = { id: candidate.id, ratio };
      if (!u.result) u.next++;
    }
  }

  const proposals: SectionProposal[] = units.map((u) => {
    const members = u.indices.map((i) => model.members[i]);
    const ratios = u.indices.map((i) => base.members[i]?.ratio).filter((r): r is number => r !== null && r !== undefined);
    const currentIds = [...new Set(members.map((m) => m.section))];
    const mpl = (s: Section, m: Member) => s.props.A * density(m);
    const currentMass = u.sections.length ? Math.max(...u.sections.map((s, k) => mpl(s, members[k]))) : null;
    const out: SectionProposal = {
      unit: u.unit, key: u.key, members: members.map((m) => m.id), shape: u.shape, family: u.family, current: currentIds,
      currentRatio: ratios.length ? Math.max(...ratios) : null, currentMassPerLength: currentMass,
      currentMass: u.indices.reduce((sum, i) => sum + (current[i] ? current[i]!.props.A * density(model.members[i]) * lengths[i] : 0), 0),
      proposed: null, proposedRatio: null, proposedMassPerLength: null, governing: '', massChange: 0, change: false,
      candidates: u.candidates.length, reason: u.reason,
    };
    if (u.result) {
      const s = u.result.section;
      out.proposed = s.id;
      out.proposedRatio = u.result.ratio;
      out.proposedMassPerLength = mpl(s, members[0]);
      out.governing = u.result.governing;
      out.change = members.some((m) => m.section !== s.id);
      out.massChange = u.indices.reduce((sum, i, k) => sum + (s.props.A - u.sections[k].props.A) * density(members[k]) * lengths[i], 0);
      if (!out.change) out.reason = 'the current section is the lightest that passes';
    } else if (!u.reason) {
      const parts = [`none of the ${u.candidates.length} candidate${u.candidates.length === 1 ? '' : 's'} passes at or below ${limits.targetRatio}`];
      if (u.best) parts.push(`the best, ${u.best.id}, reaches ${u.best.ratio.toFixed(3)}`);
      if (u.notChecked) parts.push(`${u.notChecked} could not be checked`);
      out.reason = parts.join('; ');
    }
    return out;
  });
  const changed = proposals.filter((p) => p.change);
  const sectionOf = new Map(model.members.map((m) => [m.id, m.section]));
  return {
    by,
    limits,
    proposals,
    totals: {
      changes: changed.length,
      members: changed.reduce((n, p) => n + p.members.filter((id) => sectionOf.get(id) !== p.proposed).length, 0),
      massChange: changed.reduce((s, p) => s + p.massChange, 0),
      massBefore,
    },
    notes: SUGGEST_NOTES,
  };
}
