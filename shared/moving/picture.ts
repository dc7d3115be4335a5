/**
 * Vehicles in the model picture: the lanes as polylines with their path positions, the
 * axles of each vehicle, and where the axles stand for a leading-axle position (pure; the
 * picture moves the vehicle with a slider, no analysis needed).
 */
import type { Member, Model } from '../model/types.js';
import { lanePath } from '../reader/lanes.js';

export interface PictureLane { lane: string; length: number; points: [number, number, number][]; s: number[] }
export interface PictureVehicles {
  lanes: PictureLane[];
  vehicles: { vehicle: string; axles: { offset: number; load: number }[] }[];
  movingLoads: { case: string; vehicle: string; lane: string }[];
}

export function pictureVehicles(model: Model): PictureVehicles | undefined {
  if (model.movingLoads.length === 0) return undefined;
  const byId = new Map<string, Member>(model.members.map((m) => [m.id, m]));
  const nodes = new Map(model.nodes.map((n) => [n.id, n]));
  const lanes: PictureLane[] = [];
  for (const lane of new Set(model.movingLoads.map((m) => m.lane))) {
    const entries = model.lanes.filter((l) => l.lane === lane).sort((p, q) => p.seq - q.seq);
    const path = lanePath(entries, byId);
    if (!path.ok || path.steps.length === 0) continue;
    const first = nodes.get(path.steps[0].from)!;
    const points: [number, number, number][] = [[first.x, first.y, first.z]];
    const s = [0];
    for (const st of path.steps) {
      const n = nodes.get(st.to)!;
      const p = points[points.length - 1];
      s.push(s[s.length - 1] + Math.hypot(n.x - p[0], n.y - p[1], n.z - p[2]));
      points.push([n.x, n.y, n.z]);
    }
    lanes.push({ lane, length: s[s.length - 1], points, s });
  }
  const vehicles = [...new Set(model.vehicles.map((v) => v.vehicle))].map((vehicle) => ({
    vehicle, axles: model.vehicles.filter((v) => v.vehicle === vehicle).map((v) => ({ offset: v.offset, load: v.load })),
  }));
  return { lanes, vehicles, movingLoads: model.movingLoads.map((m) => ({ case: m.case, vehicle: m.vehicle, lane: m.lane })) };
}

/** Points [x, y, z, load] of the axles on the lane for a leading-axle position (forward travel: axle at lead − offset). */
export function axlePoints(lane: PictureLane, axles: { offset: number; load: number }[], lead: number, direction: 'forward' | 'backward' = 'forward'): [number, number, number, number][] {
  const out: [number, number, number, number][] = [];
  for (const a of axles) {
    const s = direction === 'forward' ? lead - a.offset : lead + a.offset;
    if (!(s >= 0 && s <= lane.length)) continue;
    let k = 0;
    while (k + 2 < lane.s.length && lane.s[k + 1] < s) k++;
    const t = lane.s[k + 1] > lane.s[k] ? (s - lane.s[k]) / (lane.s[k + 1] - lane.s[k]) : 0;
    const p = lane.points[k], q = lane.points[k + 1];
    out.push([p[0] + t * (q[0] - p[0]), p[1] + t * (q[1] - p[1]), p[2] + t * (q[2] - p[2]), a.load]);
  }
  return out;
}
