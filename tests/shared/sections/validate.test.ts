import { describe, expect, it } from 'vitest';
import { sectionProperties, validateDimensions } from '../../../shared/sections/index.js';

const fields = (shape: Parameters<typeof validateDimensions>[0], dims: Parameters<typeof validateDimensions>[1]) =>
  validateDimensions(shape, dims).map((p) => p.field);

describe('validateDimensions', () => {
  it('accepts valid dimensions of every shape', () => {
    expect(validateDimensions('i', { d: 0.3, bf: 0.15, tf: 0.0107, tw: 0.0071, r: 0.015 })).toEqual([]);
    expect(validateDimensions('channel', { d: 0.2, bf: 0.075, tf: 0.0115, tw: 0.0085 })).toEqual([]);
    expect(validateDimensions('tee', { d: 0.1, bf: 0.1, tf: 0.01, tw: 0.01 })).toEqual([]);
    expect(validateDimensions('angle', { d: 0.1, b: 0.08, t: 0.01 })).toEqual([]);
    expect(validateDimensions('rhs', { h: 0.2, b: 0.1, t: 0.008 })).toEqual([]);
    expect(validateDimensions('chs', { D: 0.2, t: 0.008 })).toEqual([]);
    expect(validateDimensions('rect', { h: 0.2, b: 0.1 })).toEqual([]);
    expect(validateDimensions('round', { D: 0.05 })).toEqual([]);
    expect(validateDimensions('custom', {})).toEqual([]);
    expect(validateDimensions('i', { d: 0.3, bf: 0.15, tf: 0.0107, tw: 0.0071, r: 0 })).toEqual([]);
  });
  it('names each missing field', () => {
    const p = validateDimensions('i', { d: 0.3, bf: 0.15 });
    expect(p.map((x) => x.field)).toEqual(['tf', 'tw']);
    expect(p[0].message).toMatch(/need tf/);
    expect(fields('chs', { D: 0.2 })).toEqual(['t']);
  });
  it('refuses zero, negative and non-numeric sizes, naming the field', () => {
    expect(fields('rect', { h: 0, b: 0.1 })).toEqual(['h']);
    expect(fields('rect', { h: 0.2, b: -0.1 })).toEqual(['b']);
    expect(fields('round', { D: Number.NaN })).toEqual(['D']);
    expect(fields('i', { d: 0.3, bf: 0.15, tf: 0.01, tw: 0.007, r: -0.001 })).toEqual(['r']);
  });
  it('refuses impossible combinations, naming the offending field', () => {
    expect(fields('i', { d: 0.02, bf: 0.15, tf: 0.01, tw: 0.007 })).toEqual(['tf']); // tf ≥ d/2
    expect(fields('i', { d: 0.3, bf: 0.15, tf: 0.01, tw: 0.15 })).toEqual(['tw']); // tw ≥ bf
    expect(fields('i', { d: 0.3, bf: 0.1, tf: 0.01, tw: 0.01, r: 0.05 })).toEqual(['r']); // tw + 2r > bf
    expect(fields('channel', { d: 0.2, bf: 0.075, tf: 0.1, tw: 0.0085 })).toEqual(['tf']);
    expect(fields('tee', { d: 0.1, bf: 0.1, tf: 0.1, tw: 0.01 })).toEqual(['tf']);
    expect(fields('tee', { d: 0.1, bf: 0.1, tf: 0.01, tw: 0.12 })).toEqual(['tw']);
    expect(fields('angle', { d: 0.1, b: 0.05, t: 0.06 })).toEqual(['t']);
    expect(fields('rhs', { h: 0.2, b: 0.1, t: 0.05 })).toEqual(['t']); // t ≥ b/2
    expect(fields('rhs', { h: 0.1, b: 0.2, t: 0.05 })).toEqual(['t']); // t ≥ h/2
    expect(fields('chs', { D: 0.1, t: 0.05 })).toEqual(['t']); // t ≥ D/2
    expect(validateDimensions('chs', { D: 0.1, t: 0.05 })[0].message).toMatch(/half the diameter D/);
  });
  it('sectionProperties throws a message naming the field rather than returning nonsense', () => {
    expect(() => sectionProperties('chs', { D: 0.1, t: 0.06 })).toThrow(/half the diameter D/);
    expect(() => sectionProperties('custom', {})).toThrow(/custom/);
  });
  it('every shape returns finite positive properties for valid dimensions', () => {
    const cases: [Parameters<typeof sectionProperties>[0], Parameters<typeof sectionProperties>[1]][] = [
      ['i', { d: 0.3, bf: 0.15, tf: 0.0107, tw: 0.0071, r: 0.015 }],
      ['channel', { d: 0.2, bf: 0.075, tf: 0.0115, tw: 0.0085 }],
      ['tee', { d: 0.1, bf: 0.1, tf: 0.01, tw: 0.01 }],
      ['angle', { d: 0.1, b: 0.08, t: 0.01 }],
      ['rhs', { h: 0.2, b: 0.1, t: 0.008 }],
      ['rhs', { h: 0.05, b: 0.05, t: 0.02 }], // thick wall: corner radius capped at b/2
      ['chs', { D: 0.2, t: 0.008 }],
      ['rect', { h: 0.2, b: 0.1 }],
      ['round', { D: 0.05 }],
    ];
    for (const [shape, dims] of cases) {
      const p = sectionProperties(shape, dims);
      for (const [k, v] of Object.entries(p)) {
        expect(Number.isFinite(v), `${shape} ${k}`).toBe(true);
        if (k !== 'Cw') expect(v, `${shape} ${k}`).toBeGreaterThan(0);
        else expect(v, `${shape} ${k}`).toBeGreaterThanOrEqual(0);
      }
      expect(p.Z_major, `${shape} Z ≥ S`).toBeGreaterThanOrEqual(p.S_major);
      expect(p.Z_minor, `${shape} Z ≥ S`).toBeGreaterThanOrEqual(p.S_minor);
    }
  });
});
