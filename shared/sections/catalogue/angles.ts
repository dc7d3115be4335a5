/**
 * Hot-rolled equal-leg angles L40x40x4 – L200x200x20.
 * Source: leg b and thickness t are the designation, sizes from the EN 10056-1 / EN 10365:2017
 * range (from memory); tabulated A [cm2] and the principal second moments Iu, Iv [cm4]
 * from the same tables (from memory), where recalled.
 *
 * The angle shape (../shapes/angle.ts) has sharp corners (no root or toe radii): it gives A
 * within 2 % and Iu, Iv within 3.5 % of the tables (toe rounding lowers the tabulated
 * values). Where recalled the tabulated A, Iu and Iv override the computed ones.
 */
import type { CatalogueSeries } from './types.js';

// b, t [mm], A [cm2], Iu [cm4], Iv [cm4] (0 = not recalled: computed only)
const ROWS: [number, number, number, number, number][] = [
  [40, 4, 3.08, 7.09, 1.86],
  [50, 5, 4.80, 17.4, 4.59],
  [60, 6, 6.91, 36.1, 9.43],
  [70, 7, 9.40, 67.1, 17.5],
  [80, 8, 12.3, 115, 29.6],
  [90, 9, 15.5, 184, 47.8],
  [100, 8, 15.5, 0, 0],
  [100, 10, 19.2, 280, 73.0],
  [120, 10, 23.2, 497, 129],
  [120, 12, 27.5, 584, 152],
  [150, 12, 34.8, 1170, 303],
  [150, 15, 43.0, 1430, 370],
  [200, 16, 61.8, 3720, 960],
  [200, 20, 76.3, 4530, 1170],
];

export const ANGLES: CatalogueSeries = {
  series: 'L (equal angles)',
  source:
    'Equal angles per EN 10056-1 / EN 10365:2017 (from memory); A, Iu, Iv tabulated where recalled; other properties on the sharp-cornered outline',
  unit: 'mm',
  entries: ROWS.map(([b, t, A, Iu, Iv]) => ({
    name: `L${b}X${b}X${t}`,
    shape: 'angle',
    dims: { d: b, b, t },
    tabulated: Iu > 0 ? { A, I_major: Iu, I_minor: Iv } : { A },
  })),
};
