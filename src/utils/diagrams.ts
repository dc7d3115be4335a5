/**
 * Member diagrams in display units: the run's station values (SI, local axes) converted
 * with shared/units for the model's unit system.
 */
import type { UnitSystem } from '../../shared/model/types.js';
import type { Stations } from '../../shared/schemas/runs.js';
import { fromSI, unitOf, type Quantity } from '../../shared/units/index.js';

export interface DiagramSpec {
  key: 'N' | 'V_major' | 'V_minor' | 'M_major' | 'M_minor' | 'deflection';
  title: string;
  quantity: Quantity;
  series: { label: string; field: keyof Stations }[];
}

export const DIAGRAMS: readonly DiagramSpec[] = [
  { key: 'N', title: 'Axial force N (tension +)', quantity: 'force', series: [{ label: 'N', field: 'N' }] },
  { key: 'V_major', title: 'Shear V, major axis', quantity: 'force', series: [{ label: 'V major', field: 'V_major' }] },
  { key: 'V_minor', title: 'Shear V, minor axis', quantity: 'force', series: [{ label: 'V minor', field: 'V_minor' }] },
  { key: 'M_major', title: 'Bending moment M, major axis', quantity: 'moment', series: [{ label: 'M major', field: 'M_major' }] },
  { key: 'M_minor', title: 'Bending moment M, minor axis', quantity: 'moment', series: [{ label: 'M minor', field: 'M_minor' }] },
  {
    key: 'deflection',
    title: 'Deflection relative to the chord',
    quantity: 'displacement',
    series: [
      { label: 'major', field: 'd_major' },
      { label: 'minor', field: 'd_minor' },
    ],
  },
];

export interface DiagramData {
  spec: DiagramSpec;
  unit: string;
  xUnit: string;
  x: number[];
  series: { label: string; values: number[] }[];
  /** largest absolute value over the series, with where it occurs */
  peak: { value: number; x: number };
}

/** One diagram's points in display units. */
export function diagramData(spec: DiagramSpec, stations: Stations, units: UnitSystem): DiagramData {
  const x = stations.x.map((v) => fromSI(v, 'length', units));
  let peak = { value: 0, x: 0 };
  const series = spec.series.map((s) => {
    const values = (stations[s.field] ?? []).map((v) => fromSI(v, spec.quantity, units));
    values.forEach((v, i) => {
      if (Math.abs(v) > Math.abs(peak.value)) peak = { value: v, x: x[i] };
    });
    return { label: s.label, values };
  });
  return { spec, unit: unitOf(spec.quantity, units), xUnit: unitOf('length', units), x, series, peak };
}

/** A value with a sensible number of digits for its size. */
export function formatValue(v: number | string | null | undefined, digits = 4): string {
  if (v === null || v === undefined) return '—';
  if (typeof v === 'string') return v;
  if (!Number.isFinite(v)) return String(v);
  if (v === 0) return '0';
  const a = Math.abs(v);
  if (a >= 1e6 || a < 1e-3) return v.toExponential(digits - 1);
  return Number(v.toPrecision(digits)).toString();
}

/** A check input, capacity or demand converted for display, with its unit ('' for none). */
export function displayQuantity(value: number | string | null, quantity: string, units: UnitSystem): { text: string; unit: string } {
  if (value === null || typeof value === 'string') return { text: formatValue(value), unit: '' };
  const q = quantity as Quantity;
  const known = q in { length: 1, section_dim: 1, area: 1, inertia: 1, modulus: 1, warping: 1, force: 1, moment: 1, line_load: 1, stress: 1, density: 1, temperature: 1, thermal_expansion: 1, spring_trans: 1, spring_rot: 1, displacement: 1, rotation: 1, ratio: 1, text: 1 };
  if (!known) return { text: formatValue(value), unit: '' };
  const unit = unitOf(q, units);
  return { text: formatValue(fromSI(value, q, units)), unit: unit === '-' ? '' : unit };
}
