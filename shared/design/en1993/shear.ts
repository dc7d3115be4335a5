/**
 * EN 1993-1-1 6.2.6 shear: Vpl,Rd = Av·(fy/√3)/γM0 (6.18), shear area Av per 6.2.6(3)
 * with η = 1.0 (conservative value allowed by the note to 6.2.6(3)). Webs with
 * hw/tw > 72ε/η need a shear buckling check to EN 1993-1-5 (6.2.6(6)): not checked.
 * Solid bars: Av = A (common practice; 6.2.6(3) lists no solid section). Angles: not checked.
 * A shear area given in `sections` (Av_major, Av_minor) is used as Av in (6.18) in place of
 * the 6.2.6(3) rule (stated in the record); the 6.2.6(6) web buckling limit still applies.
 * Where no shear check is possible (custom sections: 6.2.6(6) cannot be excluded without
 * dimensions; angles) the given area is refused with that reason.
 */
import { inp, notCheckedHead } from '../record.js';
import type { DesignGeometry } from '../geometry.js';
import { epsilon, type EnContext, type Resistance } from './context.js';

/** The shear area and the rule that gave it, or null when 6.2.6(3) has no rule for the shape. */
export function shearArea(g: DesignGeometry, axis: 'major' | 'minor'): { Av: number; rule: string } | null {
  const hw = g.d - 2 * g.tf;
  switch (g.shape) {
    case 'i':
      if (axis === 'minor') return { Av: g.A - hw * g.tw, rule: 'A − Σ(hw·tw), load parallel to flanges (6.2.6(3)e)' };
      return g.rolled
        ? { Av: Math.max(g.A - 2 * g.bf * g.tf + (g.tw + 2 * g.r) * g.tf, hw * g.tw), rule: 'A − 2b·tf + (tw + 2r)·tf ≥ η·hw·tw, rolled I, load parallel to web (6.2.6(3)a)' }
        : { Av: hw * g.tw, rule: 'η·Σ(hw·tw), welded I, load parallel to web (6.2.6(3)d)' };
    case 'channel':
      if (axis === 'minor') return { Av: g.A - hw * g.tw, rule: 'A − Σ(hw·tw), load parallel to flanges (6.2.6(3)e)' };
      return g.rolled
        ? { Av: g.A - 2 * g.bf * g.tf + (g.tw + g.r) * g.tf, rule: 'A − 2b·tf + (tw + r)·tf, rolled channel, load parallel to web (6.2.6(3)b)' }
        : { Av: hw * g.tw, rule: 'η·Σ(hw·tw), welded channel, load parallel to web (6.2.6(3)d)' };
    case 'tee':
      if (axis === 'minor') return null;
      return g.rolled
        ? { Av: g.A - g.bf * g.tf + ((g.tw + 2 * g.r) * g.tf) / 2, rule: 'A − b·tf + (tw + 2r)·tf/2, rolled T, load parallel to web (6.2.6(3)c)' }
        : { Av: g.tw * (g.d - g.tf / 2), rule: 'tw·(h − tf/2), welded T, load parallel to web (6.2.6(3)c)' };
    case 'rhs':
      return axis === 'major'
        ? { Av: (g.A * g.h) / (g.b + g.h), rule: 'A·h/(b + h), load parallel to depth (6.2.6(3)f)' }
        : { Av: (g.A * g.b) / (g.b + g.h), rule: 'A·b/(b + h), load parallel to width (6.2.6(3)f)' };
    case 'chs':
      return { Av: (2 * g.A) / Math.PI, rule: '2A/π, circular hollow section (6.2.6(3)g)' };
    case 'rect': case 'round':
      return { Av: g.A, rule: 'A, solid bar (common practice: 6.2.6(3) lists no solid section)' };
    default:
      return null;
  }
}

export function shearResistance(g: DesignGeometry, c: EnContext, axis: 'major' | 'minor'): Resistance {
  const family = axis === 'major' ? 'shear_major' : 'shear_minor';
  const title = axis === 'major' ? 'shear, load parallel to web' : 'shear, load parallel to flanges';
  const givenAv = axis === 'major' ? g.AvGivenMajor : g.AvGivenMinor;
  const given = !Number.isNaN(givenAv);
  if (given && !(givenAv > 0)) return { capacity: NaN, head: notCheckedHead(family, 'en1993-1-1', '6.2.6', title, `${axis === 'major' ? 'Av_major' : 'Av_minor'} given = ${givenAv} is not positive: shear not evaluated`) };
  const rule = g.hasDims ? shearArea(g, axis) : null;
  const av = rule && given ? { Av: givenAv, rule: `Av given in sections (in place of ${rule.rule})` } : rule;
  if (!av) {
    const why = g.hasDims ? `${g.shape} section: no shear area rule in 6.2.6(3), not evaluated` : 'custom section: web slenderness unknown, shear buckling (6.2.6(6)) cannot be excluded; not evaluated';
    return { capacity: NaN, head: notCheckedHead(family, 'en1993-1-1', '6.2.6', title, given ? `${why}; the given ${axis === 'major' ? 'Av_major' : 'Av_minor'} is therefore not used` : why) };
  }
  const e = epsilon(c.fy);
  if (axis === 'major' && (g.shape === 'i' || g.shape === 'channel')) {
    const hw = g.d - 2 * g.tf;
    if (hw / g.tw > 72 * e) return { capacity: NaN, head: notCheckedHead(family, 'en1993-1-1', '6.2.6(6)', title, `hw/tw = ${(hw / g.tw).toFixed(1)} > 72ε/η = ${(72 * e).toFixed(1)}: shear buckling (EN 1993-1-5) not implemented`) };
  }
  if (g.shape === 'rhs') {
    const hw = (axis === 'major' ? g.h : g.b) - 3 * g.t;
    if (hw / g.t > 72 * e) return { capacity: NaN, head: notCheckedHead(family, 'en1993-1-1', '6.2.6(6)', title, `hw/t = ${(hw / g.t).toFixed(1)} > 72ε/η: shear buckling (EN 1993-1-5) not implemented`) };
  }
  const cap = (av.Av * c.fy) / Math.sqrt(3) / c.gammaM0;
  return {
    capacity: cap,
    head: {
      family, code: 'en1993-1-1', clause: '6.2.6', title,
      equation: `Vpl,Rd = Av·(fy/√3)/γM0 (6.18); Av = ${av.rule}`,
      inputs: [inp('Av', given ? 'shear area (given)' : 'shear area', av.Av, 'area'), inp('fy', 'yield strength', c.fy, 'stress'), inp('γM0', 'partial factor', c.gammaM0, 'ratio')],
      quantity: 'force',
      note: given ? 'η = 1.0; shear area Av given in sections used in place of the 6.2.6(3) rule' : 'η = 1.0',
    },
  };
}
