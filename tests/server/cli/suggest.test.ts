/** `trestle suggest`: suggestions.csv from a folder of CSVs. */
import { mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { folder, run } from './cli-helpers.js';

/** Simply supported IPE beam, L = 6 m, S235, continuously braced, w = 22 kN/m (as tests/shared/design/suggest). */
const BEAM: Record<string, string> = {
  settings: 'key,value\ntitle,Beam\nunits,metric\ndesign_code,en1993-1-1\ngamma_m0,1.0\n',
  nodes: 'node,x,y\nA,0,0\nB,6,0\n',
  supports: 'node,ux,uy\nA,1,1\nB,0,1\n',
  members: 'member,start,end,section,material,lb\nM1,A,B,IPE330,S235,0\n',
  cases: 'case,category,self_weight\nD,dead,0\n',
  member_loads: 'case,member,kind,direction,w1\nD,M1,uniform,global_y,-22\n',
};



const rows = (file: string) => Papa.parse<string[]>(readFileSync(file, 'utf8').trim()).data;

describe('trestle suggest', () => {
  it('writes suggestions.csv with the lightest passing IPE (IPE270: 99 kNm / (484.0 cm³ · 235 MPa) = 0.870, EN 1993-1-1 6.2.5)', async () => {
    const out = join(mkdtempSync(join(tmpdir(), 'trestle-suggest-out-')), 'r');
    const r = await run(['suggest', folder(BEAM), '--out', out]);
    expect(r.err).toEqual([]);
    expect(r.code).toBe(0);
    expect(readdirSync(out)).toEqual(['suggestions.csv']);
    const t = rows(join(out, 'suggestions.csv'));
    expect(t[0]).toEqual(['for', 'name', 'members', 'current', 'current_ratio', 'proposed', 'proposed_ratio', 'governing',
      'mass_per_length_now [kg/m]', 'mass_per_length_proposed [kg/m]', 'mass_change [kg]', 'reason']);
    expect(t[1].slice(0, 6)).toEqual(['member', 'M1', 'M1', 'IPE330', expect.any(String), 'IPE270']);
    // M = wL²/8 = 99 kNm (closed form); M_c,Rd = Wpl·fy/γM0 = 484.0e-6·235e6 = 113.74 kNm (EN 1993-1-1 6.2.5, Wpl from memory)
    expect(Number(t[1][6])).toBeCloseTo(0.870, 3);
    // (45.9 − 62.6) cm² · 7850 kg/m³ · 6 m = −78.7 kg (A from EN 10365 tables, from memory)
    expect(Number(t[1][10])).toBeCloseTo(-78.7, 1);
    expect(r.out.join('\n')).toMatch(/competent engineer/);
  });

  it('--by group --repeat on the portal-frame sample states the passes and keeps one section per group', async () => {
    const out = join(mkdtempSync(join(tmpdir(), 'trestle-suggest-out-')), 'r');
    const r = await run(['suggest', join(__dirname, '../../../samples/portal-frame-building/csv'), '--out', out, '--by', 'group', '--repeat']);
    expect(r.code).toBe(0);
    expect(r.out[0]).toMatch(/\d+ analysis pass(es)?, stable/);
    const t = rows(join(out, 'suggestions.csv'));
    expect(t.slice(1).map((row) => row[0])).toEqual(['group', 'group', 'group']);
    for (const row of t.slice(1)) if (row[6]) expect(Number(row[6])).toBeLessThanOrEqual(1);
  });

  it('refuses bad options and writes nothing (exit 1)', async () => {
    const out = join(mkdtempSync(join(tmpdir(), 'trestle-suggest-out-')), 'r');
    const r = await run(['suggest', folder(BEAM), '--out', out, '--target', '1.5']);
    expect(r.code).toBe(1);
    expect(r.err[0]).toMatch(/--target/);
    const none = await run(['suggest', folder({ ...BEAM, settings: 'key,value\ndesign_code,none\n' }), '--out', out]);
    expect(none.code).toBe(1);
    expect(none.err.join('\n')).toMatch(/design_code/);
  });
});
