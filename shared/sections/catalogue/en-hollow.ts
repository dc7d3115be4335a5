/**
 * European hot-finished structural hollow sections (EN 10210-2): square SHS, rectangular RHS
 * and circular CHS, designated by their outside dimensions and wall thickness in mm
 * ("SHS100x100x5", "RHS200x100x6.3", "CHS168.3x6.3").
 * Source: sizes from the EN 10210-2 range (from memory); the dimensions are the designation.
 * Properties are computed as EN 10210-2 computes them (from memory): SHS/RHS with outer
 * corner radius 1.5t and inner radius t (../shapes/rhs.ts, `r` = 1.5t), CHS exactly.
 * Tabulated A [cm2] and I [cm4] are given for a few sizes (from memory) and checked in the
 * tests against the computed values; they are not used as overrides (the computed values
 * are the tables' own basis).
 */
import type { CatalogueEntry, CatalogueSeries } from './types.js';

// outside size b [mm], wall thicknesses t [mm]
const SHS_SIZES: [number, number[]][] = [
  [40, [4]],
  [50, [4, 5]],
  [60, [4, 5]],
  [70, [4, 5]],
  [80, [4, 5, 6.3, 8]],
  [90, [5, 6.3]],
  [100, [4, 5, 6.3, 8, 10]],
  [120, [5, 6.3, 8, 10]],
  [140, [5, 6.3, 8, 10]],
  [150, [5, 6.3, 8, 10, 12.5]],
  [160, [6.3, 8, 10]],
  [180, [8, 10]],
  [200, [6.3, 8, 10, 12.5, 16]],
  [250, [8, 10, 12.5]],
  [300, [10, 12.5]],
];

// h, b [mm], wall thicknesses t [mm]
const RHS_SIZES: [number, number, number[]][] = [
  [100, 50, [4, 5]],
  [120, 80, [5, 6.3]],
  [150, 100, [5, 6.3, 8]],
  [160, 80, [5, 6.3]],
  [200, 100, [5, 6.3, 8, 10]],
  [250, 150, [6.3, 8, 10]],
  [300, 200, [8, 10, 12.5]],
  [400, 200, [10, 12.5]],
];

// D [mm], wall thicknesses t [mm]
const CHS_SIZES: [number, number[]][] = [
  [48.3, [3.2, 4]],
  [60.3, [3.2, 4]],
  [76.1, [3.2, 4, 5]],
  [88.9, [3.2, 4, 5, 6.3]],
  [114.3, [3.6, 5, 6.3]],
  [139.7, [5, 6.3, 8]],
  [168.3, [5, 6.3, 8, 10]],
  [193.7, [6.3, 8, 10]],
  [219.1, [6.3, 8, 10, 12.5]],
  [244.5, [8, 10]],
  [273, [6.3, 8, 10, 12.5]],
  [323.9, [8, 10, 12.5]],
  [355.6, [10, 12.5, 16]],
  [406.4, [10, 12.5, 16]],
  [457, [10, 12.5, 16]],
  [508, [10, 12.5, 16]],
];

/**
 * Tabulated A [cm2], I_major [cm4], I_minor [cm4] recalled from the EN 10210-2 tables
 * (from memory): test data only, keyed by designation.
 */
export const EN_HOLLOW_TABULATED: Record<string, { A: number; I_major: number; I_minor: number }> = {
  SHS100X100X5: { A: 18.7, I_major: 279, I_minor: 279 },
  SHS100X100X10: { A: 34.9, I_major: 462, I_minor: 462 },
  SHS200X200X10: { A: 74.9, I_major: 4470, I_minor: 4470 },
  RHS120X80X5: { A: 18.7, I_major: 365, I_minor: 193 },
  'RHS200X100X6.3': { A: 35.8, I_major: 1829, I_minor: 613 },
  RHS300X200X10: { A: 94.9, I_major: 11820, I_minor: 6280 },
  'CHS114.3X5': { A: 17.2, I_major: 257, I_minor: 257 },
  'CHS139.7X5': { A: 21.2, I_major: 481, I_minor: 481 },
  'CHS168.3X6.3': { A: 32.1, I_major: 1053, I_minor: 1053 },
  'CHS219.1X8': { A: 53.1, I_major: 2960, I_minor: 2960 },
  'CHS273X10': { A: 82.6, I_major: 7154, I_minor: 7154 },
  'CHS323.9X10': { A: 98.6, I_major: 12160, I_minor: 12160 },
};

function rhsEntry(prefix: 'SHS' | 'RHS', h: number, b: number, t: number): CatalogueEntry {
  return { name: `${prefix}${h}X${b}X${t}`, shape: 'rhs', dims: { h, b, t, r: 1.5 * t } };
}

const SOURCE = 'per EN 10210-2 (hot-finished) size range (from memory); properties computed with corner radii ro = 1.5t, ri = t as in EN 10210-2';

export const SHS: CatalogueSeries = {
  series: 'SHS (EN 10210-2)',
  source: `Square hollow sections ${SOURCE}`,
  unit: 'mm',
  entries: SHS_SIZES.flatMap(([b, ts]) => ts.map((t) => rhsEntry('SHS', b, b, t))),
};

export const RHS: CatalogueSeries = {
  series: 'RHS (EN 10210-2)',
  source: `Rectangular hollow sections ${SOURCE}`,
  unit: 'mm',
  entries: RHS_SIZES.flatMap(([h, b, ts]) => ts.map((t) => rhsEntry('RHS', h, b, t))),
};

export const CHS: CatalogueSeries = {
  series: 'CHS (EN 10210-2)',
  source: 'Circular hollow sections per EN 10210-2 (hot-finished) size range (from memory); properties computed exactly',
  unit: 'mm',
  entries: CHS_SIZES.flatMap(([D, ts]) => ts.map((t) => ({ name: `CHS${D}X${t}`, shape: 'chs' as const, dims: { D, t } }))),
};
