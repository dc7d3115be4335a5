/** Member-by-member comparison of two runs (ratio and section before and after). Pure. */
import type { CheckStatus } from '../design/types.js';
import type { RunComparison } from '../schemas/runs.js';

export interface CompareMember {
  member: string;
  section: string;
  ratio: number | null;
  status: CheckStatus;
}

export function compareMembers(a: CompareMember[], b: CompareMember[]): RunComparison['rows'] {
  const byA = new Map(a.map((m) => [m.member, m]));
  const byB = new Map(b.map((m) => [m.member, m]));
  const ids = [...a.map((m) => m.member), ...b.filter((m) => !byA.has(m.member)).map((m) => m.member)];
  return ids.map((member) => {
    const x = byA.get(member);
    const y = byB.get(member);
    const ratioA = x?.ratio ?? null;
    const ratioB = y?.ratio ?? null;
    return {
      member,
      sectionA: x?.section ?? null,
      sectionB: y?.section ?? null,
      ratioA,
      ratioB,
      statusA: x?.status ?? null,
      statusB: y?.status ?? null,
      delta: ratioA !== null && ratioB !== null ? ratioB - ratioA : null,
    };
  });
}
