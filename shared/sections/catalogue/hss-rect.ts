/**
 * Square and rectangular HSS (ASTM A500), designation HSS h X b X t_nom.
 * Source: sizes per AISC Steel Construction Manual, 16th ed., Tables 1-11 and 1-12 (from
 * memory). Properties are computed, as AISC does, from the design wall thickness
 * t = 0.93·t_nom (AISC 360-22 B4.2 for HSS not made to A1085/A1065, from memory) with
 * outside corner radius 2t (see ../shapes/rhs.ts). HSS6X6X3/8 computes to A = 7.58 in2,
 * Ix = 39.5 in4, J = 64.6 in4, matching the Manual (from memory).
 */
import type { CatalogueSeries } from './types.js';

const FRACTIONS: Record<string, number> = { '3/16': 0.1875, '1/4': 0.25, '5/16': 0.3125, '3/8': 0.375, '1/2': 0.5, '5/8': 0.625 };

// tabulated A [in2], I [in4] (J where recalled), AISC Manual Table 1-12 (from memory)
const TABULATED: Record<string, { A: number; I_major: number; I_minor: number; J?: number }> = {
  '6X6X3/8': { A: 7.58, I_major: 39.5, I_minor: 39.5, J: 64.6 },
  '4X4X1/4': { A: 3.37, I_major: 7.80, I_minor: 7.80 },
  '8X8X1/2': { A: 13.5, I_major: 125, I_minor: 125 },
};

// h, b [in], t_nom
const SIZES: [number, number, string][] = [
  [2, 2, '1/4'], [3, 3, '1/4'], [3, 3, '3/8'], [4, 4, '1/4'], [4, 4, '3/8'], [4, 4, '1/2'],
  [5, 5, '1/4'], [5, 5, '3/8'], [5, 5, '1/2'], [6, 6, '1/4'], [6, 6, '3/8'], [6, 6, '1/2'], [6, 6, '5/8'],
  [8, 8, '1/4'], [8, 8, '3/8'], [8, 8, '1/2'], [8, 8, '5/8'], [10, 10, '3/8'], [10, 10, '1/2'], [10, 10, '5/8'],
  [12, 12, '3/8'], [12, 12, '1/2'], [12, 12, '5/8'], [14, 14, '1/2'], [16, 16, '1/2'], [16, 16, '5/8'],
  [4, 2, '1/4'], [6, 3, '1/4'], [6, 4, '1/4'], [6, 4, '3/8'], [8, 4, '1/4'], [8, 4, '3/8'],
  [8, 6, '3/8'], [8, 6, '1/2'], [10, 6, '3/8'], [10, 6, '1/2'], [12, 6, '3/8'], [12, 6, '1/2'],
  [12, 8, '1/2'], [14, 10, '1/2'], [16, 8, '1/2'], [16, 12, '5/8'], [20, 12, '5/8'],
];

export const HSS_RECT: CatalogueSeries = {
  series: 'HSS (rectangular and square)',
  source:
    'HSS sizes per AISC Steel Construction Manual, 16th ed., Tables 1-11/1-12 (from memory); design wall 0.93·t_nom (AISC 360-22 B4.2), outside corner radius 2t',
  unit: 'in',
  entries: SIZES.map(([h, b, tn]) => {
    return {
      name: `HSS${h}X${b}X${tn}`,
      aliases: [`HSS${h}X${b}X${FRACTIONS[tn]}`],
      shape: 'rhs' as const,
      dims: { h, b, t: 0.93 * FRACTIONS[tn] },
      tabulated: TABULATED[`${h}X${b}X${tn}`],
    };
  }),
};
