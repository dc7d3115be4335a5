/**
 * Element slenderness classification of AISC 360-22 Table B4.1a (members in axial
 * compression: nonslender / slender) and Table B4.1b (members in flexure: compact /
 * noncompact / slender), for the shapes Trestle knows.
 *
 * Width-to-thickness ratios used (dimensions from the section, see geometry.ts):
 * I: flange bf/(2tf), web h/tw with h the clear web depth; channel: flange bf/tf, web h/tw;
 * tee: flange bf/(2tf), stem d/tw; angle: leg b/t (larger leg); rectangular HSS: walls
 * (b − 3t)/t and (h − 3t)/t; round HSS: D/t. Solid bars have no slender elements.
 * Welded I flanges use kc = 4/√(h/tw), 0.35 ≤ kc ≤ 0.76 (Table B4.1 note [a]) and
 * FL = 0.7·Fy (Table B4.1b case 11, Sxt/Sxc ≥ 0.7 for doubly symmetric shapes).
 */
import type { DesignGeometry } from '../geometry.js';

export type CompressionClass = 'nonslender' | 'slender';
export type FlexureClass = 'compact' | 'noncompact' | 'slender';

export interface ElementRatio {
  /** "flange", "web", "stem", "leg", "wall" */
  element: string;
  symbol: string;
  ratio: number;
  /** compact limit (flexure only) */
  lambdaP: number;
  /** noncompact / nonslender limit */
  lambdaR: number;
  /** Table B4.1a/b case */
  tableCase: string;
}

export function flexureClassOf(e: ElementRatio): FlexureClass {
  return e.ratio <= e.lambdaP ? 'compact' : e.ratio <= e.lambdaR ? 'noncompact' : 'slender';
}
export function compressionClassOf(e: ElementRatio): CompressionClass {
  return e.ratio <= e.lambdaR ? 'nonslender' : 'slender';
}

/** kc of Table B4.1 note [a]. */
export function kcOf(g: DesignGeometry): number {
  const k = 4 / Math.sqrt(g.hw / g.tw);
  return Math.min(0.76, Math.max(0.35, k));
}

/** Elements of a member in axial compression, Table B4.1a. Empty for solid bars and custom sections. */
export function compressionElements(g: DesignGeometry, E: number, Fy: number): ElementRatio[] {
  const s = Math.sqrt(E / Fy);
  switch (g.shape) {
    case 'i': {
      const flange = g.rolled
        ? { lambdaR: 0.56 * s, tableCase: 'B4.1a case 1' }
        : { lambdaR: 0.64 * Math.sqrt((kcOf(g) * E) / Fy), tableCase: 'B4.1a case 2' };
      return [
        { element: 'flange', symbol: 'bf/2tf', ratio: g.bf / (2 * g.tf), lambdaP: NaN, ...flange },
        { element: 'web', symbol: 'h/tw', ratio: g.hw / g.tw, lambdaP: NaN, lambdaR: 1.49 * s, tableCase: 'B4.1a case 5' },
      ];
    }
    case 'channel':
      return [
        { element: 'flange', symbol: 'bf/tf', ratio: g.bf / g.tf, lambdaP: NaN, lambdaR: 0.56 * s, tableCase: 'B4.1a case 1' },
        { element: 'web', symbol: 'h/tw', ratio: g.hw / g.tw, lambdaP: NaN, lambdaR: 1.49 * s, tableCase: 'B4.1a case 5' },
      ];
    case 'tee':
      return [
        { element: 'flange', symbol: 'bf/2tf', ratio: g.bf / (2 * g.tf), lambdaP: NaN, lambdaR: 0.56 * s, tableCase: 'B4.1a case 1' },
        { element: 'stem', symbol: 'd/tw', ratio: g.d / g.tw, lambdaP: NaN, lambdaR: 0.75 * s, tableCase: 'B4.1a case 4' },
      ];
    case 'angle':
      return [{ element: 'leg', symbol: 'b/t', ratio: Math.max(g.d, g.b) / g.t, lambdaP: NaN, lambdaR: 0.45 * s, tableCase: 'B4.1a case 3' }];
    case 'rhs':
      return [
        { element: 'wall (width)', symbol: 'b/t', ratio: (g.b - 3 * g.t) / g.t, lambdaP: NaN, lambdaR: 1.4 * s, tableCase: 'B4.1a case 6' },
        { element: 'wall (depth)', symbol: 'h/t', ratio: (g.h - 3 * g.t) / g.t, lambdaP: NaN, lambdaR: 1.4 * s, tableCase: 'B4.1a case 6' },
      ];
    case 'chs':
      return [{ element: 'wall', symbol: 'D/t', ratio: g.D / g.t, lambdaP: NaN, lambdaR: (0.11 * E) / Fy, tableCase: 'B4.1a case 9' }];
    default:
      return [];
  }
}

