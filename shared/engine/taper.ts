/**
 * Section properties along a member, tapered or not. A tapered member (`sectionEnd`)
 * interpolates dimensions linearly for dimensioned shapes (properties follow from them),
 * and each property linearly for custom sections (tables.md "members").
 */
import type { Section, SectionDims, SectionProps } from '../model/types.js';
import { sectionProperties } from '../sections/index.js';

export interface StiffnessProps {
  A: number;
  Iy: number;
  Iz: number;
  J: number;
  depth: number;
}

export type PropsAt = (t: number) => StiffnessProps;

function pick(p: SectionProps): StiffnessProps {
  return { A: p.A, Iy: p.I_major, Iz: p.I_minor, J: p.J, depth: p.depth };
}

function lerpProps(p0: SectionProps, p1: SectionProps, t: number): StiffnessProps {
  const l = (a: number, b: number) => a + (b - a) * t;
  return { A: l(p0.A, p1.A), Iy: l(p0.I_major, p1.I_major), Iz: l(p0.I_minor, p1.I_minor), J: l(p0.J, p1.J), depth: l(p0.depth, p1.depth) };
}

/** Properties as a function of t = x / L. */
export function propsAlong(s0: Section, s1: Section | undefined): PropsAt {
  const c0 = pick(s0.props);
  if (!s1) return () => c0;
  const byDims = s0.shape !== 'custom' && s0.shape === s1.shape && s0.given.length === 0 && s1.given.length === 0;
  if (byDims) {
    return (t: number) => {
      const dims: SectionDims = {};
      for (const k of Object.keys(s0.dims) as (keyof SectionDims)[]) {
        const a = s0.dims[k], b = s1.dims[k];
        if (a !== undefined) dims[k] = b !== undefined ? a + (b - a) * t : a;
      }
      try {
        return pick(sectionProperties(s0.shape, dims));
      } catch {
        return lerpProps(s0.props, s1.props, t);
      }
    };
  }
  return (t: number) => lerpProps(s0.props, s1.props, t);
}
