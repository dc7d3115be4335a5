/**
 * Moving-load results as the rest of Trestle sees them (additive to the engine contract,
 * `AnalysisResult.moving`). Values SI; member quantities in member local axes, node
 * quantities in global axes (conventions.md).
 */
import type { ForceKey } from '../engine/types.js';

export type TravelDirection = 'forward' | 'backward';

/** Where the vehicle stood: its leading axle at path position `lead` (m) of the lane. */
export interface VehicleAt {
  /** index into model.movingLoads */
  movingLoad: number;
  lane: string;
  vehicle: string;
  direction: TravelDirection;
  lead: number;
}

export interface LaneSegmentInfo {
  member: string;
  reversed: boolean;
  /** path position of the segment's first end (m) */
  s0: number;
  L: number;
}

export interface InfluenceLine {
  /** path positions (m), ascending: every node and station of the lane plus 200 even steps */
  s: Float64Array;
  /** the quantity for a unit load (1 N) along −vertical at s */
  value: Float64Array;
}

/** One member quantity: a row of the station table at one station. */
export interface MemberQuantity {
  member: number;
  key: ForceKey;
  station: number;
}

/** The member forces whose extremes are reported (deflections stay at stations). */
export const MOVING_FORCE_KEYS = ['N', 'V_major', 'V_minor', 'T', 'M_major', 'M_minor'] as const;
export type MovingForceKey = (typeof MOVING_FORCE_KEYS)[number];

/** One extreme of a member force: its value, where on the member and where the vehicle stood. */
export interface ForceExtreme {
  value: number;
  /** distance from the member's start node (m) and the station index there */
  x: number;
  station: number;
  /** null when no vehicle position reaches it (value 0) */
  at: VehicleAt | null;
}

/** The absolute maximum and minimum of each force over the member and over all vehicle positions. */
export type MemberExtremes = Record<MovingForceKey, { max: ForceExtreme; min: ForceExtreme }>;

export interface MovingResults {
  lanes: { lane: string; length: number; segments: LaneSegmentInfo[] }[];
  /** axles of every vehicle (offset m, load N), by vehicle id */
  vehicles: Record<string, { axle: string; offset: number; load: number }[]>;
  /** loading index -> true when the loading includes a moving-load case */
  isEnvelope(loading: number): boolean;
  /** vehicle position that produced the envelope value of a member quantity in an envelope loading (null: not governed by a vehicle) */
  memberPosition(member: number, loading: number, key: ForceKey, station: number): VehicleAt | null;
  /** same for a node displacement (kind 'displacement') or reaction, freedom 0..5 */
  nodePosition(node: number, loading: number, kind: 'displacement' | 'reaction', freedom: number): VehicleAt | null;
  /** influence line of a member quantity for the lane of moving load `movingLoad` */
  influenceLine(movingLoad: number, q: MemberQuantity): InfluenceLine;
  /** envelope (max and min over all positions) of the vehicle effect alone, unfactored, for one moving load */
  memberEnvelope(movingLoad: number, member: number): { x: Float64Array; max: Record<ForceKey, Float64Array>; min: Record<ForceKey, Float64Array> };
  /**
   * The absolute maximum and minimum of each force of member `member` under moving load
   * `movingLoad` alone (unfactored), over the member and every vehicle position: on a lane
   * member they occur under an axle or at an end, and the stations include every such x.
   */
  memberExtremes(movingLoad: number, member: number): MemberExtremes;
  /**
   * basis: unit-load columns; quantities: dense influence quantities; positions: vehicle
   * positions evaluated; extraStations: stations added under axles; refined: positions found
   * by refinement between the regular ones; axleMilliseconds: the scan under the axles
   * (axles.ts), part of milliseconds
   */
  diagnostics: { basis: number; quantities: number; positions: number; extraStations: number; refined: number; axleMilliseconds: number; milliseconds: number };
}