/**
 * Elements of a member in flexure, Table B4.1b. `axis` 'major' or 'minor'. For the minor
 * axis of I-shapes and channels only the flanges matter (F6); for rectangular HSS bent
 * about the minor axis the roles of b and h swap.
 */
export function flexureElements(g: DesignGeometry, E: number, Fy: number, axis: 'major' | 'minor'): ElementRatio[] {
  const s = Math.sqrt(E / Fy);
  switch (g.shape) {
    case 'i': {
      const flange: ElementRatio = g.rolled
        ? { element: 'flange', symbol: 'bf/2tf', ratio: g.bf / (2 * g.tf), lambdaP: 0.38 * s, lambdaR: 1.0 * s, tableCase: 'B4.1b case 10' }
        : { element: 'flange', symbol: 'bf/2tf', ratio: g.bf / (2 * g.tf), lambdaP: 0.38 * s, lambdaR: 0.95 * Math.sqrt((kcOf(g) * E) / (0.7 * Fy)), tableCase: 'B4.1b case 11' };
      if (axis === 'minor') return [{ ...flange, tableCase: g.rolled ? 'B4.1b case 13' : flange.tableCase }];
      return [flange, { element: 'web', symbol: 'h/tw', ratio: g.hw / g.tw, lambdaP: 3.76 * s, lambdaR: 5.7 * s, tableCase: 'B4.1b case 15' }];
    }
    case 'channel': {
      const flange: ElementRatio = { element: 'flange', symbol: 'bf/tf', ratio: g.bf / g.tf, lambdaP: 0.38 * s, lambdaR: 1.0 * s, tableCase: 'B4.1b case 10' };
      if (axis === 'minor') return [flange];
      return [flange, { element: 'web', symbol: 'h/tw', ratio: g.hw / g.tw, lambdaP: 3.76 * s, lambdaR: 5.7 * s, tableCase: 'B4.1b case 15' }];
    }
    case 'rhs': {
      const bw = axis === 'major' ? g.b : g.h; // flange: the wall parallel to the axis of bending
      const hw = axis === 'major' ? g.h : g.b;
      return [
        { element: 'flange', symbol: 'b/t', ratio: (bw - 3 * g.t) / g.t, lambdaP: 1.12 * s, lambdaR: 1.4 * s, tableCase: 'B4.1b case 17' },
        { element: 'web', symbol: 'h/t', ratio: (hw - 3 * g.t) / g.t, lambdaP: 2.42 * s, lambdaR: 5.7 * s, tableCase: 'B4.1b case 19' },
      ];
    }
    case 'chs':
      return [{ element: 'wall', symbol: 'D/t', ratio: g.D / g.t, lambdaP: (0.07 * E) / Fy, lambdaR: (0.31 * E) / Fy, tableCase: 'B4.1b case 20' }];
    case 'tee':
      return [
        { element: 'flange', symbol: 'bf/2tf', ratio: g.bf / (2 * g.tf), lambdaP: 0.38 * s, lambdaR: 1.0 * s, tableCase: 'B4.1b case 10' },
        { element: 'stem', symbol: 'd/tw', ratio: g.d / g.tw, lambdaP: 0.84 * s, lambdaR: 1.52 * s, tableCase: 'B4.1b case 14' },
      ];
    case 'angle':
      return [{ element: 'leg', symbol: 'b/t', ratio: Math.max(g.d, g.b) / g.t, lambdaP: 0.54 * s, lambdaR: 0.91 * s, tableCase: 'B4.1b case 12' }];
    default:
      return [];
  }
}
