import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { folder, run } from './cli-helpers.js';

const GOOD: Record<string, string> = {
  settings: 'key,value\ntitle,Cantilever\n',
  nodes: 'node,x,y\nA,0,0\nB,5,0\n',
  supports: 'node,type\nA,fixed\n',
  materials: 'material,E\nS,200000\n',
  sections: 'section,shape,A,I_major,I_minor,J\nC,custom,1000,1e8,1e7,1e6\n',
  members: 'member,start,end,section,material\nM,A,B,C,S\n',
  cases: 'case,category\nP,live\n',
  node_loads: 'case,node,fy\nP,B,-10\n',
  combinations: 'combination,case,factor\nU,P,1.5\n',
};



function parseCsv(text: string): string[][] {
  return text.trim().split('\r\n').map((l) => l.split(','));
}

describe('trestle analyse', () => {
  it('writes the three result files with a row per case and combination (exit 0)', async () => {
    const outDir = join(mkdtempSync(join(tmpdir(), 'trestle-out-')), 'results');
    const r = await run(['analyse', folder(GOOD), '--out', outDir]);
    expect(r.code).toBe(0);
    expect(readdirSync(outDir).sort()).toEqual(['displacements.csv', 'member_forces.csv', 'reactions.csv']);
    const d = parseCsv(readFileSync(join(outDir, 'displacements.csv'), 'utf8'));
    expect(d[0]).toEqual(['loading', 'node', 'ux [mm]', 'uy [mm]', 'uz [mm]', 'rx [rad]', 'ry [rad]', 'rz [rad]']);
    expect(d.slice(1).map((row) => row[0])).toEqual(['P', 'P', 'U', 'U']);
    // cantilever tip deflection P·L³/(3·E·I) = 10e3·125/(3·200e9·1e-4) m = 20.8333 mm (closed form); tolerance 1e-6 relative
    const tip = Number(d[2][3]);
    expect(Math.abs(tip + 20.8333333) / 20.8333333).toBeLessThan(1e-6);
    expect(Math.abs(Number(d[4][3]) + 1.5 * 20.8333333) / 31.25).toBeLessThan(1e-6);
    const reac = parseCsv(readFileSync(join(outDir, 'reactions.csv'), 'utf8'));
    // fixed-end reaction: fy = P = 10 kN, mz = P·L = 50 kNm (statics)
    expect(reac[1].slice(0, 2).concat([reac[1][3], reac[1][7]])).toEqual(['P', 'A', '10', '50']);
    const f = parseCsv(readFileSync(join(outDir, 'member_forces.csv'), 'utf8'));
    expect(f[0].slice(0, 3)).toEqual(['loading', 'member', 'x [m]']);
    expect(new Set(f.slice(1).map((row) => row[0]))).toEqual(new Set(['P', 'U']));
  });

  it('reads an XLSX workbook as input', async () => {
    const wb = new ExcelJS.Workbook();
    for (const [name, text] of Object.entries(GOOD)) {
      const ws = wb.addWorksheet(name);
      for (const line of text.trim().split('\n')) ws.addRow(line.split(',').map((c) => (c !== '' && !Number.isNaN(Number(c)) ? Number(c) : c)));
    }
    const dir = mkdtempSync(join(tmpdir(), 'trestle-x-'));
    const file = join(dir, 'cantilever.xlsx');
    writeFileSync(file, Buffer.from(await wb.xlsx.writeBuffer()));
    const r = await run(['analyse', file, '--out', join(dir, 'out')]);
    expect(r.code).toBe(0);
    expect(existsSync(join(dir, 'out', 'member_forces.csv'))).toBe(true);
  });

  it('prints each problem as table row column: message and writes nothing (exit 1)', async () => {
    const outDir = join(mkdtempSync(join(tmpdir(), 'trestle-out-')), 'results');
    const r = await run(['analyse', folder({ ...GOOD, members: 'member,start,end,section,material\nM,A,Q,C,S\n', nodes: 'node,x,y\nA,0,0\nB,five,0\n' }), '--out', outDir]);
    expect(r.code).toBe(1);
    expect(r.err).toContain('members 2 end: unknown node Q');
    expect(r.err).toContain('nodes 3 x: "five" is not a number');
    expect(existsSync(outDir)).toBe(false);
  });

  it('names the node and freedom of an unstable model and writes nothing (exit 2)', async () => {
    const outDir = join(mkdtempSync(join(tmpdir(), 'trestle-out-')), 'results');
    const r = await run(['analyse', folder({ ...GOOD, supports: 'node,type\nA,pinned\n' }), '--out', outDir]);
    expect(r.code).toBe(2);
    expect(r.err.join('\n')).toMatch(/node [AB] freedom r[xyz]/);
    expect(existsSync(outDir)).toBe(false);
  });

  it('refuses a missing input or --out with a usage message (exit 1)', async () => {
    expect((await run(['analyse', '/nonexistent/model.xlsx', '--out', '/tmp/x'])).code).toBe(1);
    const r = await run(['analyse', folder(GOOD)]);
    expect(r.code).toBe(1);
    expect(r.err[0]).toContain('--out');
    expect((await run(['explode'])).code).toBe(1);
  });

  it('exits 0, 1 and 2 as a process', () => {
    const root = join(import.meta.dirname, '..', '..', '..');
    const base = mkdtempSync(join(tmpdir(), 'trestle-proc-'));
    const cli = (input: string) => spawnSync(process.execPath, ['--import', 'tsx', join(root, 'server/cli/trestle.ts'), 'analyse', input, '--out', join(base, 'out')], { cwd: root, encoding: 'utf8' });
    const bad = folder({ ...GOOD, cases: 'case,category\nP,weather\n' });
    const unstable = folder({ ...GOOD, supports: 'node,type\nA,pinned\n' });
    const ok = folder(GOOD);
    const rBad = cli(bad);
    expect(rBad.status).toBe(1);
    expect(rBad.stderr).toContain('cases 2 category: "weather" is not one of');
    const rUnstable = cli(unstable);
    expect(rUnstable.status).toBe(2);
    expect(existsSync(join(base, 'out'))).toBe(false);
    expect(cli(ok).status).toBe(0);
    expect(existsSync(join(base, 'out', 'reactions.csv'))).toBe(true);
  }, 180000);
});

