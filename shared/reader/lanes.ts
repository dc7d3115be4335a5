/**
 * Lane paths (issue 7 import contract): the members of a lane in `seq` order form the
 * running path; it starts at the end of the first member that is not shared with the
 * second, and each member is traversed in the direction that continues the path.
 */
import type { LaneMember, Member } from '../model/types.js';

export interface LaneStep {
  member: string;
  /** true when the member is traversed from its end node to its start node */
  reversed: boolean;
  from: string;
  to: string;
}

export type LanePath = { ok: true; steps: LaneStep[] } | { ok: false; index: number; message: string };

/** The path of one lane (its members already sorted by seq); `index` points at the bad entry. */
export function lanePath(entries: LaneMember[], members: Map<string, Member>): LanePath {
  const steps: LaneStep[] = [];
  let at: string | undefined;
  for (let i = 0; i < entries.length; i++) {
    const m = members.get(entries[i].member);
    if (!m) return { ok: false, index: i, message: `unknown member ${entries[i].member}` };
    if (i === 0) {
      const next = entries[1] ? members.get(entries[1].member) : undefined;
      // start at the end not shared with the second member
      const reversed = next ? next.start === m.start || next.end === m.start : false;
      if (next && !reversed && next.start !== m.end && next.end !== m.end) {
        return { ok: false, index: 1, message: `member ${next.id} does not connect to member ${m.id}` };
      }
      const from = reversed ? m.end : m.start;
      const to = reversed ? m.start : m.end;
      steps.push({ member: m.id, reversed, from, to });
      at = to;
      continue;
    }
    if (m.start === at) steps.push({ member: m.id, reversed: false, from: m.start, to: m.end });
    else if (m.end === at) steps.push({ member: m.id, reversed: true, from: m.end, to: m.start });
    else return { ok: false, index: i, message: `member ${m.id} does not connect to the lane so far (which ends at node ${at})` };
    at = steps[steps.length - 1].to;
  }
  return { ok: true, steps };
}
