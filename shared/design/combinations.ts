/**
 * Generated load combinations from case categories (setting `combination_rule`).
 *
 * asce7-lrfd — ASCE/SEI 7-22 2.3.1 basic combinations 1–5 and 2.3.6 combinations 6–7
 * (seismic), from memory:
 *   1. 1.4D   2. 1.2D + 1.6L + 0.5(Lr or S or R)   3. 1.2D + 1.6(Lr or S or R) + (L or 0.5W)
 *   4. 1.2D + 1.0W + L + 0.5(Lr or S or R)   5. 0.9D + 1.0W
 *   6. 1.2D + 1.0E + L + 0.15S   7. 0.9D + 1.0E
 * asce7-asd — ASCE/SEI 7-22 2.4.1 combinations 1–7 and 2.4.5 combinations 8–10, from memory:
 *   1. D   2. D + L   3. D + (Lr or S or R)   4. D + 0.75L + 0.75(Lr or S or R)   5. D + 0.6W
 *   6. D + 0.75L + 0.75(0.6W) + 0.75(Lr or S or R)   7. 0.6D + 0.6W
 *   8. D + 0.7E   9. D + 0.525E + 0.75L + 0.1S   10. 0.6D + 0.7E
 * Choices made (stated in each combination's source):
 * - all cases of a category act together (dead, live, roof_live, snow, rain are summed);
 *   "Lr or S or R" takes each present category in turn (the maximum follows from checking
 *   every combination);
 * - wind cases are taken one at a time with their own sign (the workbook defines each
 *   direction as a case); seismic cases one at a time with + and −; the seismic load effect
 *   E is the case itself with factor 1.0 (Eh only: the vertical effect Ev = 0.2·SDS·D and
 *   the overstrength combinations with Ω0 are left out); L is taken with factor 1.0 in
 *   combinations 3, 4, 6 (the 0.5L exception is not used);
 * - temperature and `other` cases, notional loads, flood, ice and atmospheric ice loads
 *   are left out.
 * Service combinations for the ASCE rules (common practice, unfactored gravity loads as in
 * ASD 2–4): D + L, D + (Lr or S or R), D + 0.75L + 0.75(Lr or S or R); wind is left out.
 *
 * en1990-6.10 — EN 1990 Eq. (6.10): Σ γG·Gk + γQ·Qk,1 + Σ γQ·ψ0,i·Qk,i with γG = 1.35
 * (unfavourable) and γQ = 1.5, each variable action leading in turn; with a leading wind
 * action also 1.0·Gk + 1.5·Wk (permanent action favourable, other variable actions
 * absent). ψ0 from EN 1990 Table A1.1 (from memory): imposed (live, categories A–D) 0.7,
 * roofs (roof_live, category H) 0, snow (sites at altitude ≤ 1000 m) 0.5, wind 0.6,
 * temperature 0.6; rain has no EN 1990 value and is treated as a roof action with ψ0 = 0.
 * Seismic (6.4.3.4) and accidental situations and `other` cases are left out. Wind cases
 * and temperature cases are alternatives (one of each at a time). Service: characteristic
 * combinations (6.14b) Gk + Qk,1 + Σ ψ0,i·Qk,i.
 */
import type { CaseCategory, Combination, CombinationRule, CombinationTerm, LimitState, LoadCase } from '../model/types.js';

/** EN 1990 Table A1.1 ψ0 (from memory) per category used by en1990-6.10. */
export const EN1990_PSI0: Partial<Record<CaseCategory, number>> = { live: 0.7, roof_live: 0, snow: 0.5, wind: 0.6, temperature: 0.6, rain: 0 };

type Part = { cases: LoadCase[]; factor: number };

class Builder {
  readonly out: Combination[] = [];
  private readonly seen = new Set<string>();
  private readonly caseIds: Set<string>;
  private n: Record<string, number> = {};

  constructor(cases: LoadCase[]) {
    this.caseIds = new Set(cases.map((c) => c.id));
  }

  add(prefix: string, limitState: LimitState, parts: Part[], source: string): void {
    const factors = new Map<string, number>();
    for (const p of parts) for (const c of p.cases) factors.set(c.id, (factors.get(c.id) ?? 0) + p.factor);
    const terms: CombinationTerm[] = [...factors].filter(([, f]) => f !== 0).map(([c, f]) => ({ case: c, factor: round(f) }));
    if (!terms.length) return;
    const sig = `${limitState}|${terms.map((t) => `${t.case}:${t.factor}`).sort().join(',')}`;
    if (this.seen.has(sig)) return;
    this.seen.add(sig);
    this.n[prefix] = (this.n[prefix] ?? 0) + 1;
    let id = `${prefix}${this.n[prefix]}`;
    while (this.caseIds.has(id)) id += "'";
    this.out.push({ id, limitState, terms, source, generated: true });
  }
}

function round(f: number): number {
  return Math.round(f * 1e9) / 1e9;
}

