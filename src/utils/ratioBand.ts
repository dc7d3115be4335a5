/**
 * Utilisation bands and their colours (our own palette): up to 0.9, up to 1.0, over 1.0,
 * and not checked. Used by the grid bar, the model picture and the legend.
 */
import type { CheckStatus } from '../../shared/design/types.js';

export type RatioBand = 'low' | 'near' | 'over' | 'none';

export const BAND_COLORS: Record<RatioBand, string> = {
  low: '#4E8A6B',
  near: '#D19A2E',
  over: '#B5432F',
  none: '#8C8F96',
};

export const BAND_LABELS: Record<RatioBand, string> = {
  low: 'ratio ≤ 0.90',
  near: '0.90 < ratio ≤ 1.00',
  over: 'ratio > 1.00',
  none: 'not checked',
};

/** The band of a governing ratio; a member that was not checked is `none` whatever its number. */
export function ratioBand(ratio: number | null | undefined, status?: CheckStatus): RatioBand {
  if (status === 'not checked' || ratio === null || ratio === undefined || !Number.isFinite(ratio)) return 'none';
  if (ratio <= 0.9) return 'low';
  if (ratio <= 1.0) return 'near';
  return 'over';
}

/** A ratio as shown in the grid: three decimals, '—' when not checked. */
export function formatRatio(ratio: number | null | undefined): string {
  return ratio === null || ratio === undefined || !Number.isFinite(ratio) ? '—' : ratio.toFixed(3);
}

/** Change of ratio against the previous run (null when either is missing). */
export function ratioDelta(ratio: number | null, previous: number | null | undefined): number | null {
  if (ratio === null || previous === null || previous === undefined) return null;
  return ratio - previous;
}

/** A change shown with its sign: "+0.012", "−0.300", "0.000"; '' when there is none. */
export function formatDelta(delta: number | null): string {
  if (delta === null || !Number.isFinite(delta)) return '';
  const text = Math.abs(delta).toFixed(3);
  if (text === '0.000') return '0.000';
  return (delta > 0 ? '+' : '−') + text;
}

/** True when a change is big enough to show (half the last shown digit). */
export function isChanged(delta: number | null): boolean {
  return delta !== null && Math.abs(delta) >= 0.0005;
}

/** Width of the bar in percent of the cell: ratio 1.0 fills 80 %, capped at 100 %. */
export function barWidth(ratio: number | null | undefined): number {
  if (ratio === null || ratio === undefined || !Number.isFinite(ratio) || ratio <= 0) return 0;
  return Math.min(100, ratio * 80);
}
