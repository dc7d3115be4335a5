/**
 * Number formatting of the calculation package — the same rules as the member page
 * (src/utils/diagrams.ts formatValue/displayQuantity, src/utils/ratioBand.ts formatRatio), so
 * the paper shows exactly the numbers on the screen.
 */
import type { UnitSystem } from '../../shared/model/types.js';
import { fromSI, unitOf, type Quantity } from '../../shared/units/index.js';

export function formatValue(v: number | string | null | undefined, digits = 4): string {
  if (v === null || v === undefined) return '—';
  if (typeof v === 'string') return v;
  if (!Number.isFinite(v)) return String(v);
  if (v === 0) return '0';
  const a = Math.abs(v);
  if (a >= 1e6 || a < 1e-3) return v.toExponential(digits - 1);
  return Number(v.toPrecision(digits)).toString();
}

export function formatRatio(ratio: number | null | undefined): string {
  return ratio === null || ratio === undefined || !Number.isFinite(ratio) ? '—' : ratio.toFixed(3);
}

const KNOWN = new Set(['length', 'section_dim', 'area', 'inertia', 'modulus', 'warping', 'force', 'moment', 'line_load', 'stress', 'density', 'temperature', 'thermal_expansion', 'spring_trans', 'spring_rot', 'displacement', 'rotation', 'ratio', 'text']);

/** A value converted for display, with its unit ('' for none). */
export function displayQuantity(value: number | string | null, quantity: string, units: UnitSystem): { text: string; unit: string } {
  if (value === null || typeof value === 'string') return { text: formatValue(value), unit: '' };
  if (!KNOWN.has(quantity)) return { text: formatValue(value), unit: '' };
  const q = quantity as Quantity;
  const unit = unitOf(q, units);
  return { text: formatValue(fromSI(value, q, units)), unit: unit === '-' ? '' : unit };
}

export function withUnit(value: number | string | null, quantity: string, units: UnitSystem): string {
  const d = displayQuantity(value, quantity, units);
  return d.unit ? `${d.text} ${d.unit}` : d.text;
}