describe('trestle check', () => {
  it('writes the utilisation and checks files besides the analysis results, or says why it cannot', async () => {
    const outDir = join(mkdtempSync(join(tmpdir(), 'trestle-out-')), 'results');
    const r = await run(['check', folder(GOOD), '--out', outDir]);
    if (r.code === 3) {
      expect(r.err.join('\n')).toContain('design checks are not available');
      return;
    }
    expect(r.code).toBe(0);
    expect(readdirSync(outDir).sort()).toEqual(['checks.csv', 'displacements.csv', 'member_forces.csv', 'reactions.csv', 'utilisation.csv']);
    const u = parseCsv(readFileSync(join(outDir, 'utilisation.csv'), 'utf8'));
    expect(u[0].slice(0, 10)).toEqual(['member', 'group', 'section', 'material', 'length [m]', 'ratio', 'check', 'clause', 'combination', 'status']);
  });
});

describe('trestle check on a sample', () => {
  it('writes a schedule row per member with the status words of the contract', async () => {
    const root = join(import.meta.dirname, '..', '..', '..');
    const outDir = join(mkdtempSync(join(tmpdir(), 'trestle-out-')), 'portal');
    const r = await run(['check', join(root, 'samples', 'portal-frame-building', 'portal-frame-building.xlsx'), '--out', outDir]);
    if (r.code === 3) return; // design checks not in this build
    expect(r.code).toBe(0);
    const u = parseCsv(readFileSync(join(outDir, 'utilisation.csv'), 'utf8'));
    expect(u[0][4]).toBe('length [ft]');
    expect(u).toHaveLength(1 + 7);
    for (const row of u.slice(1)) expect(['pass', 'fail', 'not checked']).toContain(row[9]);
    const c = readFileSync(join(outDir, 'checks.csv'), 'utf8').split('\r\n');
    expect(c[0]).toBe('member,combination,check,clause,demand,capacity,ratio,status,note,unit,details');
    expect(c.length).toBeGreaterThan(8);
  });
});
