/**
 * Moving loads on the member-detail screen: the influence line and the envelope of the
 * member's leading quantity, converted to display units (pure, tested without mounting).
 */
import type { UnitSystem } from '../../shared/model/types.js';
import type { MemberMoving } from '../../shared/schemas/runs.js';
import { fromSI, unitOf, type Quantity } from '../../shared/units/index.js';

export interface MovingChart {
  title: string;
  xLabel: string;
  yLabel: string;
  series: { label: string; points: { x: number; y: number }[] }[];
}

/** Influence line: the quantity per unit axle load; a moment per force is a length. */
export function influenceChart(m: MemberMoving, units: UnitSystem): MovingChart {
  const isMoment = m.key.startsWith('M_');
  const len = unitOf('length', units);
  const yUnit = isMoment ? `${unitOf('moment', units)} per ${unitOf('force', units)}` : `${unitOf('force', units)} per ${unitOf('force', units)}`;
  // moment per force in display units: (moment unit)/(force unit) — convert via moment and force
  const per = (v: number) => (isMoment ? fromSI(v, 'moment', units) / fromSI(1, 'force', units) : v);
  return {
    title: `Influence line of ${m.key} at x = ${fromSI(m.x, 'length', units).toFixed(3)} ${len} (lane ${m.lane})`,
    xLabel: `position along lane ${m.lane} [${len}]`,
    yLabel: `[${yUnit}]`,
    series: [{ label: `${m.key} for a unit axle load`, points: m.influence.s.map((s, i) => ({ x: fromSI(s, 'length', units), y: per(m.influence.value[i]) })) }],
  };
}

/** Envelope of the vehicle alone (unfactored) along the member. */
export function envelopeChart(m: MemberMoving, units: UnitSystem): MovingChart {
  const q: Quantity = m.key.startsWith('M_') ? 'moment' : 'force';
  const len = unitOf('length', units);
  const pts = (v: number[]) => m.envelope.x.map((x, i) => ({ x: fromSI(x, 'length', units), y: fromSI(v[i], q, units) }));
  return {
    title: `Envelope of ${m.key} under vehicle ${m.vehicle} (unfactored)`,
    xLabel: `x [${len}]`,
    yLabel: `[${unitOf(q, units)}]`,
    series: [{ label: 'max', points: pts(m.envelope.max) }, { label: 'min', points: pts(m.envelope.min) }],
  };
}

/** The governing vehicle position for the grid: "12.40 m" or '' when no vehicle governs. */
export function vehicleText(position: number | undefined, units: UnitSystem): string {
  if (position === undefined || position === null) return '';
  return `${fromSI(position, 'length', units).toFixed(2)} ${unitOf('length', units)}`;
}

/** One row of the member's moving-load extremes table, in display units. */
export interface ExtremeRow { force: string; unit: string; max: string; maxAt: string; min: string; minAt: string }

/** The absolute maximum and minimum of each force under the vehicle, with x and where the leading axle stood. */
export function extremeRows(m: MemberMoving, units: UnitSystem): ExtremeRow[] {
  const len = unitOf('length', units);
  return (m.extremes ?? []).map((e) => {
    const q: Quantity = e.key === 'T' || e.key.startsWith('M_') ? 'moment' : 'force';
    const where = (x: { x: number; lead: number | null; direction: string | null }) => (x.lead === null ? '' :
      `x = ${fromSI(x.x, 'length', units).toFixed(3)} ${len}, leading axle at ${fromSI(x.lead, 'length', units).toFixed(3)} ${len} (${x.direction})`);
    return {
      force: e.key, unit: unitOf(q, units),
      max: fromSI(e.max.value, q, units).toFixed(2), maxAt: where(e.max),
      min: fromSI(e.min.value, q, units).toFixed(2), minAt: where(e.min),
    };
  });
}
