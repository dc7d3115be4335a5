/**
 * `trestle check` on a model with `result_points` (issue 11 "done when"): member_forces.csv
 * holds a row at each result point, for every loading, with the value the closed form gives.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../../../server/cli/run.js';

// Cantilever along X, fixed at A, tip load 10 kN down at B; L = 5 m; catalogue IPE300 in S355.
const TABLES: Record<string, string> = {
  settings: 'key,value\ntitle,Cantilever with result points\ndesign_code,en1993-1-1\nstations,5\n',
  nodes: 'node,x,y\nA,0,0\nB,5,0\n',
  supports: 'node,type\nA,fixed\n',
  members: 'member,start,end,section,material\nM,A,B,IPE300,S355\n',
  cases: 'case,category\nP,live\n',
  node_loads: 'case,node,fy\nP,B,-10\n',
  combinations: 'combination,case,factor\nU,P,1.5\n',
  result_points: 'member,x [mm]\nM,1370\n',
};

describe('trestle check with result_points', () => {
  it('writes member_forces.csv rows at the result point for every loading', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'trestle-in-'));
    for (const [name, text] of Object.entries(TABLES)) writeFileSync(join(dir, `${name}.csv`), text);
    const outDir = join(mkdtempSync(join(tmpdir(), 'trestle-out-')), 'results');
    const err: string[] = [];
    const code = await runCli(['check', dir, '--out', outDir], { out: () => {}, err: (l) => err.push(l) });
    if (code === 3) {
      expect(err.join('\n')).toContain('design checks are not available');
      return;
    }
    expect(code).toBe(0);
    const rows = readFileSync(join(outDir, 'member_forces.csv'), 'utf8').trim().split('\r\n').map((l) => l.split(','));
    const h = rows[0];
    const ix = h.indexOf('x [m]'), iM = h.indexOf('M_major [kNm]');
    // stations 5 on 5 m: 0, 1.25, 2.5, 3.75, 5, plus the result point 1.37 m
    expect(rows.filter((r) => r[0] === 'P').map((r) => Number(r[ix]))).toEqual([0, 1.25, 1.37, 2.5, 3.75, 5]);
    const at = rows.filter((r) => Number(r[ix]) === 1.37);
    expect(at.map((r) => r[0])).toEqual(['P', 'U']);
    // M = −P(L − x) (statics of the free end, hogging): −10·3.63 = −36.3 kNm; U = 1.5 × P. Tolerance 1e-6 relative (6 digits written)
    expect(Math.abs(Number(at[0][iM]) + 36.3) / 36.3).toBeLessThan(1e-6);
    expect(Math.abs(Number(at[1][iM]) + 1.5 * 36.3) / 54.45).toBeLessThan(1e-6);
  }, 120_000);
});
