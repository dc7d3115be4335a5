/**
 * Cross-section classification per EN 1993-1-1 Table 5.2 (class 1, 2, 3; class 4 beyond).
 * Widths c: I rolled (bf − tw − 2r)/2 for the outstand flange, d − 2tf − 2r for the web
 * (welded: without r); channel outstand bf − tw − r; tee outstand (bf − tw)/2 − r, stem
 * d − tf − r treated as an outstand in compression (conservative); RHS walls outside − 3t;
 * CHS d/t with limits 50ε², 70ε², 90ε². Solid bars are class 1. Limits: internal parts in
 * compression 33ε/38ε/42ε, in bending 72ε/83ε/124ε; outstands in compression 9ε/10ε/14ε.
 * These are the pure-compression and pure-bending classes; under combined axial force and
 * bending, I/H and RHS webs are classified station by station from α and ψ
 * (stress-class.ts), other shapes take the worse of the two (conservative).
 */
import type { DesignGeometry } from '../geometry.js';
import { epsilon } from './context.js';

export type EnClass = 1 | 2 | 3 | 4;

export interface EnElement {
  element: string;
  /** c/t (or d/t for CHS) */
  ratio: number;
  limits: [number, number, number];
  part: string;
  cls: EnClass;
}

function element(element: string, ratio: number, limits: [number, number, number], part: string): EnElement {
  const cls: EnClass = ratio <= limits[0] ? 1 : ratio <= limits[1] ? 2 : ratio <= limits[2] ? 3 : 4;
  return { element, ratio, limits, part, cls };
}

const INT_C = [33, 38, 42] as const;
const INT_B = [72, 83, 124] as const;
const OUT_C = [9, 10, 14] as const;
const lim = (k: readonly number[], e: number): [number, number, number] => [k[0] * e, k[1] * e, k[2] * e];

export type EnLoading = 'compression' | 'major' | 'minor';

/** The elements that govern the class of a section under a loading. Empty for solid bars and custom sections. */
export function enElements(g: DesignGeometry, fy: number, loading: EnLoading): EnElement[] {
  const e = epsilon(fy);
  switch (g.shape) {
    case 'i': case 'channel': {
      const out = g.shape === 'i' ? (g.bf - g.tw - 2 * g.r) / 2 : g.bf - g.tw - g.r;
      const flange = element('flange', out / g.tf, lim(OUT_C, e), 'outstand in compression');
      const web = g.d - 2 * g.tf - 2 * g.r;
      if (loading === 'minor') return [flange];
      return [flange, loading === 'compression'
        ? element('web', web / g.tw, lim(INT_C, e), 'internal, compression')
        : element('web', web / g.tw, lim(INT_B, e), 'internal, bending')];
    }
    case 'tee': {
      const flange = element('flange', ((g.bf - g.tw) / 2 - g.r) / g.tf, lim(OUT_C, e), 'outstand in compression');
      if (loading === 'minor') return [flange];
      return [flange, element('stem', (g.d - g.tf - g.r) / g.tw, lim(OUT_C, e), 'outstand in compression (conservative)')];
    }
    case 'rhs': {
      const cb = (g.b - 3 * g.t) / g.t;
      const ch = (g.h - 3 * g.t) / g.t;
      if (loading === 'compression') return [element('wall (width)', cb, lim(INT_C, e), 'internal, compression'), element('wall (depth)', ch, lim(INT_C, e), 'internal, compression')];
      const [fl, wb] = loading === 'major' ? [cb, ch] : [ch, cb];
      return [element('flange', fl, lim(INT_C, e), 'internal, compression'), element('web', wb, lim(INT_B, e), 'internal, bending')];
    }
    case 'chs':
      return [element('wall', g.D / g.t, [50 * e * e, 70 * e * e, 90 * e * e], 'tubular')];
    default:
      return [];
  }
}

/** The class of the section under a loading: the worst of its elements (solid bars: 1). */
export function enClass(g: DesignGeometry, fy: number, loading: EnLoading): EnClass {
  let c: EnClass = 1;
  for (const el of enElements(g, fy, loading)) if (el.cls > c) c = el.cls;
  return c;
}
