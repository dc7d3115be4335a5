/**
 * Units: the quantities Trestle knows, the unit symbols accepted in headers, and the
 * default unit of each quantity in each unit system (tables.md "Unit systems").
 * Everything stored is SI base units: N, m, Pa, kg, K, rad.
 */
import type { UnitSystem } from '../model/types.js';

/** Physical dimension of a unit, used to refuse e.g. `x [kN]`. */
export type Dimension =
  | 'length' | 'area' | 'volume' | 'length4' | 'length6'
  | 'force' | 'moment' | 'force_per_length' | 'stress' | 'density'
  | 'temperature' | 'per_temperature' | 'angle' | 'dimensionless';

/** What a value means, which picks its display unit in each system. */
export type Quantity =
  | 'length' | 'section_dim' | 'area' | 'inertia' | 'modulus' | 'warping'
  | 'force' | 'moment' | 'line_load' | 'stress' | 'density'
  | 'temperature' | 'thermal_expansion' | 'spring_trans' | 'spring_rot'
  | 'displacement' | 'rotation' | 'ratio' | 'text';

export const QUANTITY_DIMENSION: Record<Quantity, Dimension> = {
  length: 'length', section_dim: 'length', area: 'area', inertia: 'length4', modulus: 'volume',
  warping: 'length6', force: 'force', moment: 'moment', line_load: 'force_per_length',
  stress: 'stress', density: 'density', temperature: 'temperature',
  thermal_expansion: 'per_temperature', spring_trans: 'force_per_length', spring_rot: 'moment',
  displacement: 'length', rotation: 'angle', ratio: 'dimensionless', text: 'dimensionless',
};

interface UnitDef {
  dimension: Dimension;
  /** multiply a value in this unit by `factor` to get SI */
  factor: number;
}

const FT = 0.3048;
const IN = 0.0254;
const LBF = 4.4482216152605;
const KIP = 1000 * LBF;
const LB = 0.45359237;

/** Accepted unit symbols (case-sensitive match first, then case-insensitive). */
export const UNITS: Record<string, UnitDef> = {
  m: { dimension: 'length', factor: 1 },
  cm: { dimension: 'length', factor: 0.01 },
  mm: { dimension: 'length', factor: 0.001 },
  ft: { dimension: 'length', factor: FT },
  in: { dimension: 'length', factor: IN },
  mm2: { dimension: 'area', factor: 1e-6 },
  cm2: { dimension: 'area', factor: 1e-4 },
  m2: { dimension: 'area', factor: 1 },
  in2: { dimension: 'area', factor: IN ** 2 },
  ft2: { dimension: 'area', factor: FT ** 2 },
  mm3: { dimension: 'volume', factor: 1e-9 },
  cm3: { dimension: 'volume', factor: 1e-6 },
  m3: { dimension: 'volume', factor: 1 },
  in3: { dimension: 'volume', factor: IN ** 3 },
  mm4: { dimension: 'length4', factor: 1e-12 },
  cm4: { dimension: 'length4', factor: 1e-8 },
  m4: { dimension: 'length4', factor: 1 },
  in4: { dimension: 'length4', factor: IN ** 4 },
  mm6: { dimension: 'length6', factor: 1e-18 },
  cm6: { dimension: 'length6', factor: 1e-12 },
  m6: { dimension: 'length6', factor: 1 },
  in6: { dimension: 'length6', factor: IN ** 6 },
  N: { dimension: 'force', factor: 1 },
  kN: { dimension: 'force', factor: 1e3 },
  MN: { dimension: 'force', factor: 1e6 },
  lbf: { dimension: 'force', factor: LBF },
  kip: { dimension: 'force', factor: KIP },
  Nm: { dimension: 'moment', factor: 1 },
  kNm: { dimension: 'moment', factor: 1e3 },
  MNm: { dimension: 'moment', factor: 1e6 },
  'lbf-ft': { dimension: 'moment', factor: LBF * FT },
  'lbf-in': { dimension: 'moment', factor: LBF * IN },
  'kip-ft': { dimension: 'moment', factor: KIP * FT },
  'kip-in': { dimension: 'moment', factor: KIP * IN },
  'N/m': { dimension: 'force_per_length', factor: 1 },
  'kN/m': { dimension: 'force_per_length', factor: 1e3 },
  'N/mm': { dimension: 'force_per_length', factor: 1e3 },
  'kN/mm': { dimension: 'force_per_length', factor: 1e6 },
  'lbf/ft': { dimension: 'force_per_length', factor: LBF / FT },
  'kip/ft': { dimension: 'force_per_length', factor: KIP / FT },
  'kip/in': { dimension: 'force_per_length', factor: KIP / IN },
  'lbf/in': { dimension: 'force_per_length', factor: LBF / IN },
  Pa: { dimension: 'stress', factor: 1 },
  kPa: { dimension: 'stress', factor: 1e3 },
  MPa: { dimension: 'stress', factor: 1e6 },
  GPa: { dimension: 'stress', factor: 1e9 },
  psi: { dimension: 'stress', factor: LBF / IN ** 2 },
  ksi: { dimension: 'stress', factor: KIP / IN ** 2 },
  psf: { dimension: 'stress', factor: LBF / FT ** 2 },
  'kg/m3': { dimension: 'density', factor: 1 },
  'lb/ft3': { dimension: 'density', factor: LB / FT ** 3 },
  C: { dimension: 'temperature', factor: 1 },
  K: { dimension: 'temperature', factor: 1 },
  F: { dimension: 'temperature', factor: 5 / 9 },
  '1/C': { dimension: 'per_temperature', factor: 1 },
  '1/K': { dimension: 'per_temperature', factor: 1 },
  '1/F': { dimension: 'per_temperature', factor: 9 / 5 },
  rad: { dimension: 'angle', factor: 1 },
  deg: { dimension: 'angle', factor: Math.PI / 180 },
  '%': { dimension: 'dimensionless', factor: 0.01 },
  '-': { dimension: 'dimensionless', factor: 1 },
};

