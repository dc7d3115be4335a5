/**
 * Rows of the results grid: the run's utilisation rows joined with the model's editable
 * member fields, and the filters the toolbar applies. Pure, so it is tested without a grid.
 */
import type { CheckStatus } from '../../shared/design/types.js';
import type { EditableMember } from '../../shared/schemas/models.js';
import type { MemberRow, RunMembers, RunMembersTable } from '../../shared/schemas/runs.js';
import { ratioDelta } from './ratioBand.js';

export interface GridRow {
  member: string;
  group: string;
  section: string;
  material: string;
  /** in the model's length unit */
  length: number | null;
  ratio: number | null;
  check: string;
  clause: string;
  combination: string;
  status: CheckStatus | 'not run';
  families: Record<string, number | null>;
  previousRatio: number | null;
  previousSection?: string;
  delta: number | null;
  warnings: string[];
  k_major: number | null;
  k_minor: number | null;
  l_major: number | null;
  l_minor: number | null;
  lb: number | null;
  cb: number | null;
  deflection_limit: number | null;
  /** moving loads: the leading axle's position along the lane when the governing check governed, in the model's length unit */
  vehiclePosition?: number;
}

/**
 * One row per member. Editable fields come from the model version (they are what an edit
 * changes); results from the run. A member missing from the run shows as "not run".
 * `runLength` converts the run's length (m) to the model's unit.
 */
export function buildGridRows(
  runRows: readonly MemberRow[] | null,
  editable: readonly EditableMember[] | null,
  runLength: (metres: number) => number,
): GridRow[] {
  const byId = new Map<string, MemberRow>();
  for (const r of runRows ?? []) byId.set(r.member, r);
  const fromRun = (r: MemberRow, e?: EditableMember): GridRow => ({
    member: r.member,
    group: e?.group ?? r.group,
    section: e?.section ?? r.section,
    material: e?.material ?? r.material,
    length: e ? e.length : runLength(r.length),
    ratio: r.ratio,
    check: r.check,
    clause: r.clause,
    combination: r.combination,
    status: r.status,
    families: r.families,
    previousRatio: r.previousRatio,
    previousSection: r.previousSection,
    delta: ratioDelta(r.ratio, r.previousRatio),
    warnings: r.warnings,
    k_major: e?.k_major ?? null,
    k_minor: e?.k_minor ?? null,
    l_major: e?.l_major ?? null,
    l_minor: e?.l_minor ?? null,
    lb: e?.lb ?? null,
    cb: e?.cb ?? null,
    deflection_limit: e?.deflection_limit ?? null,
    ...(r.vehiclePosition !== undefined ? { vehiclePosition: runLength(r.vehiclePosition) } : {}),
  });
  if (!editable) return (runRows ?? []).map((r) => fromRun(r));
  return editable.map((e) => {
    const r = byId.get(e.member);
    if (r) return fromRun(r, e);
    return {
      member: e.member, group: e.group, section: e.section, material: e.material, length: e.length,
      ratio: null, check: '', clause: '', combination: '', status: 'not run', families: {},
      previousRatio: null, delta: null, warnings: [],
      k_major: e.k_major, k_minor: e.k_minor, l_major: e.l_major, l_minor: e.l_minor, lb: e.lb, cb: e.cb,
      deflection_limit: e.deflection_limit,
    };
  });
}

export interface ResultsFilter {
  statuses: readonly string[];
  groups: readonly string[];
  sections: readonly string[];
  ratioMin: number | null;
  ratioMax: number | null;
  changedOnly?: boolean;
}

export const EMPTY_FILTER: ResultsFilter = { statuses: [], groups: [], sections: [], ratioMin: null, ratioMax: null, changedOnly: false };

export function isFilterActive(f: ResultsFilter): boolean {
  return f.statuses.length > 0 || f.groups.length > 0 || f.sections.length > 0 || f.ratioMin !== null || f.ratioMax !== null || !!f.changedOnly;
}

