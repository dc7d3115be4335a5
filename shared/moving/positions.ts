/**
 * Vehicle positions along a lane. A position is the path position of the leading axle.
 * Forward: the vehicle enters at the start of the lane (leading axle at s = 0) and moves
 * in +s until its last axle has left the end (lead = length + last offset); axle i stands
 * at lead − offset_i. Backward: it enters at the end (lead = length) and moves in −s until
 * lead = −last offset; axle i stands at lead + offset_i. Positions are the regular steps
 * plus every position where some axle stands exactly on a target point (nodes, stations),
 * plus any extra leading-axle positions given (those found under the axles, axles.ts).
 */

export type Direction = 'forward' | 'backward';

export interface VehiclePositions {
  direction: Direction;
  /** leading-axle path positions (m), in order of travel */
  lead: Float64Array;
}

export function vehiclePositions(
  length: number, offsets: readonly number[], step: number, direction: Direction, targets: readonly number[],
  extraLeads: readonly number[] = [],
): VehiclePositions {
  if (!(step > 0)) throw new Error(`vehicle step must be > 0 (got ${step})`);
  const last = Math.max(0, ...offsets);
  const travel = length + last;
  const tol = 1e-9 * Math.max(1, travel);
  const d: number[] = [];
  // distance travelled by the leading axle from its entry point
  const n = Math.ceil(travel / step - 1e-9);
  for (let k = 0; k <= n; k++) d.push(Math.min(k * step, travel));
  for (const t of targets) {
    for (const o of offsets) {
      // forward: lead = t + o, travelled = lead; backward: lead = t − o, travelled = length − lead
      const dist = direction === 'forward' ? t + o : length - (t - o);
      if (dist >= -tol && dist <= travel + tol) d.push(Math.min(travel, Math.max(0, dist)));
    }
  }
  for (const lead of extraLeads) {
    const dist = direction === 'forward' ? lead : length - lead;
    if (dist >= -tol && dist <= travel + tol) d.push(Math.min(travel, Math.max(0, dist)));
  }
  d.sort((p, q) => p - q);
  const out: number[] = [];
  for (const v of d) if (out.length === 0 || v - out[out.length - 1] > tol) out.push(v);
  const lead = new Float64Array(out.length);
  for (let i = 0; i < out.length; i++) lead[i] = direction === 'forward' ? out[i] : length - out[i];
  return { direction, lead };
}

/** Path position of axle i for a leading-axle position. */
export function axlePosition(direction: Direction, lead: number, offset: number): number {
  return direction === 'forward' ? lead - offset : lead + offset;
}
