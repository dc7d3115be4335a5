/**
 * Cell renderer of the governing ratio: the number over a bar coloured by band. A plain DOM
 * function rather than a Vue component, so 50 000 rows scroll without mounting components.
 */
import type { ICellRendererParams } from 'ag-grid-community';
import { BAND_COLORS, barWidth, formatRatio, ratioBand } from '../utils/ratioBand.js';
import type { GridRow } from '../utils/resultsRows.js';

export function ratioBarCell(params: ICellRendererParams<GridRow, number | null>): HTMLElement {
  const row = params.data;
  const ratio = params.value ?? null;
  const status = row && row.status !== 'not run' ? row.status : 'not checked';
  const band = ratioBand(ratio, status);
  const el = document.createElement('div');
  el.className = `ratio-cell ratio-${band}`;
  el.dataset.test = 'ratio-cell';
  const bar = document.createElement('span');
  bar.className = 'ratio-bar';
  bar.style.width = `${barWidth(ratio)}%`;
  bar.style.background = BAND_COLORS[band];
  const mark = document.createElement('span');
  mark.className = 'ratio-limit';
  const text = document.createElement('span');
  text.className = 'ratio-text';
  text.textContent = formatRatio(ratio);
  el.append(bar, mark, text);
  return el;
}
