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

/**
 * European rolled sections (dimensions and properties as published in the producers'
 * section tables to EN 10365, from memory), mm units.
 */
export const IPE300 = () => section('i', { d: 300, bf: 150, tf: 10.7, tw: 7.1, r: 15 },
  { A: 5381, I_major: 8356e4, I_minor: 603.8e4, J: 20.12e4, Cw: 125.9e9, S_major: 557.1e3, S_minor: 80.5e3, Z_major: 628.4e3, Z_minor: 125.2e3 }, 0.001, 'IPE300');
export const HEB200 = () => section('i', { d: 200, bf: 200, tf: 15, tw: 9, r: 18 },
  { A: 7808, I_major: 5696e4, I_minor: 2003e4, J: 59.28e4, Cw: 171.1e9, S_major: 569.6e3, S_minor: 200.3e3, Z_major: 642.5e3, Z_minor: 305.8e3 }, 0.001, 'HEB200');
export const HEA300 = () => section('i', { d: 290, bf: 300, tf: 14, tw: 8.5, r: 27 },
  { A: 11250, I_major: 18260e4, I_minor: 6310e4, J: 85.17e4, Cw: 1200e9, S_major: 1260e3, S_minor: 420.6e3, Z_major: 1383e3, Z_minor: 641.2e3 }, 0.001, 'HEA300');
