/**
 * The `combinations` table in long form (`combination`, `case`, `factor`, `limit_state`)
 * or wide form (`combination`, `limit_state`, then one column per case id), and the
 * combinations in force when there is no table.
 */
import { generateCombinations } from '../design/combinations.js';
import type { Combination, LimitState, LoadCase, UnitSystem } from '../model/types.js';
import { splitHeader } from '../units/index.js';
import { canonicalName, idText } from './names.js';
import type { Problems } from './problems.js';
import { COMBINATIONS_LONG, COMBINATIONS_WIDE } from './specs.js';
import { parseNumber, parseTable, type RawTable } from './table.js';

/** Long form when the header has both `case` and `factor` columns. */
export function isLongForm(raw: RawTable): boolean {
  const header = (raw.rows.find((r) => r.some((c) => c !== null && c !== undefined && String(c).trim() !== '')) ?? [])
    .map((c) => (c === null || c === undefined ? '' : canonicalName(splitHeader(String(c)).name)));
  return header.includes('case') && header.includes('factor');
}

export function readCombinationsTable(raw: RawTable, cases: Map<string, LoadCase>, system: UnitSystem, problems: Problems): { combinations: Combination[]; count: number } {
  const long = isLongForm(raw);
  const t = parseTable(raw, long ? COMBINATIONS_LONG : COMBINATIONS_WIDE, system, problems);
  const byId = new Map<string, Combination>();
  const stateRow = new Map<string, boolean>();
  const lab = (c: string) => t.label[c] ?? c;
  const caseByHeader = new Map<string, string | undefined>();
  if (!long) {
    // wide form: each extra column names a case (exactly, else case-insensitively)
    for (const h of t.extraHeaders) {
      const text = idText(h);
      let found = cases.has(text) ? text : undefined;
      if (!found) for (const c of cases.keys()) if (c.toLowerCase() === text.toLowerCase()) found = c;
      if (!found) problems.error('combinations', t.headerRow, h, `column ${h} is not a case id (cases: ${[...cases.keys()].join(', ') || 'none'})`);
      caseByHeader.set(h, found);
    }
    if (t.extraHeaders.length === 0) problems.error('combinations', t.headerRow, undefined, 'the combinations table needs either the columns case and factor (long form) or one column per case (wide form)');
  }
  for (const r of t.rows) {
    const id = r.v.combination as string | undefined;
    if (id === undefined) continue;
    const ls = r.v.limit_state as LimitState | undefined;
    let c = byId.get(id);
    if (!c) {
      c = { id, limitState: ls ?? 'strength', terms: [], row: r.row };
      byId.set(id, c);
      stateRow.set(id, ls !== undefined);
    } else if (!long) {
      problems.error('combinations', r.row, lab('combination'), `combination ${id} is given twice (first on row ${c.row})`);
      continue;
    } else if (ls !== undefined) {
      if (!stateRow.get(id)) { c.limitState = ls; stateRow.set(id, true); }
      else if (c.limitState !== ls) problems.error('combinations', r.row, lab('limit_state'), `combination ${id} is ${c.limitState} on an earlier row and ${ls} here`);
    }
    if (long) {
      const cs = r.v.case as string | undefined;
      const f = r.v.factor as number | undefined;
      if (cs === undefined || f === undefined) continue;
      if (!cases.has(cs)) {
        problems.error('combinations', r.row, lab('case'), `unknown case ${cs}`);
        continue;
      }
      if (c.terms.some((x) => x.case === cs)) {
        problems.error('combinations', r.row, lab('case'), `case ${cs} appears twice in combination ${id}`);
        continue;
      }
      c.terms.push({ case: cs, factor: f });
    } else {
      for (const h of t.extraHeaders) {
        const cell = r.extra[h];
        const n = parseNumber(cell, raw.decimalComma === true);
        if (n === undefined) continue;
        if (typeof n === 'object') {
          problems.error('combinations', r.row, h, n.error);
          continue;
        }
        const cs = caseByHeader.get(h);
        if (cs !== undefined && n !== 0) c.terms.push({ case: cs, factor: n });
      }
    }
  }
  for (const c of byId.values()) {
    if (c.terms.length === 0) problems.error('combinations', c.row, lab('combination'), `combination ${c.id} has no case with a factor`);
    if (cases.has(c.id)) problems.error('combinations', c.row, lab('combination'), `combination ${c.id} has the same id as a case: results could not tell them apart`);
  }
  return { combinations: [...byId.values()], count: t.rows.length };
}

/** Without a table and with rule `table`: every case alone, factor 1.0, strength. */
export function oneCombinationPerCase(cases: LoadCase[]): Combination[] {
  const ids = new Set(cases.map((c) => c.id));
  return cases.map((c) => {
    let id = `1.0 ${c.id}`;
    while (ids.has(id)) id += "'";
    return { id, limitState: 'strength' as const, terms: [{ case: c.id, factor: 1 }], generated: true, source: 'each case alone with factor 1.0 (no combinations table)' };
  });
}

/** Combinations from a generating rule; the design work supplies the rules. */
export function generatedCombinations(rule: Parameters<typeof generateCombinations>[0], cases: LoadCase[], problems: Problems): Combination[] {
  try {
    const list = generateCombinations(rule, cases);
    if (list.length === 0 && cases.length > 0) problems.error('settings', undefined, 'combination_rule', `combination rule ${rule} produced no combinations for these case categories`);
    return list;
  } catch (e) {
    problems.error('settings', undefined, 'combination_rule', `combination rule ${rule} could not be applied: ${(e as Error).message}`);
    return [];
  }
}
