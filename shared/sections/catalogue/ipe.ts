/**
 * European I-beams IPE 80 – IPE 600.
 * Source: dimensions h, b, tw, tf, r per EN 10365:2017 / ArcelorMittal sales programme
 * tables (from memory); tabulated A [cm2] and Iy [cm4] from the same tables (from memory).
 * The tabulated values include the root fillets; tests check them against the properties
 * computed from the dimensions.
 */
import type { CatalogueSeries } from './types.js';

// name, h, b, tw, tf, r [mm], A [cm2], Iy [cm4]
const ROWS: [string, number, number, number, number, number, number, number][] = [
  ['IPE80', 80, 46, 3.8, 5.2, 5, 7.64, 80.1],
  ['IPE100', 100, 55, 4.1, 5.7, 7, 10.3, 171],
  ['IPE120', 120, 64, 4.4, 6.3, 7, 13.2, 318],
  ['IPE140', 140, 73, 4.7, 6.9, 7, 16.4, 541],
  ['IPE160', 160, 82, 5.0, 7.4, 9, 20.1, 869],
  ['IPE180', 180, 91, 5.3, 8.0, 9, 23.9, 1317],
  ['IPE200', 200, 100, 5.6, 8.5, 12, 28.5, 1943],
  ['IPE220', 220, 110, 5.9, 9.2, 12, 33.4, 2772],
  ['IPE240', 240, 120, 6.2, 9.8, 15, 39.1, 3892],
  ['IPE270', 270, 135, 6.6, 10.2, 15, 45.9, 5790],
  ['IPE300', 300, 150, 7.1, 10.7, 15, 53.8, 8356],
  ['IPE330', 330, 160, 7.5, 11.5, 18, 62.6, 11770],
  ['IPE360', 360, 170, 8.0, 12.7, 18, 72.7, 16270],
  ['IPE400', 400, 180, 8.6, 13.5, 21, 84.5, 23130],
  ['IPE450', 450, 190, 9.4, 14.6, 21, 98.8, 33740],
  ['IPE500', 500, 200, 10.2, 16.0, 21, 116, 48200],
  ['IPE550', 550, 210, 11.1, 17.2, 24, 134, 67120],
  ['IPE600', 600, 220, 12.0, 19.0, 24, 156, 92080],
];

export const IPE: CatalogueSeries = {
  series: 'IPE',
  source: 'IPE per EN 10365:2017 / ArcelorMittal sales programme tables (from memory)',
  unit: 'mm',
  entries: ROWS.map(([name, d, bf, tw, tf, r, A, Iy]) => ({
    name,
    shape: 'i',
    dims: { d, bf, tw, tf, r },
    tabulated: { A, I_major: Iy },
  })),
};
