import type { Problem, ProblemCount } from '../model/types.js';

/** Problems kept in the list; beyond it they are only counted (a hostile file can hold millions). */
export const MAX_LISTED_PROBLEMS = 10_000;

/** Collects every problem found while reading; reading never stops at the first one. */
export class Problems {
  readonly list: Problem[] = [];
  private readonly byColumn = new Map<string, ProblemCount>();
  private errors = 0;
  private total = 0;

  constructor(readonly maxListed = MAX_LISTED_PROBLEMS) {}

  private add(p: Problem): void {
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
