/**
 * The import preview's problems as the page shows them: counts by table (every problem, also
 * those beyond the listed first 1,000), errors first, and the "showing 1,000 of N" line.
 */
import type { ImportPreview, ImportProblem } from '../../shared/schemas/imports.js';

export interface TableProblems {
  /** table name as the reader reports it ('' = the model or file as a whole) */
  table: string;
  label: string;
  errors: number;
  warnings: number;
}

/** Label of a table in the summary: the model as a whole has no table. */
export function tableLabel(table: string): string {
  return table === '' ? 'whole model' : table;
}

/** Counts by table from `problemCounts` (all problems) or the list; tables with errors first, then by number. */
export function problemsByTable(preview: Pick<ImportPreview, 'problems' | 'problemCounts'>): TableProblems[] {
  const byTable = new Map<string, TableProblems>();
  const source = preview.problemCounts ?? preview.problems.map((p) => ({ table: p.table, errors: p.severity === 'error' ? 1 : 0, warnings: p.severity === 'warning' ? 1 : 0 }));
  for (const c of source) {
    let t = byTable.get(c.table);
    if (!t) byTable.set(c.table, (t = { table: c.table, label: tableLabel(c.table), errors: 0, warnings: 0 }));
    t.errors += c.errors;
    t.warnings += c.warnings;
  }
  return [...byTable.values()].sort((a, b) => Number(b.errors > 0) - Number(a.errors > 0) || b.errors - a.errors || b.warnings - a.warnings);
}

/** Errors before warnings; within each, the order the reader gave (table, row). */
export function errorsFirst(problems: readonly ImportProblem[]): ImportProblem[] {
  return [...problems.filter((p) => p.severity === 'error'), ...problems.filter((p) => p.severity !== 'error')];
}

/** "Showing 1,000 of 12,345 problems" when the list was capped, else null. */
export function cappedNote(preview: Pick<ImportPreview, 'problems' | 'problemsTruncated' | 'errorCount' | 'warningCount'>): string | null {
  const total = preview.errorCount + preview.warningCount;
  if (!preview.problemsTruncated || total <= preview.problems.length) return null;
  const n = (x: number) => x.toLocaleString('en');
  return `Showing ${n(preview.problems.length)} of ${n(total)} problems (errors first); the counts by table include every one.`;
}

/** "3 errors · 1 warning" */
export function countText(errors: number, warnings: number): string {
  const parts: string[] = [];
  if (errors) parts.push(`${errors.toLocaleString('en')} error${errors === 1 ? '' : 's'}`);
  if (warnings) parts.push(`${warnings.toLocaleString('en')} warning${warnings === 1 ? '' : 's'}`);
  return parts.join(' · ') || 'no problems';
}
