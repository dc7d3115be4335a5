/**
 * European channels UPN 80 – UPN 400 (taper flanges, 8 % slope).
 * Source: dimensions h, b, tw, tf (flange thickness at half the flange width) per EN 10365:2017
 * (DIN 1026-1 series) (from memory); tabulated A [cm2], Iy [cm4], Iz [cm4] and Wel,z [cm3]
 * and the centroid distance e [cm] from the same tables (from memory).
 *
 * The channel shape (../shapes/channel.ts) has parallel flanges of thickness tf and sharp
 * corners: it reproduces A, Iy and Wpl,y within 2 %, but overestimates Iz by 10 – 15 % (the
 * tapered flanges are thinner at the tips). The tabulated Iz and Wel,z therefore override the
 * computed ones; the computed Wpl,z (not tabulated here) stays on the parallel-flange outline
 * and overestimates the tabulated value, and the computed centroid (hence the shear centre of
 * ../geometry.ts) lies about 2 mm further from the web than the tabulated e — known
 * limitations, stated in the series source.
 */
import type { CatalogueSeries } from './types.js';

// size, h, b, tw, tf [mm], A [cm2], Iy [cm4], Iz [cm4], Wel,z [cm3], e [cm] (centroid from the web back)
const ROWS: [number, number, number, number, number, number, number, number, number, number][] = [
  [80, 80, 45, 6, 8, 11.0, 106, 19.4, 6.36, 1.45],
  [100, 100, 50, 6, 8.5, 13.5, 206, 29.3, 8.49, 1.55],
  [120, 120, 55, 7, 9, 17.0, 364, 43.2, 11.1, 1.60],
  [140, 140, 60, 7, 10, 20.4, 605, 62.7, 14.8, 1.75],
  [160, 160, 65, 7.5, 10.5, 24.0, 925, 85.3, 18.3, 1.84],
  [180, 180, 70, 8, 11, 28.0, 1350, 114, 22.4, 1.92],
  [200, 200, 75, 8.5, 11.5, 32.2, 1910, 148, 27.0, 2.01],
  [220, 220, 80, 9, 12.5, 37.4, 2690, 197, 33.6, 2.14],
  [240, 240, 85, 9.5, 13, 42.3, 3600, 248, 39.6, 2.23],
  [260, 260, 90, 10, 14, 48.3, 4820, 317, 47.7, 2.36],
  [280, 280, 95, 10, 15, 53.3, 6280, 399, 57.2, 2.53],
  [300, 300, 100, 10, 16, 58.8, 8030, 495, 67.8, 2.70],
  [320, 320, 100, 14, 17.5, 75.8, 10870, 597, 80.6, 2.60],
  [350, 350, 100, 14, 16, 77.3, 12840, 570, 75.0, 2.40],
  [380, 380, 102, 13.5, 16, 80.4, 15760, 615, 78.7, 2.38],
  [400, 400, 110, 14, 18, 91.5, 20350, 846, 102, 2.65],
];

/** Tabulated centroid distance e [cm] from the back of the web (from memory): test data. */
export const UPN_CENTROID_CM: Record<string, number> = Object.fromEntries(ROWS.map((r) => [`UPN${r[0]}`, r[9]]));

export const UPN: CatalogueSeries = {
  series: 'UPN',
  source:
    'UPN per EN 10365:2017 (DIN 1026-1 taper-flange channels) (from memory); A, Iy, Iz, Wel,z tabulated; other properties on parallel flanges of thickness tf, sharp corners (Wpl,z overestimated, centroid ~2 mm off)',
  unit: 'mm',
  entries: ROWS.map(([size, d, bf, tw, tf, A, Iy, Iz, Wz]) => ({
    name: `UPN${size}`,
    aliases: [`U${size}`],
    shape: 'channel',
    dims: { d, bf, tw, tf },
    tabulated: { A, I_major: Iy, I_minor: Iz, S_minor: Wz },
  })),
};
