/**
 * Display helpers for a run's stability results: the analysis order, αcr bands (against 10,
 * EN 1993-1-1 5.2.1(3)), the combinations lowest αcr first, frequencies, periods, modal mass
 * ratios, and the choices of shapes for the picture. Pure, tested in tests/client.
 */
import type { RunStability } from '../../shared/schemas/runs.js';

/** The limit the run summary colours αcr against: below it, second-order effects matter. */
export const ALPHA_CR_LIMIT = 10;

/** `unstable`: αcr ≤ 1 (at or above the critical load); `low`: below 10; `ok`: 10 or more, or no buckling (null). */
export type AlphaBand = 'unstable' | 'low' | 'ok';

export const ALPHA_BAND_COLORS: Record<AlphaBand, string> = { unstable: 'error', low: 'warning', ok: 'success' };

export function alphaCrBand(alpha: number | null | undefined): AlphaBand {
  if (alpha === null || alpha === undefined || !Number.isFinite(alpha)) return 'ok';
  if (alpha <= 1) return 'unstable';
  return alpha < ALPHA_CR_LIMIT ? 'low' : 'ok';
}

/** αcr for a table: two decimals, `∞` when nothing buckles (no compression), `—` when missing. */
export function formatAlphaCr(alpha: number | null | undefined): string {
  if (alpha === undefined) return '—';
  if (alpha === null || alpha === Infinity) return '∞';
  if (!Number.isFinite(alpha)) return '—';
  return Math.abs(alpha) >= 1e4 ? alpha.toExponential(2) : alpha.toFixed(2);
}

/** Sway amplifier 1 / (1 − 1/αcr); null where αcr ≤ 1 (no finite amplification) or nothing buckles. */
export function swayAmplifier(alpha: number | null | undefined): number | null {
  if (alpha === null || alpha === undefined || !Number.isFinite(alpha) || alpha <= 1) return null;
  return 1 / (1 - 1 / alpha);
}

export function analysisOrderLabel(order: RunStability['analysis'] | null | undefined): string {
  return order === 'second_order' ? 'Second order' : 'First order';
}

/** The member-detail line that says where the diagrams come from. */
export function diagramsFrom(order: RunStability['analysis'], method?: string): string {
  const base = order === 'second_order'
    ? 'Forces and deflections from the second-order analysis (P-Δ and P-δ): they include the effect of the deformed shape'
    : 'Forces and deflections from the first-order analysis';
  return method ? `${base}. Method: ${method}.` : `${base}.`;
}

export interface CriticalRow {
  loading: string;
  /** the lowest αcr (null: nothing buckles) */
  lowest: number | null;
  /** every αcr computed for the loading, ascending */
  all: (number | null)[];
  band: AlphaBand;
  amplifier: number | null;
  /** buckled shapes kept for the picture */
  shapes: number;
}

/** One row per loading, lowest αcr first; loadings where nothing buckles last. */
export function criticalRows(critical: RunStability['critical']): CriticalRow[] {
  const rows = critical.map((c) => {
    const lowest = c.alphaCr.length ? c.alphaCr[0] : null;
    return { loading: c.loading, lowest, all: c.alphaCr, band: alphaCrBand(lowest), amplifier: swayAmplifier(lowest), shapes: c.shapes };
  });
  const key = (r: CriticalRow) => (r.lowest === null ? Infinity : r.lowest);
  return rows.sort((a, b) => key(a) - key(b) || a.loading.localeCompare(b.loading));
}

/** "2 to 5 iterations" / "3 iterations" over every loading analysed to second order. */
export function iterationsText(secondOrder: RunStability['secondOrder']): string {
  if (secondOrder.length === 0) return '—';
  const its = secondOrder.map((l) => l.iterations);
  const lo = Math.min(...its);
  const hi = Math.max(...its);
  return lo === hi ? `${hi} iteration${hi === 1 ? '' : 's'}` : `${lo} to ${hi} iterations`;
}

/** Hz with four significant digits. */
export function formatFrequency(hz: number): string {
  return Number.isFinite(hz) ? hz.toPrecision(4) : '—';
}

/** s with four significant digits. */
export function formatPeriod(s: number): string {
  return Number.isFinite(s) ? s.toPrecision(4) : '—';
}

/** 0.8034 → "80.3 %". */
export function formatMassRatio(r: number): string {
  return Number.isFinite(r) ? `${(r * 100).toFixed(1)} %` : '—';
}

/** Sum of the effective modal mass ratios of the listed modes along X, Y, Z. */
export function cumulativeMass(modes: RunStability['modes']): [number, number, number] {
  return modes.reduce<[number, number, number]>((s, m) => [s[0] + m.massRatio[0], s[1] + m.massRatio[1], s[2] + m.massRatio[2]], [0, 0, 0]);
}

/** A shape the picture can draw: `mode:<n>` or `buckling:<n>:<loading>`. */
export interface ShapeChoice {
  title: string;
  value: string;
}

export function shapeChoices(s: RunStability | null | undefined): ShapeChoice[] {
  if (!s) return [];
  const out: ShapeChoice[] = s.modes.map((m) => ({ title: `Mode ${m.mode} — ${formatFrequency(m.frequency)} Hz`, value: `mode:${m.mode}` }));
  for (const c of s.critical) {
    for (let i = 0; i < c.shapes; i++) {
      out.push({ title: `${c.loading} buckling ${i + 1} — αcr ${formatAlphaCr(c.alphaCr[i] ?? null)}`, value: `buckling:${i + 1}:${c.loading}` });
    }
  }
  return out;
}

export function parseShapeChoice(value: string): { kind: 'mode' | 'buckling'; index: number; loading: string | null } | null {
  const m = /^(mode|buckling):(\d+)(?::(.*))?$/s.exec(value);
  if (!m) return null;
  return { kind: m[1] as 'mode' | 'buckling', index: Number(m[2]), loading: m[3] ?? null };
}

/** Shapes come scaled to a largest translation of 1; by default the picture draws that at 10 % of the model's size. */
export const DEFAULT_SHAPE_PERCENT = 10;

/** The factor on a shape (largest translation 1) that draws its largest movement at `percent` of the model's size. */
export function shapeDrawScale(modelSize: number, percent: number): number {
  if (!Number.isFinite(percent) || !(modelSize > 0)) return 0;
  return (modelSize * percent) / 100;
}

/** Animation: the factor on the shape at time t (ms), one swing per `periodMs`. */
export function swingFactor(tMs: number, periodMs = 1600): number {
  return Math.sin((2 * Math.PI * tMs) / periodMs);
}
