/**
 * Built-in materials, SI units (Pa, kg/m3, 1/K). Each row names its source.
 *
 * EN steels: EN 1993-1-1:2005 Table 3.1, nominal values for t ≤ 40 mm (from memory):
 *   S235 (EN 10025-2) fy 235, fu 360 MPa; S275 (EN 10025-2) 275 / 430;
 *   S355 (EN 10025-2) 355 / 510; S460 (EN 10025-3, N/NL) 460 / 540.
 *   (The 440 / 550 pair of Table 3.1 belongs to S450 of EN 10025-2, not S460.)
 *   E = 210 000 MPa, ν = 0.3, G = E / (2(1 + ν)) ≈ 81 000 MPa, α = 12·10⁻⁶ /K
 *   (EN 1993-1-1 3.2.6); density 7850 kg/m3 (EN 1991-1-1 Table A.4).
 * ASTM steels: AISC Steel Construction Manual, 16th ed., Table 2-4 (from memory):
 *   A36 Fy 36, Fu 58 ksi; A992 50 / 65; A572 Gr 50 50 / 65; A53 Gr B 35 / 60;
 *   A500 Gr C 50 / 62 ksi per ASTM A500/A500M-18, which gives Grade C round and shaped
 *   HSS the same 50 ksi yield (earlier editions: round 46 ksi; from memory — use a
 *   materials row with fy = 46 ksi for round HSS to older editions).
 *   E = 29 000 ksi, G = 11 200 ksi (AISC 360-22 notation), ν = 0.3, density 490 lb/ft3,
 *   α = 6.5·10⁻⁶ /°F (AISC Manual, from memory).
 * Aluminium 6061-T6: Aluminum Design Manual 2020, Table A.3.4 / B.4 (from memory):
 *   Ftu 38 ksi (262 MPa), Fty 35 ksi (241 MPa), E 10 100 ksi (69.6 GPa), ν = 0.33,
 *   density 0.098 lb/in3 ≈ 2700 kg/m3, α = 13·10⁻⁶ /°F = 23.4·10⁻⁶ /K.
 */
import type { Material } from '../model/types.js';

const MPA = 1e6;
const KSI = 6.894757293168361e6;
const LB_PER_FT3 = 0.45359237 / 0.3048 ** 3;
const PER_F = 1.8; // 1/°F → 1/K

function en(id: string, fy: number, fu: number, product: string): Material {
  const E = 210000 * MPA;
  return {
    id, E, nu: 0.3, G: E / 2.6, fy: fy * MPA, fu: fu * MPA, density: 7850, alpha: 12e-6,
    source: `EN 1993-1-1:2005 Table 3.1 (${product}, t ≤ 40 mm; from memory); E, ν, α per 3.2.6`,
    builtIn: true,
  };
}

function astm(id: string, fy: number, fu: number, note: string): Material {
  return {
    id, E: 29000 * KSI, G: 11200 * KSI, nu: 0.3, fy: fy * KSI, fu: fu * KSI,
    density: 490 * LB_PER_FT3, alpha: 6.5e-6 * PER_F,
    source: `${note}; AISC Steel Construction Manual 16th ed. Table 2-4 (from memory); E = 29 000 ksi, G = 11 200 ksi per AISC 360-22`,
    builtIn: true,
  };
}

export const BUILT_IN_MATERIALS: readonly Material[] = [
  en('S235', 235, 360, 'EN 10025-2'),
  en('S275', 275, 430, 'EN 10025-2'),
  en('S355', 355, 510, 'EN 10025-2'),
  en('S460', 460, 540, 'EN 10025-3 N/NL'),
  astm('A36', 36, 58, 'ASTM A36'),
  astm('A992', 50, 65, 'ASTM A992'),
  astm('A572 Gr 50', 50, 65, 'ASTM A572 Grade 50'),
  astm('A500 Gr C', 50, 62, 'ASTM A500/A500M-18 Grade C, round and rectangular HSS (earlier editions: round 46 ksi)'),
  astm('A53 Gr B', 35, 60, 'ASTM A53 Grade B pipe'),
  {
    id: '6061-T6',
    E: 10100 * KSI,
    nu: 0.33,
    G: (10100 * KSI) / (2 * 1.33),
    fy: 35 * KSI,
    fu: 38 * KSI,
    density: 2700,
    alpha: 13e-6 * PER_F,
    source: 'Aluminum Design Manual 2020, 6061-T6 (Fty 35 ksi, Ftu 38 ksi, E 10 100 ksi; from memory)',
    builtIn: true,
  },
];
