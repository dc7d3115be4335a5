import { describe, expect, it } from 'vitest';
import { catalogueDesignations, catalogueSection, designGeometry, sectionProperties } from '../../../shared/sections/index.js';
import { CATALOGUE_SERIES } from '../../../shared/sections/catalogue/index.js';
import { SECTION_PROPS } from '../../../shared/model/types.js';
import { close, IN } from './helpers.js';

/** relative tolerance per series and property; null = not compared (see the series file) */
const TOLERANCE: Record<string, (k: string) => number | null> = {
  W: () => 0.01,
  'HSS (rectangular and square)': () => 0.01,
  'HSS (round)': () => 0.01,
  Pipe: () => 0.01,
  UPN: (k) => (k === 'A' || k === 'I_major' ? 0.02 : null),
  'L (equal angles)': (k) => (k === 'A' ? 0.02 : 0.035),
};

describe('built-in catalogue', () => {
  const names = catalogueDesignations();
  it('holds at least 300 distinct designations', () => {
    expect(names.length).toBeGreaterThanOrEqual(300);
    expect(new Set(names).size).toBe(names.length);
  });
  it('every designation resolves to a built-in section with a source and positive properties', () => {
    for (const n of names) {
      const s = catalogueSection(n);
      expect(s, n).toBeDefined();
      expect(s!.builtIn).toBe(true);
      expect(s!.source!.length).toBeGreaterThan(10);
      for (const k of SECTION_PROPS) {
        if (k === 'Cw') expect(s!.props[k], `${n} ${k}`).toBeGreaterThanOrEqual(0);
        else expect(s!.props[k], `${n} ${k}`).toBeGreaterThan(0);
      }
      const g = designGeometry(s!);
      expect(g.rMinor, n).toBeGreaterThan(0);
    }
  });
  it('every series states its source', () => {
    for (const s of CATALOGUE_SERIES) expect(s.source, s.series).toMatch(/from memory/);
  });
  it('tabulated values agree with the values computed from the dimensions (IPE/HE 0.5 %, W and AISC HSS/pipe 1 % as dimensions are rounded; UPN A and Iy 2 %, angles A 2 % and Iu, Iv 3.5 % as their shapes have sharp corners) — a check on the data', () => {
    for (const series of CATALOGUE_SERIES) {
      for (const e of series.entries) {
        const s = catalogueSection(e.name)!;
        const computed = sectionProperties(s.shape, s.dims);
        for (const k of s.given) {
          const tol = TOLERANCE[series.series];
          const rtol = tol ? tol(k) : 0.005;
          if (rtol === null) continue; // not comparable on the simplified outline (UPN Iz, Wel,z: taper flanges)
          close(computed[k], s.props[k], rtol, `${e.name} ${k}`);
        }
      }
    }
  });
  it('W shapes weigh what their names say: A·(490 lb/ft³)/(144 in²/ft²) = nominal lb/ft within 1.5 % (nominal weights are rounded)', () => {
    for (const n of names.filter((x) => x.startsWith('W'))) {
      const A = catalogueSection(n)!.props.A / IN ** 2;
      close((A * 490) / 144, Number(n.split('X')[1]), 0.015, n);
    }
  });
  it('matches designations case-insensitively, ignoring spaces and decimal spelling', () => {
    expect(catalogueSection('ipe 300')?.id).toBe('IPE300');
    expect(catalogueSection('HEB200')?.id).toBe('HEB200');
    expect(catalogueSection('HE 200 B')?.id).toBe('HEB200');
    expect(catalogueSection('w12x26')?.id).toBe('W12X26');
    expect(catalogueSection('HSS6X6X3/8')?.id).toBe('HSS6X6X3/8');
    expect(catalogueSection('hss6x6x.375')?.id).toBe('HSS6X6X3/8');
    expect(catalogueSection('HSS8.625X.322')?.id).toBe('HSS8.625X0.322');
    expect(catalogueSection('Pipe 4 Std')?.id).toBe('PIPE4STD');
    expect(catalogueSection('IPE 301')).toBeUndefined();
    expect(catalogueSection('')).toBeUndefined();
  });
  it('returns SI values: IPE300 A = 53.8 cm² = 5.38e-3 m² (tabulated, from memory)', () => {
    const s = catalogueSection('IPE300')!;
    close(s.props.A, 53.8e-4, 1e-9);
    close(s.dims.d!, 0.3, 1e-12);
    expect(s.shape).toBe('i');
  });
  it('returns a fresh object each time, so a caller cannot change the catalogue', () => {
    const a = catalogueSection('IPE300')!;
    a.props.A = 1;
    expect(catalogueSection('IPE300')!.props.A).toBeLessThan(1);
  });
});
