import { describe, expect, it } from 'vitest';
import { designGeometry, sectionProperties } from '../../../shared/sections/index.js';
import type { Section, SectionDims, ShapeKind } from '../../../shared/model/types.js';
import { close } from './helpers.js';

const sec = (shape: ShapeKind, dims: SectionDims): Section => ({ id: 'x', shape, dims, props: sectionProperties(shape, dims), given: [] });

describe('designGeometry', () => {
  it('doubly symmetric shapes have the shear centre at the centroid (H = 1)', () => {
    const g = designGeometry(sec('i', { d: 0.3, bf: 0.15, tf: 0.0107, tw: 0.0071, r: 0.015 }));
    expect(g.y0).toBe(0);
    expect(g.z0).toBe(0);
    expect(g.H).toBe(1);
  });
  it('channel: shear centre e0 = 3b′²tf/(6b′tf + h′tw) behind the web centreline (thin-walled closed form)', () => {
    const d = 0.2, bf = 0.075, tf = 0.0115, tw = 0.0085;
    const g = designGeometry(sec('channel', { d, bf, tf, tw }));
    const b1 = bf - tw / 2, h1 = d - tf;
    close(g.channel!.e0, (3 * b1 * b1 * tf) / (6 * b1 * tf + h1 * tw), 1e-12);
    close(g.y0, g.channel!.e0 + g.channel!.xBar - tw / 2, 1e-12);
    expect(g.H).toBeGreaterThan(0);
    expect(g.H).toBeLessThan(1);
    close(g.bt.flange!, bf / tf, 1e-12); // AISC Table B4.1: b = bf for channels
  });
  it('tee: shear centre at the flange mid-thickness; AISC stem ratio d/tw', () => {
    const g = designGeometry(sec('tee', { d: 0.1, bf: 0.1, tf: 0.01, tw: 0.01 }));
    close(g.z0, (1000 * 5 + 900 * 55) / 1900 / 1000 - 0.005, 1e-9);
    close(g.bt.stem!, 10, 1e-12);
  });
  it('rhs and chs: flat width h − 3t (AISC B4.1b(d), EN Table 5.2) and D/t; EN 6.2.6(3)(f)/(g) shear areas', () => {
    const r = designGeometry(sec('rhs', { h: 0.3, b: 0.2, t: 0.01 }));
    close(r.bt.wallH!, 27, 1e-12);
    close(r.ct.wallB!, 17, 1e-12);
    const A = r.AvEnMajor! + r.AvEnMinor!;
    close(r.AvEnMajor!, (A * 0.3) / 0.5, 1e-12);
    const c = designGeometry(sec('chs', { D: 0.2, t: 0.008 }));
    close(c.bt.Dt!, 25, 1e-12);
    close(c.AvEnMajor!, (2 * sectionProperties('chs', { D: 0.2, t: 0.008 }).A) / Math.PI, 1e-12);
  });
  it('angle: leg ratios and the shear centre at the heel of the centrelines', () => {
    const dims = { d: 0.1, b: 0.1, t: 0.01 };
    const g = designGeometry(sec('angle', dims));
    close(g.bt.legD!, 10, 1e-12);
    close(g.ct.legMean!, 10, 1e-12);
    // equal angle: heel on the symmetry (major) axis, (ȳ − t/2)·√2 from the centroid
    close(Math.abs(g.y0), (g.angle!.yBar - 0.005) * Math.SQRT2, 1e-9);
    expect(Math.abs(g.z0)).toBeLessThan(1e-12);
  });
});
