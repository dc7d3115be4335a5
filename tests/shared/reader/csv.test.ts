import { describe, expect, it } from 'vitest';
import { csvTable, detectDelimiter, tableNameOfFile } from '../../../shared/reader/csv.js';
import { read } from './helpers.js';

describe('CSV row source', () => {
  it('takes the table name from the file name, paths and case aside', () => {
    expect(tableNameOfFile('model/Node_Loads.CSV')).toBe('Node_Loads');
    expect(tableNameOfFile('C:\\work\\members.csv')).toBe('members');
  });

  it('detects comma and semicolon separators from the header', () => {
    expect(detectDelimiter('node;x;y\n1;0;0')).toBe(';');
    expect(detectDelimiter('node,x,y\n1;0;0')).toBe(',');
    expect(detectDelimiter('"a;b",c\n')).toBe(',');
  });

  it('drops a UTF-8 byte-order mark so the first column name still matches', () => {
    const t = csvTable({ name: 'nodes.csv', text: '\uFEFFnode,x,y\nN1,0,0\n' });
    expect(t.rows[0][0]).toBe('node');
  });

  it('numbers rows by file line, counting line breaks inside quoted fields', () => {
    const t = csvTable({ name: 'cases.csv', text: 'case,title\nD,"two\nlines"\nW,wind\n' });
    expect(t.rowNumbers!.slice(0, 3)).toEqual([1, 2, 4]);
  });

  it('reads a semicolon file with decimal commas, but not a comma file', () => {
    const semi = read({ nodes: 'node;x;y\nN1;0;0\nN2;0;4,25\nN3;6;4,25\nN4;6;0\n' });
    expect(semi.ok && semi.model.nodes[1].y).toBe(4.25);
    const comma = read({ nodes: 'node,x,y\nN1,0,0\nN2,0,"4,25"\nN3,6,4\nN4,6,0\n' });
    expect(comma.ok).toBe(false);
    if (!comma.ok) expect(comma.problems[0]).toMatchObject({ table: 'nodes', row: 3, column: 'y' });
  });
});