function byCategory(cases: LoadCase[]): (c: CaseCategory) => LoadCase[] {
  return (cat) => cases.filter((c) => c.category === cat);
}

/** "Lr or S or R": each present category in turn (or nothing when none is present). */
function roofAlternatives(of: (c: CaseCategory) => LoadCase[]): { name: string; cases: LoadCase[] }[] {
  const alts = (['roof_live', 'snow', 'rain'] as const).map((c) => ({ name: { roof_live: 'Lr', snow: 'S', rain: 'R' }[c], cases: of(c) })).filter((a) => a.cases.length);
  return alts.length ? alts : [{ name: '', cases: [] }];
}

function asce(cases: LoadCase[], lrfd: boolean): Combination[] {
  const of = byCategory(cases);
  const D = of('dead'), L = of('live'), S = of('snow');
  const W = of('wind').map((c) => [c]);
  const E = of('seismic').flatMap((c) => [{ c, sign: 1 }, { c, sign: -1 }]);
  const roof = roofAlternatives(of);
  const b = new Builder(cases);
  const ed = 'ASCE/SEI 7-22';
  const P = lrfd ? 'LRFD' : 'ASD';
  const src = (clause: string, n: number, words: string, alt = '') => `${ed} ${clause} combination ${n}: ${words}${alt ? ` (${alt})` : ''}`;
  if (lrfd) {
    b.add(P, 'strength', [{ cases: D, factor: 1.4 }], src('2.3.1', 1, '1.4D'));
    for (const r of roof) b.add(P, 'strength', [{ cases: D, factor: 1.2 }, { cases: L, factor: 1.6 }, { cases: r.cases, factor: 0.5 }], src('2.3.1', 2, '1.2D + 1.6L + 0.5(Lr or S or R)', r.name));
    for (const r of roof) {
      if (!r.cases.length && !L.length && !W.length) continue;
      b.add(P, 'strength', [{ cases: D, factor: 1.2 }, { cases: r.cases, factor: 1.6 }, { cases: L, factor: 1.0 }], src('2.3.1', 3, '1.2D + 1.6(Lr or S or R) + (L or 0.5W)', [r.name, 'L'].filter(Boolean).join(', ')));
      for (const w of W) b.add(P, 'strength', [{ cases: D, factor: 1.2 }, { cases: r.cases, factor: 1.6 }, { cases: w, factor: 0.5 }], src('2.3.1', 3, '1.2D + 1.6(Lr or S or R) + (L or 0.5W)', [r.name, `0.5·${w[0].id}`].filter(Boolean).join(', ')));
    }
    for (const w of W) {
      for (const r of roof) b.add(P, 'strength', [{ cases: D, factor: 1.2 }, { cases: w, factor: 1.0 }, { cases: L, factor: 1.0 }, { cases: r.cases, factor: 0.5 }], src('2.3.1', 4, '1.2D + 1.0W + L + 0.5(Lr or S or R)', [w[0].id, r.name].filter(Boolean).join(', ')));
      b.add(P, 'strength', [{ cases: D, factor: 0.9 }, { cases: w, factor: 1.0 }], src('2.3.1', 5, '0.9D + 1.0W', w[0].id));
    }
    for (const e of E) {
      const sg = e.sign > 0 ? '+' : '−';
      b.add(P, 'strength', [{ cases: D, factor: 1.2 }, { cases: [e.c], factor: e.sign }, { cases: L, factor: 1.0 }, { cases: S, factor: 0.15 }], src('2.3.6', 6, '1.2D + Ev + Eh + L + 0.15S, Ev = 0', `${sg}${e.c.id}`));
      b.add(P, 'strength', [{ cases: D, factor: 0.9 }, { cases: [e.c], factor: e.sign }], src('2.3.6', 7, '0.9D − Ev + Eh, Ev = 0', `${sg}${e.c.id}`));
    }
  } else {
    b.add(P, 'strength', [{ cases: D, factor: 1 }], src('2.4.1', 1, 'D'));
    b.add(P, 'strength', [{ cases: D, factor: 1 }, { cases: L, factor: 1 }], src('2.4.1', 2, 'D + L'));
    for (const r of roof) b.add(P, 'strength', [{ cases: D, factor: 1 }, { cases: r.cases, factor: 1 }], src('2.4.1', 3, 'D + (Lr or S or R)', r.name));
    for (const r of roof) b.add(P, 'strength', [{ cases: D, factor: 1 }, { cases: L, factor: 0.75 }, { cases: r.cases, factor: 0.75 }], src('2.4.1', 4, 'D + 0.75L + 0.75(Lr or S or R)', r.name));
    for (const w of W) {
      b.add(P, 'strength', [{ cases: D, factor: 1 }, { cases: w, factor: 0.6 }], src('2.4.1', 5, 'D + 0.6W', w[0].id));
      for (const r of roof) b.add(P, 'strength', [{ cases: D, factor: 1 }, { cases: L, factor: 0.75 }, { cases: w, factor: 0.45 }, { cases: r.cases, factor: 0.75 }], src('2.4.1', 6, 'D + 0.75L + 0.75(0.6W) + 0.75(Lr or S or R)', [w[0].id, r.name].filter(Boolean).join(', ')));
      b.add(P, 'strength', [{ cases: D, factor: 0.6 }, { cases: w, factor: 0.6 }], src('2.4.1', 7, '0.6D + 0.6W', w[0].id));
    }
    for (const e of E) {
      const sg = e.sign > 0 ? '+' : '−';
      b.add(P, 'strength', [{ cases: D, factor: 1 }, { cases: [e.c], factor: 0.7 * e.sign }], src('2.4.5', 8, 'D + 0.7Ev + 0.7Eh, Ev = 0', `${sg}${e.c.id}`));
      b.add(P, 'strength', [{ cases: D, factor: 1 }, { cases: [e.c], factor: 0.525 * e.sign }, { cases: L, factor: 0.75 }, { cases: S, factor: 0.1 }], src('2.4.5', 9, 'D + 0.525Ev + 0.525Eh + 0.75L + 0.1S, Ev = 0', `${sg}${e.c.id}`));
      b.add(P, 'strength', [{ cases: D, factor: 0.6 }, { cases: [e.c], factor: 0.7 * e.sign }], src('2.4.5', 10, '0.6D − 0.7Ev + 0.7Eh, Ev = 0', `${sg}${e.c.id}`));
    }
  }
  // service (common practice)
  b.add('SLS', 'service', [{ cases: D, factor: 1 }, { cases: L, factor: 1 }], 'service, common practice: D + L');
  for (const r of roof) {
    if (!r.cases.length) continue;
    b.add('SLS', 'service', [{ cases: D, factor: 1 }, { cases: r.cases, factor: 1 }], `service, common practice: D + ${r.name}`);
    b.add('SLS', 'service', [{ cases: D, factor: 1 }, { cases: L, factor: 0.75 }, { cases: r.cases, factor: 0.75 }], `service, common practice: D + 0.75L + 0.75${r.name}`);
  }
  return b.out;
}

