/** trestle analyse / check with modes and buckling_modes: stability.csv and modes.csv with the columns of tables.md. */
import { mkdtempSync, readFileSync, readdirSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { folder, run } from './cli-helpers.js';

/** A fixed-base portal frame of our own (invented numbers: demo data), Y up, 6 m × 4 m. */
const PORTAL: Record<string, string> = {
  settings: 'key,value\ntitle,Stability portal\nunits,metric\ndesign_code,none\n',
  materials: 'material,E [MPa],nu,fy [MPa],fu [MPa],density [kg/m3]\nS355,210000,0.3,355,490,7850\n',
  sections: 'section,shape,d [mm],bf [mm],tf [mm],tw [mm]\nCOL,i,200,200,15,9\nBM,i,300,150,10.7,7.1\n',
  nodes: 'node,x [m],y [m]\nA,0,0\nB,0,4\nC,6,4\nD,6,0\n',
  supports: 'node,ux,uy,rz\nA,1,1,1\nD,1,1,1\n',
  members: 'member,start,end,section,material\nC1,A,B,COL,S355\nB1,B,C,BM,S355\nC2,D,C,COL,S355\n',
  cases: 'case,category,self_weight,mass\nG,dead,1,yes\nW,wind,0,no\n',
  member_loads: 'case,member,kind,direction,w1\nG,B1,uniform,global_y,-20\n',
  node_loads: 'case,node,fx [kN]\nW,B,10\n',
  combinations: 'combination,case,factor,limit_state\nULS-1,G,1.35,strength\nULS-1,W,1.5,strength\nULS-2,G,1.35,strength\n',
};



const lines = (file: string) => readFileSync(file, 'utf8').trim().split('\r\n');

describe('trestle with modes and buckling_modes', () => {
  it('writes stability.csv and modes.csv with exactly the columns of tables.md', async () => {
    const input = folder({ ...PORTAL, settings: PORTAL.settings + 'modes,3\nbuckling_modes,2\n' });
    const outDir = join(mkdtempSync(join(tmpdir(), 'trestle-out-')), 'results');
    const r = await run(['analyse', input, '--out', outDir]);
    expect(r.code, r.err.join('\n')).toBe(0);
    expect(readdirSync(outDir).sort()).toEqual(['displacements.csv', 'member_forces.csv', 'modes.csv', 'reactions.csv', 'stability.csv']);
    const stab = lines(join(outDir, 'stability.csv'));
    expect(stab[0]).toBe('loading,mode,alpha_cr');
    // two αcr for each strength combination, ascending within a loading
    expect(stab.slice(1).map((l) => l.split(',').slice(0, 2).join(','))).toEqual(['ULS-1,1', 'ULS-1,2', 'ULS-2,1', 'ULS-2,2']);
    const a = stab.slice(1).map((l) => Number(l.split(',')[2]));
    expect(a[0]).toBeLessThanOrEqual(a[1]);
    expect(a.every((v) => Number.isFinite(v) && v > 0)).toBe(true);
    const modes = lines(join(outDir, 'modes.csv'));
    expect(modes[0]).toBe('mode,frequency [Hz],period [s],mass_x,mass_y,mass_z');
    expect(modes.slice(1).map((l) => l.split(',')[0])).toEqual(['1', '2', '3']);
    for (const row of modes.slice(1)) {
      const [, f, T] = row.split(',').map(Number);
      // period = 1 / frequency (definition); CSV keeps 7 significant digits
      expect(Math.abs(f * T - 1)).toBeLessThan(1e-6);
    }
    expect(r.out.some((l) => /^analysis: first-order/.test(l))).toBe(true);
  });

  it('writes neither file when the settings ask for neither', async () => {
    const outDir = join(mkdtempSync(join(tmpdir(), 'trestle-out-')), 'results');
    const r = await run(['analyse', folder(PORTAL), '--out', outDir]);
    expect(r.code).toBe(0);
    expect(readdirSync(outDir).sort()).toEqual(['displacements.csv', 'member_forces.csv', 'reactions.csv']);
  });

  it('writes modes.csv with check too, and stops with the loading and its αcr when second order is not stable (exit 2)', async () => {
    const ok = join(mkdtempSync(join(tmpdir(), 'trestle-out-')), 'results');
    const r = await run(['check', folder({ ...PORTAL, settings: PORTAL.settings + 'modes,2\n' }), '--out', ok]);
    expect(r.code, r.err.join('\n')).toBe(0);
    expect(readdirSync(ok)).toContain('modes.csv');
    expect(readdirSync(ok)).not.toContain('stability.csv');

    const heavy = folder({ ...PORTAL, settings: PORTAL.settings + 'analysis,second_order\n', member_loads: 'case,member,kind,direction,w1\nG,B1,uniform,global_y,-5000\n' });
    const outDir = join(mkdtempSync(join(tmpdir(), 'trestle-out-')), 'results');
    const bad = await run(['analyse', heavy, '--out', outDir]);
    expect(bad.code).toBe(2);
    expect(bad.err[0]).toMatch(/^unstable at this load level: combination ULS-\d is not stable at this load level: αcr [=≈] \d/);
    expect(existsSync(outDir)).toBe(false);
  });
});
