/** Hostile CSV input at the reader (issue 12): one error for an unclosed quote, UTF-16 by its BOM, problems listed up to a cap and all counted. */
import { describe, expect, it } from 'vitest';
import { readCsvBytes } from '../../../shared/reader/csv.js';
import { MAX_LISTED_PROBLEMS } from '../../../shared/reader/problems.js';
import { BASE, read } from './helpers.js';

const files = (overrides: Record<string, Uint8Array> = {}) =>
  Object.entries(BASE).map(([name, text]) => ({ name: `${name}.csv`, data: overrides[name] ?? new TextEncoder().encode(text) }));

describe('CSV reader refusals', () => {
  it('gives one error at the row where an unclosed quote opens', () => {
    const r = read({ members: 'member,start,end,section,material\nM1,N1,N2,C1,STEEL\nM2,N2,"N3,C1,STEEL\nM3,N3,N4,C1,STEEL\n' });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems).toEqual([
      {
        severity: 'error',
        table: 'members',
        row: 3,
        column: 'end',
        message: 'a quote (") opens here and is never closed, so the rest of members.csv cannot be read: close the quote or remove it',
      },
    ]);
  });

  it('reads UTF-16 LE and BE with their byte-order mark', () => {
    const le = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(BASE.nodes, 'utf16le')]);
    const be = Buffer.from(le).swap16();
    for (const data of [le, be]) {
      const r = readCsvBytes(files({ nodes: new Uint8Array(data) }));
      expect(r.ok).toBe(true);
      if (r.ok) expect(r.model.nodes.map((n) => n.id)).toEqual(['N1', 'N2', 'N3', 'N4']);
    }
  });

  it('refuses by name a UTF-16 file without its byte-order mark', () => {
    const r = readCsvBytes(files({ nodes: new Uint8Array(Buffer.from(BASE.nodes, 'utf16le')) }));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems).toEqual([{ severity: 'error', table: 'nodes', message: expect.stringMatching(/^nodes\.csv is not UTF-8 text/) }]);
  });

  it('refuses ids longer than 64 characters and ids holding control or bidirectional characters, by table, row and column', () => {
    const r = read({ nodes: `node,x,y\nN1,0,0\nN2,0,4\nN3,6,4\nN4,6,0\n${'N'.repeat(65)},1,1\nN\u0007,2,2\nN\u2066x,3,3\n` });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const ids = r.problems.filter((p) => p.column === 'node');
    expect(ids).toEqual([
      { severity: 'error', table: 'nodes', row: 6, column: 'node', message: 'node is 65 characters long; ids are at most 64' },
      { severity: 'error', table: 'nodes', row: 7, column: 'node', message: 'node holds a control or text-direction character (U+0007); ids are plain text' },
      { severity: 'error', table: 'nodes', row: 8, column: 'node', message: 'node holds a control or text-direction character (U+2066); ids are plain text' },
    ]);
  });

  it(`lists the first ${MAX_LISTED_PROBLEMS.toLocaleString('en')} problems and counts every one by table and column`, () => {
    const rows = Array.from({ length: 12_000 }, (_, i) => `X${i},a,b`).join('\n');
    const r = read({ nodes: `node,x,y\n${rows}\n` });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems).toHaveLength(MAX_LISTED_PROBLEMS);
    expect(r.problemCounts).toContainEqual({ table: 'nodes', column: 'x', errors: 12_000, warnings: 0 });
    expect(r.problemCounts).toContainEqual({ table: 'nodes', column: 'y', errors: 12_000, warnings: 0 });
  }, 60_000);
});
