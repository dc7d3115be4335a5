/**
 * The Model tab's rows: a table as loaded with the pending edits laid over it (changed cells,
 * added rows, deleted rows), numbered as the edits and the reader's problems number them.
 * Pure helpers, tested without mounting.
 */
import type { ModelTable, TableCell, TableEdit, TableProblem } from '../../../shared/schemas/models.js';
import { formatNumber } from '../../../shared/units/index.js';

export interface TableGridRow {
  /** row number as edits and problems name it (1 = first row of the table) */
  row: number;
  added: boolean;
  /** names of the columns changed by a pending edit */
  changed: string[];
  cells: TableCell[];
}

/** The rows of a table with the pending edits (in order) applied. */
export function shownRows(table: ModelTable, edits: readonly TableEdit[]): TableGridRow[] {
  const rows: TableGridRow[] = table.rows.map((r) => ({ row: r.row, added: false, changed: [], cells: r.cells.slice() }));
  let next = table.rows.reduce((n, r) => Math.max(n, r.row), 0) + 1;
  const index = (name: string) => table.columns.findIndex((c) => c.name === name);
  for (const e of edits) {
    if (e.table !== table.name) continue;
    if (e.action === 'add') {
      const cells: TableCell[] = table.columns.map(() => null);
      for (const [k, v] of Object.entries(e.values)) if (index(k) >= 0) cells[index(k)] = v;
      rows.push({ row: next++, added: true, changed: [], cells });
      continue;
    }
    const at = rows.findIndex((r) => r.row === e.row);
    if (at < 0) continue;
    if (e.action === 'delete') rows.splice(at, 1);
    else if (index(e.column) >= 0) {
      const r = rows[at];
      r.cells[index(e.column)] = e.value;
      if (!r.changed.includes(e.column)) r.changed.push(e.column);
    }
  }
  return rows;
}

function same(a: TableCell, b: TableCell): boolean {
  const norm = (v: TableCell) => (v === null || v === undefined ? '' : String(v).trim());
  return norm(a) === norm(b);
}

/**
 * The pending edits with one more: a second change of the same cell replaces the first, and a
 * change back to the loaded value drops it.
 */
export function withEdit(table: ModelTable, edits: readonly TableEdit[], edit: TableEdit): TableEdit[] {
  if (edit.action !== 'change') return [...edits, edit];
  const rest = edits.filter((e) => !(e.action === 'change' && e.table === edit.table && e.row === edit.row && e.column === edit.column));
  const original = table.rows.find((r) => r.row === edit.row);
  const col = table.columns.findIndex((c) => c.name === edit.column);
  if (original && col >= 0 && same(original.cells[col], edit.value)) return rest;
  return [...rest, edit];
}

/** `table:row:column` → message, for painting cells; a problem without a column marks the row. */
export function problemIndex(problems: readonly TableProblem[]): Map<string, string> {
  const out = new Map<string, string>();
  for (const p of problems) {
    const key = `${p.table}:${p.row ?? ''}:${p.column ?? ''}`;
    out.set(key, out.has(key) ? `${out.get(key)}; ${p.message}` : p.message);
  }
  return out;
}

/** A cell as the grid shows it: numbers to 6 significant digits, blanks empty. */
export function shownCell(value: TableCell): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return formatNumber(value);
  return value;
}

/** Problems counted by table, for the table chooser. */
export function problemCounts(problems: readonly TableProblem[]): Record<string, number> {
  const out: Record<string, number> = {};
  for (const p of problems) out[p.table] = (out[p.table] ?? 0) + 1;
  return out;
}
