import { describe, expect, it } from 'vitest';
import { builtInMaterial, builtInMaterialNames } from '../../../shared/materials/index.js';

const MPA = 1e6;
const KSI = 6.894757293168361e6;
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('built-in materials', () => {
  it('include every material tables.md lists, each with a source', () => {
    for (const n of ['S235', 'S275', 'S355', 'S460', 'A36', 'A992', 'A572 Gr 50', 'A500 Gr C', 'A53 Gr B', '6061-T6']) {
      const m = builtInMaterial(n);
      expect(m, n).toBeDefined();
      expect(m!.builtIn).toBe(true);
      expect(m!.source!.length, n).toBeGreaterThan(10);
      expect(m!.fy! > 0 && m!.fu! > m!.fy!, n).toBe(true);
    }
    expect(builtInMaterialNames().length).toBe(10);
  });
  it('EN 1993-1-1 Table 3.1, t ≤ 40 mm (from memory): S235 235/360, S275 275/430, S355 355/510, S460 (EN 10025-3) 460/540 MPa; E 210 GPa, α 12e-6 (3.2.6)', () => {
    const want: [string, number, number][] = [['S235', 235, 360], ['S275', 275, 430], ['S355', 355, 510], ['S460', 460, 540]];
    for (const [n, fy, fu] of want) {
      const m = builtInMaterial(n)!;
      expect(m.fy).toBe(fy * MPA);
      expect(m.fu).toBe(fu * MPA);
      expect(m.E).toBe(210000 * MPA);
      expect(m.nu).toBe(0.3);
      expect(rel(m.G, 81000 * MPA)).toBeLessThan(0.005); // 3.2.6: G ≈ 81 000 MPa
      expect(m.alpha).toBe(12e-6);
      expect(m.density).toBe(7850);
    }
  });
  it('ASTM steels per AISC Manual Table 2-4 (from memory): Fy/Fu in ksi; E = 29 000 ksi; 490 lb/ft³ = 7849 kg/m³; α = 6.5e-6/°F = 1.17e-5/K', () => {
    const want: [string, number, number][] = [['A36', 36, 58], ['A992', 50, 65], ['A572 Gr 50', 50, 65], ['A500 Gr C', 50, 62], ['A53 Gr B', 35, 60]];
    for (const [n, fy, fu] of want) {
      const m = builtInMaterial(n)!;
      expect(rel(m.fy!, fy * KSI), n).toBeLessThan(1e-12);
      expect(rel(m.fu!, fu * KSI), n).toBeLessThan(1e-12);
      expect(rel(m.E, 199.948e9)).toBeLessThan(1e-5); // 29 000 ksi = 199.948 GPa
      expect(rel(m.density, 7849.0)).toBeLessThan(1e-4);
      expect(rel(m.alpha, 1.17e-5)).toBeLessThan(1e-9);
    }
  });
  it('6061-T6 per the Aluminum Design Manual (from memory): Fty 35 ksi = 241 MPa, Ftu 38 ksi = 262 MPa, E 10 100 ksi = 69.6 GPa', () => {
    const m = builtInMaterial('6061-T6')!;
    expect(rel(m.fy!, 241.3 * MPA)).toBeLessThan(0.001);
    expect(rel(m.fu!, 262.0 * MPA)).toBeLessThan(0.001);
    expect(rel(m.E, 69.64e9)).toBeLessThan(0.001);
    expect(m.density).toBe(2700);
  });
  it('matches names case-insensitively, ignoring spaces and hyphens', () => {
    expect(builtInMaterial('s355')?.id).toBe('S355');
    expect(builtInMaterial('A572GR50')?.id).toBe('A572 Gr 50');
    expect(builtInMaterial('a572 gr 50')?.id).toBe('A572 Gr 50');
    expect(builtInMaterial('ASTM A572 Grade 50')?.id).toBe('A572 Gr 50');
    expect(builtInMaterial('A500 GR C')?.id).toBe('A500 Gr C');
    expect(builtInMaterial('6061 T6')?.id).toBe('6061-T6');
    expect(builtInMaterial('S356')).toBeUndefined();
    expect(builtInMaterial('')).toBeUndefined();
  });
  it('returns a copy, so a caller cannot change the built-in table', () => {
    builtInMaterial('S235')!.fy = 1;
    expect(builtInMaterial('S235')!.fy).toBe(235 * MPA);
  });
});