/** True when the row passes every set part of the filter (empty parts pass everything). */
export function rowPasses(row: GridRow, f: ResultsFilter): boolean {
  if (f.statuses.length && !f.statuses.includes(row.status)) return false;
  if (f.groups.length && !f.groups.includes(row.group)) return false;
  if (f.sections.length && !f.sections.includes(row.section)) return false;
  if (f.ratioMin !== null && (row.ratio === null || row.ratio < f.ratioMin)) return false;
  if (f.ratioMax !== null && (row.ratio === null || row.ratio > f.ratioMax)) return false;
  if (f.changedOnly && !(row.delta !== null && Math.abs(row.delta) >= 0.0005) && !row.previousSection) return false;
  return true;
}

/** Why a member was not checked (the design's `not checked: …` warning), '' when it was checked. */
export function notCheckedReason(row: Pick<GridRow, 'status' | 'warnings'>): string {
  if (row.status === 'not run') return 'no result for this member in the run shown';
  if (row.status !== 'not checked') return '';
  const reasons = row.warnings.filter((w) => w.startsWith('not checked: ')).map((w) => w.slice('not checked: '.length));
  return reasons.length ? reasons.join('; ') : 'no ratio was found; the member page lists its records';
}

/** The status cell's hover text: the reason when not checked, then any other warning. */
export function statusHover(row: Pick<GridRow, 'status' | 'warnings'>): string | undefined {
  const reason = notCheckedReason(row);
  const others = row.warnings.filter((w) => !w.startsWith('not checked: '));
  const lines = [reason ? `${row.status}: ${reason}` : '', ...others].filter(Boolean);
  return lines.length ? lines.join('\n') : undefined;
}

/** Counts of pass / fail / not checked (and not run) over some rows. */
export function countStatuses(rows: Iterable<GridRow>): { pass: number; fail: number; notChecked: number; notRun: number } {
  const c = { pass: 0, fail: 0, notChecked: 0, notRun: 0 };
  for (const r of rows) {
    if (r.status === 'pass') c.pass++;
    else if (r.status === 'fail') c.fail++;
    else if (r.status === 'not checked') c.notChecked++;
    else c.notRun++;
  }
  return c;
}

/** Distinct non-empty values, sorted naturally ("B2" before "B10"). */
export function distinctValues(rows: readonly GridRow[], pick: (r: GridRow) => string): string[] {
  const set = new Set<string>();
  for (const r of rows) {
    const v = pick(r);
    if (v) set.add(v);
  }
  return [...set].sort((a, b) => a.localeCompare(b, undefined, { numeric: true }));
}

/** The grid's rows from the column-by-column payload (`?layout=table`): exactly RunMembers. */
export function membersFromTable(t: RunMembersTable): RunMembers {
  const { strings } = t;
  const families = Object.keys(t.familyRatios);
  const members: MemberRow[] = new Array(t.count);
  for (let i = 0; i < t.count; i++) {
    const ratios: Record<string, number | null> = {};
    const statuses: Record<string, CheckStatus> = {};
    for (const f of families) {
      const r = t.familyRatios[f][i];
      if (r !== false) ratios[f] = r;
      const s = t.familyStatus[f][i];
      if (s >= 0) statuses[f] = strings[s] as CheckStatus;
    }
    const extra = t.extras[i];
    const row: MemberRow = {
      member: t.member[i],
      group: strings[t.group[i]],
      section: strings[t.section[i]],
      material: strings[t.material[i]],
      length: t.length[i],
      ratio: t.ratio[i],
      check: strings[t.check[i]],
      clause: strings[t.clause[i]],
      combination: strings[t.combination[i]],
      status: strings[t.status[i]] as CheckStatus,
      families: ratios,
      familyStatus: statuses,
      warnings: extra?.warnings ?? [],
      previousRatio: t.previousRatio[i],
    };
    if (extra?.vehiclePosition !== undefined) row.vehiclePosition = extra.vehiclePosition;
    if (extra?.previousSection !== undefined) row.previousSection = extra.previousSection;
    members[i] = row;
  }
  const { runId, previousRunId, units, designCode, families: present, counts } = t;
  return { runId, previousRunId, units, designCode, families: present, counts, members };
}
