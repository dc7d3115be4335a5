/**
 * The stability result tables (tables.md "Results exports"): elastic critical load factors
 * (`loading`, `mode`, `alpha_cr`) and natural frequencies (`mode`, `frequency [Hz]`,
 * `period [s]`, `mass_x`, `mass_y`, `mass_z`). Hz, s and ratios are the same in both unit
 * systems. The run export and the batch command both write them.
 */
import type { ResultTable } from '../../shared/exports/index.js';
import type { RunStability } from '../../shared/schemas/runs.js';

export const STABILITY_HEADER = ['loading', 'mode', 'alpha_cr'];
export const MODES_HEADER = ['mode', 'frequency [Hz]', 'period [s]', 'mass_x', 'mass_y', 'mass_z'];

/** One row per loading and mode; an infinite αcr (no compression) is a blank cell. */
export function stabilityTable(s: RunStability): ResultTable {
  const rows = s.critical.flatMap((c) => c.alphaCr.map((a, i) => [c.loading, i + 1, a]));
  return { name: 'stability', header: [...STABILITY_HEADER], rows };
}

export function modesTable(s: RunStability): ResultTable {
  const rows = s.modes.map((m) => [m.mode, m.frequency, m.period, m.massRatio[0], m.massRatio[1], m.massRatio[2]]);
  return { name: 'modes', header: [...MODES_HEADER], rows };
}

/**
 * The batch command's stability files: stability.csv when `buckling_modes` > 0 or αcr were
 * computed anyway (the first-order stability warning), modes.csv when `modes` > 0.
 */
export function stabilityTables(s: RunStability, settings: { bucklingModes: number; modes: number }): ResultTable[] {
  const out: ResultTable[] = [];
  if (settings.bucklingModes > 0 || s.critical.some((c) => c.alphaCr.length > 0)) out.push(stabilityTable(s));
  if (settings.modes > 0 || s.modes.length > 0) out.push(modesTable(s));
  return out;
}
