import type { Problem, ProblemCount } from '../model/types.js';
import { canonicalName } from './names.js';

/** Problems kept in the list; beyond it they are only counted (a hostile file can hold millions). */
export const MAX_LISTED_PROBLEMS = 10_000;

/** Collects every problem found while reading; reading never stops at the first one. */
export class Problems {
  readonly list: Problem[] = [];
  private readonly byColumn = new Map<string, ProblemCount>();
  private errors = 0;
  private total = 0;
  /** columns whose header could not be used, by table (canonical names) */
  private readonly unusable = new Map<string, Set<string>>();
  /** problems not reported because they follow from an unusable header */
  suppressed = 0;

  constructor(readonly maxListed = MAX_LISTED_PROBLEMS) {}

  private add(p: Problem): void {
    if (p.column !== undefined && this.unusable.get(p.table)?.has(canonicalName(p.column))) {
      this.suppressed++;
      return;
    }
    this.total++;
    if (p.severity === 'error') this.errors++;
    const key = `${p.table}\u0000${p.column ?? ''}`;
    let c = this.byColumn.get(key);
    if (!c) this.byColumn.set(key, (c = { table: p.table, column: p.column ?? null, errors: 0, warnings: 0 }));
    if (p.severity === 'error') c.errors++;
    else c.warnings++;
    if (this.list.length < this.maxListed) this.list.push(p);
  }

  error(table: string, row: number | undefined, column: string | undefined, message: string): void {
    this.add({ severity: 'error', table, row, column, message });
  }

  warning(table: string, row: number | undefined, column: string | undefined, message: string): void {
    this.add({ severity: 'warning', table, row, column, message });
  }

  /**
   * The header of `column` in `table` was reported once and cannot be used (a unit of the
   * wrong kind, an unknown unit, a unit in round brackets): every later problem naming that
   * column follows from it (e.g. "material S1 has no fy" on every row) and is not reported.
   */
  markUnusable(table: string, column: string): void {
    let s = this.unusable.get(table);
    if (!s) this.unusable.set(table, (s = new Set()));
    s.add(canonicalName(column));
  }

  isUnusable(table: string, column: string): boolean {
    return this.unusable.get(table)?.has(canonicalName(column)) ?? false;
  }

  get hasErrors(): boolean {
    return this.errors > 0;
  }

  errorCount(): number {
    return this.errors;
  }

  /** true when the list holds only the first `maxListed` problems */
  get truncated(): boolean {
    return this.total > this.list.length;
  }

  /** Every problem counted by table and column, in order of first appearance. */
  counts(): ProblemCount[] {
    return [...this.byColumn.values()].map((c) => ({ ...c }));
  }
}

/** `table row column: message` — how the batch command and logs print a problem. */
export function formatProblem(p: Problem): string {
  const where = [p.table || '(model)', p.row !== undefined ? String(p.row) : '', p.column ?? ''].filter(Boolean).join(' ');
  return `${where}: ${p.severity === 'warning' ? 'warning: ' : ''}${p.message}`;
}