/** Default (display and input) unit of each quantity per unit system — tables.md. */
export const SYSTEM_UNITS: Record<UnitSystem, Record<Quantity, string>> = {
  metric: {
    length: 'm', section_dim: 'mm', area: 'mm2', inertia: 'mm4', modulus: 'mm3', warping: 'mm6',
    force: 'kN', moment: 'kNm', line_load: 'kN/m', stress: 'MPa', density: 'kg/m3',
    temperature: 'C', thermal_expansion: '1/C', spring_trans: 'kN/m', spring_rot: 'kNm/rad',
    displacement: 'mm', rotation: 'rad', ratio: '-', text: '',
  },
  us: {
    length: 'ft', section_dim: 'in', area: 'in2', inertia: 'in4', modulus: 'in3', warping: 'in6',
    force: 'kip', moment: 'kip-ft', line_load: 'kip/ft', stress: 'ksi', density: 'lb/ft3',
    temperature: 'F', thermal_expansion: '1/F', spring_trans: 'kip/in', spring_rot: 'kip-ft/rad',
    displacement: 'in', rotation: 'rad', ratio: '-', text: '',
  },
};

function normaliseSymbol(symbol: string): string {
  return symbol.trim().replace(/\s+/g, '').replace(/·/g, '').replace(/\*/g, '').replace(/²/g, '2').replace(/³/g, '3').replace(/⁴/g, '4');
}

/**
 * Look up a unit symbol. `kNm/rad` style rotational-spring units are read as the moment
 * unit (rad is dimensionless). Returns null for an unknown symbol.
 */
export function findUnit(symbol: string): UnitDef | null {
  let s = normaliseSymbol(symbol);
  if (s.endsWith('/rad') && s.length > 4) s = s.slice(0, -4);
  if (s.endsWith('/°C')) s = s.replace('/°C', '/C');
  s = s.replace(/^°/, '');
  if (UNITS[s]) return UNITS[s];
  const lower = s.toLowerCase();
  for (const [k, v] of Object.entries(UNITS)) if (k.toLowerCase() === lower) return v;
  return null;
}

/** Factor that converts a value in `symbol` to SI, or null if the unit is unknown or of the wrong dimension. */
export function factorToSI(symbol: string, quantity: Quantity): number | null {
  const u = findUnit(symbol);
  if (!u || u.dimension !== QUANTITY_DIMENSION[quantity]) return null;
  return u.factor;
}

/** The unit a quantity is shown in for a unit system. */
export function unitOf(quantity: Quantity, system: UnitSystem): string {
  return SYSTEM_UNITS[system][quantity];
}

/** Convert an SI value for display in a unit system. */
export function fromSI(value: number, quantity: Quantity, system: UnitSystem): number {
  if (quantity === 'text' || quantity === 'ratio') return value;
  const f = findUnit(SYSTEM_UNITS[system][quantity]);
  return f ? value / f.factor : value;
}

/** Convert a value given in a unit system's default unit to SI. */
export function toSI(value: number, quantity: Quantity, system: UnitSystem): number {
  if (quantity === 'text' || quantity === 'ratio') return value;
  const f = findUnit(SYSTEM_UNITS[system][quantity]);
  return f ? value * f.factor : value;
}

/** Split `x [m]` into name and unit; unit is null when there is no bracket. */
export function splitHeader(header: string): { name: string; unit: string | null } {
  const m = /^(.*?)\s*\[([^\]]*)\]\s*$/.exec(header.trim());
  if (!m) return { name: header.trim(), unit: null };
  return { name: m[1].trim(), unit: m[2].trim() };
}

/** Format a number with at least `digits` significant digits for exports. */
export function formatNumber(value: number, digits = 6): string {
  if (!Number.isFinite(value)) return '';
  if (value === 0) return '0';
  return Number(value.toPrecision(digits)).toString();
}
