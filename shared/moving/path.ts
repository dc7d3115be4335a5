/**
 * The running path of a lane: its members in `seq` order, each traversed in the direction
 * that continues the path (shared/reader/lanes.ts), laid end to end. A path position `s` is
 * the distance along the path from its start (m).
 */
import type { LaneMember, Member, Model } from '../model/types.js';
import { lanePath } from '../reader/lanes.js';

export interface PathSegment {
  /** member index in the model */
  member: number;
  memberId: string;
  /** true when the member is traversed from its end node to its start node */
  reversed: boolean;
  /** path position of the segment's first end (m) */
  s0: number;
  /** member length (m) */
  L: number;
}

export interface LanePathGeometry {
  lane: string;
  segments: PathSegment[];
  /** total length (m) */
  length: number;
  /** path positions of the nodes along the path (segment ends), ascending */
  nodes: number[];
}

/** Where a path position falls: segment index and distance from the member's START node. */
export interface PathPoint {
  segment: number;
  /** distance from the member's start node (m), 0..L */
  a: number;
}

/** The path of one lane; throws an Error naming the lane and member when it does not connect. */
export function buildLanePath(model: Model, lane: string, lengthOf: (member: number) => number): LanePathGeometry {
  const entries: LaneMember[] = model.lanes.filter((l) => l.lane === lane).sort((p, q) => p.seq - q.seq);
  if (entries.length === 0) throw new Error(`lane ${lane}: it has no members`);
  const byId = new Map<string, Member>(model.members.map((m) => [m.id, m]));
  const index = new Map<string, number>(model.members.map((m, i) => [m.id, i]));
  const path = lanePath(entries, byId);
  if (!path.ok) throw new Error(`lane ${lane}: ${path.message}`);
  const segments: PathSegment[] = [];
  const nodes: number[] = [0];
  let s = 0;
  for (const st of path.steps) {
    const mi = index.get(st.member)!;
    const L = lengthOf(mi);
    segments.push({ member: mi, memberId: st.member, reversed: st.reversed, s0: s, L });
    s += L;
    nodes.push(s);
  }
  return { lane, segments, length: s, nodes };
}

/** The segment and member-local distance of path position s (0 ≤ s ≤ length), or null off the lane. */
export function locate(path: LanePathGeometry, s: number, out: PathPoint): PathPoint | null {
  if (!(s >= 0 && s <= path.length)) return null;
  const seg = path.segments;
  let lo = 0, hi = seg.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (seg[mid].s0 <= s) lo = mid; else hi = mid - 1;
  }
  const g = seg[lo];
  let t = s - g.s0;
  if (t > g.L) t = g.L;
  if (t < 0) t = 0;
  out.segment = lo;
  out.a = g.reversed ? g.L - t : t;
  return out;
}

/** Path position of a point at distance a from the start node of segment k's member. */
export function pathPosition(path: LanePathGeometry, k: number, a: number): number {
  const g = path.segments[k];
  return g.s0 + (g.reversed ? g.L - a : a);
}
