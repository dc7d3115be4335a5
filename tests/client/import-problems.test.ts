/** The import page's problem summary: counts by table over every problem, errors first, the capped-list note. */
import { describe, expect, it } from 'vitest';
import type { ImportProblem } from '../../shared/schemas/imports.js';
import { cappedNote, countText, errorsFirst, problemsByTable } from '../../src/utils/importProblems.js';

const p = (severity: 'error' | 'warning', table: string, row?: number): ImportProblem => ({ severity, table, row, message: 'x' });

describe('import problems summary', () => {
  it('counts by table from problemCounts (every problem), tables with errors first', () => {
    const tables = problemsByTable({
      problems: [p('warning', 'materials', 2), p('error', 'nodes', 3)],
      problemCounts: [
        { table: 'materials', column: 'material', errors: 0, warnings: 4 },
        { table: 'nodes', column: 'x', errors: 1500, warnings: 0 },
        { table: 'nodes', column: 'y', errors: 20, warnings: 2 },
        { table: '', column: null, errors: 1, warnings: 0 },
      ],
    });
    expect(tables.map((t) => [t.label, t.errors, t.warnings])).toEqual([['nodes', 1520, 2], ['whole model', 1, 0], ['materials', 0, 4]]);
    expect(countText(1520, 2)).toBe('1,520 errors · 2 warnings');
  });

  it('counts from the list when the server sent no counts', () => {
    expect(problemsByTable({ problems: [p('error', 'members', 2), p('error', 'members', 3), p('warning', 'cases', 2)] }).map((t) => [t.table, t.errors, t.warnings]))
      .toEqual([['members', 2, 0], ['cases', 0, 1]]);
  });

  it('puts errors before warnings, keeping the reader order within each', () => {
    const list = errorsFirst([p('warning', 'a', 1), p('error', 'b', 5), p('warning', 'c', 2), p('error', 'd', 1)]);
    expect(list.map((x) => x.table)).toEqual(['b', 'd', 'a', 'c']);
  });

  it('says "showing 1,000 of N problems" only when the list was capped', () => {
    const problems = Array.from({ length: 1000 }, () => p('error', 'nodes'));
    expect(cappedNote({ problems, problemsTruncated: true, errorCount: 12000, warningCount: 345 })).toMatch(/^Showing 1,000 of 12,345 problems/);
    expect(cappedNote({ problems: problems.slice(0, 3), problemsTruncated: false, errorCount: 3, warningCount: 0 })).toBeNull();
  });
});
