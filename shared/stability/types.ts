/**
 * What the stability floor (second-order analysis, elastic critical load factors, natural
 * frequencies) adds to an analysis. All values SI. Built on the engine (shared/engine); the
 * design checks, exports, server and screens read these records.
 */
import type { AnalysisOrder } from '../model/types.js';

/** One strength or service loading analysed to second order. */
export interface SecondOrderLoading {
  loading: string;
  /** iterations of the geometric stiffness until the axial forces converged */
  iterations: number;
  converged: boolean;
  /** largest change of an axial force in the last iteration, relative to the largest axial force */
  change: number;
  /** ratio of the largest second-order to first-order horizontal node translation (sway) of this loading */
  amplification?: number;
  /** what the code rules added (notional loads, sway imperfection), in words; empty when nothing */
  additions?: string;
}

/** The lowest elastic critical load factors of one loading: (K + α K_G) φ = 0. */
export interface CriticalLoadFactors {
  loading: string;
  /** ascending; Infinity when no compression can cause buckling (no compression anywhere) */
  alphaCr: number[];
  /** buckled shape per mode: user nodes × 6 (ux…rz), scaled to a largest translation of 1 */
  shapes?: Float64Array[];
}

/** One natural mode of K φ = ω² M φ. */
export interface NaturalMode {
  mode: number;
  /** Hz */
  frequency: number;
  /** s */
  period: number;
  /** effective modal mass ratios along global X, Y, Z (0–1) */
  massRatio: [number, number, number];
  /** user nodes × 6 (ux…rz), scaled to a largest translation of 1 */
  shape: Float64Array;
}

/** A first-order run under a design code whose frame is sensitive to sway. */
export interface StabilityWarning {
  loading: string;
  alphaCr: number;
  /** 1 / (1 − 1/αcr); Infinity when αcr ≤ 1 */
  amplifier: number;
  /** which limits are exceeded */
  reasons: ('en1993-1-1 5.2.1(3): αcr < 10' | 'aisc360-22 C: amplifier > 1.5')[];
  message: string;
}

export interface StabilitySummary {
  analysis: AnalysisOrder;
  /** the method in words, shown in run summaries, records and export headers */
  method: string;
  /** second order: internal sub-elements per frame member and the convergence tolerance */
  subdivisions?: number;
  tolerance?: number;
  secondOrder: SecondOrderLoading[];
  /** per strength loading: the lowest αcr (first-order warning) or the requested buckling modes */
  critical: CriticalLoadFactors[];
  modes: NaturalMode[];
  /** total mass of the model (kg) that the modes used, along X, Y, Z */
  totalMass?: [number, number, number];
  warnings: StabilityWarning[];
}
