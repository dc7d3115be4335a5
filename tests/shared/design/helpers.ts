/** Test helpers: sections and station forces built from handbook values. */
import type { Section, SectionDims, SectionProps, ShapeKind } from '../../../shared/model/types.js';
import type { StationForces } from '../../../shared/engine/types.js';

export const IN = 0.0254;
export const FT = 0.3048;
export const KSI = 6.894757293168361e6;
export const KIP = 4448.2216152605;
export const KIPIN = KIP * IN;
export const KIPFT = KIP * FT;
export const MPA = 1e6;

/** Relative closeness: |a − b| ≤ rtol · max(1e-30, |a|, |b|). */
export function close(a: number, b: number, rtol: number): boolean {
  return Math.abs(a - b) <= rtol * Math.max(1e-30, Math.abs(a), Math.abs(b));
}

/**
 * A section from dimensions and properties in one length unit `u` (IN for handbook inch
 * values, 0.001 for mm). Missing properties are 0.
 */
export function section(shape: ShapeKind, dims: SectionDims, props: Partial<SectionProps>, u: number, id = 'S'): Section {
  const d: SectionDims = {};
  for (const [k, v] of Object.entries(dims)) (d as Record<string, number>)[k] = (v as number) * u;
  const pow: Record<keyof SectionProps, number> = { A: 2, I_major: 4, I_minor: 4, J: 4, Cw: 6, S_major: 3, S_minor: 3, Z_major: 3, Z_minor: 3, Av_major: 2, Av_minor: 2, depth: 1 };
  const p = { A: 0, I_major: 0, I_minor: 0, J: 0, Cw: 0, S_major: 0, S_minor: 0, Z_major: 0, Z_minor: 0, Av_major: 0, Av_minor: 0, depth: 0 } as SectionProps;
  for (const [k, v] of Object.entries(props)) p[k as keyof SectionProps] = (v as number) * u ** pow[k as keyof SectionProps];
  return { id, shape, dims: d, props: p, given: [] };
}

/**
 * Station forces of a member of length L from functions of x (SI), at n evenly spaced
 * stations (11 by default, as the engine gives).
 */
export function stations(L: number, f: Partial<Record<'N' | 'V_major' | 'V_minor' | 'T' | 'M_major' | 'M_minor' | 'd_major' | 'd_minor', (x: number) => number>>, n = 11): StationForces {
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) x[i] = (L * i) / (n - 1);
  const arr = (g?: (x: number) => number) => Float64Array.from(x, (v) => (g ? g(v) : 0));
  return {
    x, N: arr(f.N), V_major: arr(f.V_major), V_minor: arr(f.V_minor), T: arr(f.T),
    M_major: arr(f.M_major), M_minor: arr(f.M_minor), d_major: arr(f.d_major), d_minor: arr(f.d_minor),
  };
}

/**
 * Handbook sections (AISC Steel Construction Manual, 15th/16th ed., Table 1-1 and
 * Tables 1-12/1-13, from memory). Root radius r = kdes − tf.
 */
export const W18X50 = () => section('i', { d: 18.0, bf: 7.5, tf: 0.57, tw: 0.355, r: 0.972 - 0.57 },
  { A: 14.7, I_major: 800, I_minor: 40.1, J: 1.24, Cw: 3040, S_major: 88.9, S_minor: 10.7, Z_major: 101, Z_minor: 16.6 }, IN, 'W18X50');
export const W14X90 = () => section('i', { d: 14.0, bf: 14.5, tf: 0.71, tw: 0.44, r: 1.31 - 0.71 },
  { A: 26.5, I_major: 999, I_minor: 362, J: 4.06, Cw: 16000, S_major: 143, S_minor: 49.9, Z_major: 157, Z_minor: 75.6 }, IN, 'W14X90');