function en1990(cases: LoadCase[]): Combination[] {
  const of = byCategory(cases);
  const G = of('dead');
  const summed = (['live', 'roof_live', 'snow', 'rain'] as const).filter((c) => of(c).length).map((c) => ({ cat: c as CaseCategory, cases: of(c) }));
  const windAlts: (LoadCase | null)[] = of('wind').length ? of('wind') : [null];
  const tempAlts: (LoadCase | null)[] = of('temperature').length ? of('temperature') : [null];
  const b = new Builder(cases);
  const psi = (c: CaseCategory) => EN1990_PSI0[c] ?? 0;
  b.add('ULS', 'strength', [{ cases: G, factor: 1.35 }], 'EN 1990 (6.10): 1.35·Gk');
  for (const w of windAlts) {
    for (const t of tempAlts) {
      const actions = [...summed, ...(w ? [{ cat: 'wind' as CaseCategory, cases: [w] }] : []), ...(t ? [{ cat: 'temperature' as CaseCategory, cases: [t] }] : [])];
      for (const lead of actions) {
        const parts: Part[] = [{ cases: G, factor: 1.35 }, { cases: lead.cases, factor: 1.5 }];
        const sParts: Part[] = [{ cases: G, factor: 1 }, { cases: lead.cases, factor: 1 }];
        for (const o of actions) {
          if (o === lead) continue;
          parts.push({ cases: o.cases, factor: 1.5 * psi(o.cat) });
          sParts.push({ cases: o.cases, factor: psi(o.cat) });
        }
        const leadName = lead.cat === 'wind' || lead.cat === 'temperature' ? lead.cases[0].id : lead.cat;
        b.add('ULS', 'strength', parts, `EN 1990 (6.10): 1.35·Gk + 1.5·Qk,1 + Σ 1.5·ψ0·Qk,i, leading ${leadName} (ψ0: Table A1.1)`);
        b.add('SLS', 'service', sParts, `EN 1990 (6.14b) characteristic: Gk + Qk,1 + Σ ψ0·Qk,i, leading ${leadName}`);
      }
    }
  }
  for (const w of of('wind')) b.add('ULS', 'strength', [{ cases: G, factor: 1.0 }, { cases: [w], factor: 1.5 }], `EN 1990 (6.10): 1.0·Gk (favourable) + 1.5·Wk, leading ${w.id}`);
  if (!summed.length && !of('wind').length && !of('temperature').length) b.add('SLS', 'service', [{ cases: G, factor: 1 }], 'EN 1990 (6.14b) characteristic: Gk');
  return b.out;
}

/**
 * The basic combinations of a combination rule built from the case categories.
 * `table` returns []. Each generated combination names its published source.
 */
export function generateCombinations(rule: CombinationRule, cases: LoadCase[]): Combination[] {
  switch (rule) {
    case 'asce7-lrfd': return asce(cases, true);
    case 'asce7-asd': return asce(cases, false);
    case 'en1990-6.10': return en1990(cases);
    default: return [];
  }
}
