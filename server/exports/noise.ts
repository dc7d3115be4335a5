/**
 * Floating-point noise in an export table written as 0 (issue 13): a value below
 * NOISE_RELATIVE (shared/design/noise.ts, 1e-9) of the largest value of its kind is zero.
 *
 * Kinds are columns that hold the same quantity: translations (ux, uy, uz, d_major, d_minor),
 * rotations (rx, ry, rz), forces (fx, fy, fz, N, V_major, V_minor) and moments (mx, my, mz, T,
 * M_major, M_minor). The largest is taken per loading (rows with the same `loading` and
 * `envelope`), so a loading that is small but real keeps its values; a table without a
 * `loading` column is one group. Forces and moments were already cleaned against the run's
 * force floor (shared/exports/results.ts); this pass catches displacements and local
 * deflections, which that floor does not cover. In the detailed checks a demand below 1e-9 of
 * the capacity on its row (same unit) is zero. Ratios, positions and lengths are never touched.
 * Every export (CSV and XLSX, stored or recomputed) goes through here (export-task.ts).
 */
import { NOISE_RELATIVE, clean } from '../../shared/design/noise.js';
import type { ResultCell, ResultTable } from '../../shared/exports/index.js';

const KINDS: Record<string, string> = {
  ux: 'translation', uy: 'translation', uz: 'translation', d_major: 'translation', d_minor: 'translation',
  rx: 'rotation', ry: 'rotation', rz: 'rotation',
  fx: 'force', fy: 'force', fz: 'force', n: 'force', v_major: 'force', v_minor: 'force',
  mx: 'moment', my: 'moment', mz: 'moment', t: 'moment', m_major: 'moment', m_minor: 'moment',
};

/** The kind of a column from its header (`ux [mm]` → translation), or undefined. */
export function columnKind(header: string): string | undefined {
  const name = header.replace(/\s*\[[^\]]*\]\s*$/, '').trim().toLowerCase();
  return KINDS[name];
}

const isNumber = (c: ResultCell): c is number => typeof c === 'number' && Number.isFinite(c);

/** The table with noise as 0 (the rows are changed in place; the table is returned). */
export function cleanTableNoise(table: ResultTable): ResultTable {
  const kinds = table.header.map(columnKind);
  const loadingCol = table.header.indexOf('loading');
  const envelopeCol = table.header.indexOf('envelope');
  if (kinds.some((k) => k !== undefined)) {
    const groupOf = (row: ResultCell[]) => (loadingCol < 0 ? '' : `${String(row[loadingCol])}\u0000${envelopeCol < 0 ? '' : String(row[envelopeCol])}`);
    // largest magnitude per (loading, kind)
    const largest = new Map<string, number>();
    for (const row of table.rows) {
      const g = groupOf(row);
      kinds.forEach((k, c) => {
        const v = row[c];
        if (!k || !isNumber(v)) return;
        const key = `${g}\u0000${k}`;
        if (Math.abs(v) > (largest.get(key) ?? 0)) largest.set(key, Math.abs(v));
      });
    }
    for (const row of table.rows) {
      const g = groupOf(row);
      kinds.forEach((k, c) => {
        const v = row[c];
        if (!k || !isNumber(v)) return;
        row[c] = clean(v, NOISE_RELATIVE * (largest.get(`${g}\u0000${k}`) ?? 0)) || 0;
      });
    }
  }
  const demand = table.header.indexOf('demand');
  const capacity = table.header.indexOf('capacity');
  if (demand >= 0 && capacity >= 0) {
    for (const row of table.rows) {
      const d = row[demand];
      const cap = row[capacity];
      if (isNumber(d) && isNumber(cap)) row[demand] = clean(d, NOISE_RELATIVE * Math.abs(cap)) || 0;
    }
  }
  return table;
}
