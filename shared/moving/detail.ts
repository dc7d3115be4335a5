/**
 * What the member-detail screen shows for moving loads: per moving load, the influence line
 * of the member's leading quantity (M_major for a frame member, N for a truss member) at the
 * station where the vehicle's envelope of that quantity is largest, and that quantity's
 * envelope (max and min over all vehicle positions, unfactored) along the member; and the
 * absolute maximum and minimum of every force with x and the vehicle position.
 */
import type { AnalysisResult, ForceKey } from '../engine/types.js';
import { MOVING_FORCE_KEYS, type MovingForceKey } from './types.js';

/** One extreme of a force for the screen (SI): value, x on the member, and where the leading axle stood (null: never reached). */
export interface ExtremeAt { value: number; x: number; lead: number | null; direction: 'forward' | 'backward' | null }

export interface MemberMovingDetail {
  movingLoad: number;
  vehicle: string;
  lane: string;
  /** m */
  laneLength: number;
  key: ForceKey;
  /** station index and its distance from the member's start node (m) */
  station: number;
  x: number;
  influence: { s: number[]; value: number[] };
  envelope: { x: number[]; max: number[]; min: number[] };
  /**
   * the absolute maximum and minimum of each force over the member and all vehicle positions
   * (unfactored; under an axle or at an end, MovingResults.memberExtremes); forces that stay
   * zero are left out
   */
  extremes: { key: MovingForceKey; max: ExtremeAt; min: ExtremeAt }[];
}

export function memberMovingDetail(analysis: AnalysisResult, member: number, truss: boolean, lanes: { movingLoad: number; vehicle: string; lane: string }[]): MemberMovingDetail[] {
  const mv = analysis.moving;
  if (!mv) return [];
  const key: ForceKey = truss ? 'N' : 'M_major';
  return lanes.map(({ movingLoad, vehicle, lane }) => {
    const env = mv.memberEnvelope(movingLoad, member);
    const max = env.max[key], min = env.min[key];
    let station = 0, big = -1;
    for (let i = 0; i < max.length; i++) {
      const v = Math.max(Math.abs(max[i]), Math.abs(min[i]));
      if (v > big + 1e-12 * Math.abs(big)) { big = v; station = i; }
    }
    const il = mv.influenceLine(movingLoad, { member, key, station });
    const ex = mv.memberExtremes(movingLoad, member);
    const at = (e: { value: number; x: number; at: { lead: number; direction: 'forward' | 'backward' } | null }): ExtremeAt =>
      ({ value: e.value, x: e.x, lead: e.at?.lead ?? null, direction: e.at?.direction ?? null });
    const extremes = MOVING_FORCE_KEYS.filter((k) => ex[k].max.value !== 0 || ex[k].min.value !== 0)
      .map((k) => ({ key: k, max: at(ex[k].max), min: at(ex[k].min) }));
    return {
      movingLoad, vehicle, lane,
      laneLength: mv.lanes.find((l) => l.lane === lane)?.length ?? 0,
      key, station, x: env.x[station],
      influence: { s: Array.from(il.s), value: Array.from(il.value) },
      envelope: { x: Array.from(env.x), max: Array.from(max), min: Array.from(min) },
      extremes,
    };
  });
}
