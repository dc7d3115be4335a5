import type { Problem } from '../model/types.js';

/** Collects every problem found while reading; reading never stops at the first one. */
export class Problems {
  readonly list: Problem[] = [];

  error(table: string, row: number | undefined, column: string | undefined, message: string): void {
    this.list.push({ severity: 'error', table, row, column, message });
  }

  warning(table: string, row: number | undefined, column: string | undefined, message: string): void {
    this.list.push({ severity: 'warning', table, row, column, message });
  }

  get hasErrors(): boolean {
    return this.list.some((p) => p.severity === 'error');
  }

  errorCount(): number {
    return this.list.filter((p) => p.severity === 'error').length;
  }
}

/** `table row column: message` — how the batch command and logs print a problem. */
export function formatProblem(p: Problem): string {
  const where = [p.table || '(model)', p.row !== undefined ? String(p.row) : '', p.column ?? ''].filter(Boolean).join(' ');
  return `${where}: ${p.severity === 'warning' ? 'warning: ' : ''}${p.message}`;
}
