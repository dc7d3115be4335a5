/**
 * The utilisation grid's rows from the design result: each member's governing values plus
 * the previous run's ratio and section for the change column. Pure.
 */
import { CHECK_FAMILIES, type CheckFamily, type CheckStatus, type MemberUtilisation } from '../design/types.js';
import type { MemberRow, RunCounts } from '../schemas/runs.js';

export interface PreviousMember {
  ratio: number | null;
  section: string;
}

export function memberRows(members: MemberUtilisation[], previous?: Map<string, PreviousMember>): MemberRow[] {
  return members.map((m) => {
    const before = previous?.get(m.member);
    const row: MemberRow = {
      member: m.member,
      group: m.group,
      section: m.section,
      material: m.material,
      length: m.length,
      ratio: m.ratio,
      check: m.check,
      clause: m.clause,
      combination: m.combination,
      status: m.status,
      families: { ...m.families } as Record<string, number | null>,
      familyStatus: { ...m.familyStatus } as Record<string, CheckStatus>,
      warnings: m.warnings,
      previousRatio: before ? before.ratio : null,
    };
    if (m.vehiclePosition !== undefined) row.vehiclePosition = m.vehiclePosition;
    if (before && before.section !== m.section) row.previousSection = before.section;
    return row;
  });
}

export function statusCounts(members: { status: CheckStatus }[]): RunCounts {
  const counts: RunCounts = { pass: 0, fail: 0, notChecked: 0 };
  for (const m of members) {
    if (m.status === 'pass') counts.pass++;
    else if (m.status === 'fail') counts.fail++;
    else counts.notChecked++;
  }
  return counts;
}

/** Largest governing ratio, null when no member has one. */
export function maxRatio(members: { ratio: number | null }[]): number | null {
  let max: number | null = null;
  for (const m of members) if (m.ratio !== null && Number.isFinite(m.ratio) && (max === null || m.ratio > max)) max = m.ratio;
  return max;
}

/** The check families that occur in any member, in the contract's order. */
export function familiesPresent(members: MemberUtilisation[]): CheckFamily[] {
  const seen = new Set<string>();
  for (const m of members) for (const f of Object.keys(m.families)) seen.add(f);
  return CHECK_FAMILIES.filter((f) => seen.has(f));
}

/** Ratio band for colouring (grid, picture and exports share it). */
export type RatioBand = 'ok' | 'near' | 'over' | 'unchecked';
export function ratioBand(ratio: number | null, status: CheckStatus): RatioBand {
  if (status === 'not checked' || ratio === null) return 'unchecked';
  if (ratio <= 0.9) return 'ok';
  if (ratio <= 1.0) return 'near';
  return 'over';
}
