import { describe, expect, it } from 'vitest';
import type { AnalysisResult, StationForces } from '../../../shared/engine/types.js';
import type { CheckRecord, MemberUtilisation } from '../../../shared/design/types.js';
import {
  checksTable, csvCell, displacementTable, formatExportNumber, memberForceTable, reactionTable, toCsv, utilisationTable,
} from '../../../shared/exports/index.js';
import type { Model } from '../../../shared/model/types.js';
import { readCsvFiles } from '../../../shared/reader/index.js';

function tinyModel(units: 'metric' | 'us'): Model {
  const r = readCsvFiles([
    { name: 'settings.csv', text: `key,value\nunits,${units}\n` },
    { name: 'nodes.csv', text: 'node,x [m],y [m]\nA,0,0\nB,5,0\n' },
    { name: 'supports.csv', text: 'node,type\nA,fixed\n' },
    { name: 'materials.csv', text: 'material,E [MPa]\nS,200000\n' },
    { name: 'sections.csv', text: 'section,shape,A [mm2],I_major [mm4]\nC,custom,1000,1e8\n' },
    { name: 'members.csv', text: 'member,start,end,section,material,group\nM,A,B,C,S,=cmd\n' },
    { name: 'cases.csv', text: 'case,category\nP,live\n' },
  ]);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.model;
}

/** A hand-made analysis result with known SI values. */
function fakeAnalysis(): AnalysisResult {
  const disp = new Float64Array(12);
  disp[6 + 1] = -0.0208333333333; // node B uy, m
  disp[6 + 5] = -0.00625; // node B rz, rad
  const reac = new Float64Array(12);
  reac[1] = 10000; // N
  reac[5] = 50000; // N·m
  const st = (vals: number[]) => Float64Array.from(vals);
  const forces: StationForces = {
    x: st([0, 2.5, 5]), N: st([0, 0, 0]), V_major: st([10000, 10000, 10000]), V_minor: st([0, 0, 0]), T: st([0, 0, 0]),
    M_major: st([-50000, -25000, 0]), M_minor: st([0, 0, 0]), d_major: st([0, 0.0065104, 0]), d_minor: st([0, 0, 0]),
  };
  return {
    nodeIds: ['A', 'B'], memberIds: ['M'],
    loadings: [
      { id: 'P', kind: 'case', limitState: null, terms: [{ caseIndex: 0, factor: 1 }] },
      { id: 'U', kind: 'combination', limitState: 'strength', terms: [{ caseIndex: 0, factor: 1.5 }] },
    ],
    displacements: () => disp, reactions: () => reac, supportedNodes: [0],
    memberForces: () => forces, memberLength: () => 5,
    diagnostics: { nodes: 2, members: 1, freedoms: 12, cases: 1, nnzK: 0, nnzFactor: 0, timings: {}, equilibrium: [] },
  };
}

describe('result tables', () => {
  it('heads every column with its unit in the metric system', () => {
    const m = tinyModel('metric');
    const a = fakeAnalysis();
    expect(displacementTable(m, a).header).toEqual(['loading', 'node', 'ux [mm]', 'uy [mm]', 'uz [mm]', 'rx [rad]', 'ry [rad]', 'rz [rad]']);
    expect(reactionTable(m, a).header).toEqual(['loading', 'node', 'fx [kN]', 'fy [kN]', 'fz [kN]', 'mx [kNm]', 'my [kNm]', 'mz [kNm]']);
    expect(memberForceTable(m, a).header).toEqual([
      'loading', 'member', 'x [m]', 'N [kN]', 'V_major [kN]', 'V_minor [kN]', 'T [kNm]', 'M_major [kNm]', 'M_minor [kNm]', 'd_major [mm]', 'd_minor [mm]',
    ]);
  });

  it('holds a row per loading and node, converted to mm and kN', () => {
    const m = tinyModel('metric');
    const a = fakeAnalysis();
    const d = displacementTable(m, a);
    expect(d.rows.map((r) => [r[0], r[1]])).toEqual([['P', 'A'], ['P', 'B'], ['U', 'A'], ['U', 'B']]);
    expect(d.rows[1][3]).toBeCloseTo(-20.8333333333, 9); // 1 m = 1000 mm
    const r = reactionTable(m, a);
    expect(r.rows).toHaveLength(2); // the supported node only, per loading
    expect(r.rows[0].slice(2)).toEqual([0, 10, 0, 0, 0, 50]);
    expect(memberForceTable(m, a).rows).toHaveLength(6); // 2 loadings × 3 stations
  });

  it('converts to in, kip and kip-ft in the us system', () => {
    const m = tinyModel('us');
    const a = fakeAnalysis();
    const f = memberForceTable(m, a);
    expect(f.header[2]).toBe('x [ft]');
    expect(f.header[7]).toBe('M_major [kip-ft]');
    // 1 kip·ft = 4448.2216152605 N × 0.3048 m (definitions of lbf and ft, NIST SP 811)
    expect(f.rows[0][7] as number).toBeCloseTo(-50000 / (4448.2216152605 * 0.3048), 9);
    expect(f.rows[1][2] as number).toBeCloseTo(2.5 / 0.3048, 9);
    const d = displacementTable(m, a);
    expect(d.header[3]).toBe('uy [in]');
    expect(d.rows[1][3] as number).toBeCloseTo(-0.0208333333333 / 0.0254, 9);
  });

  it('writes at least 6 significant digits', () => {
    const text = toCsv(displacementTable(tinyModel('metric'), fakeAnalysis()));
    expect(text.split('\r\n')[2]).toBe('P,B,0,-20.83333,0,0,0,-0.00625');
    expect(formatExportNumber(123456.789)).toBe('123456.8');
    expect(formatExportNumber(0.000123456789)).toBe('0.0001234568');
    expect(formatExportNumber(-0)).toBe('0');
  });

  it('builds the schedule and the detailed checks when design results exist', () => {
    const m = tinyModel('metric');
    const member: MemberUtilisation = {
      member: 'M', group: '=cmd', section: 'C', material: 'S', length: 5, ratio: 0.93, check: 'flexural buckling', clause: 'E3',
      combination: 'U', status: 'pass', families: { compression: 0.93, bending_major: 0.41 }, familyStatus: { compression: 'pass', bending_major: 'pass' }, warnings: [],
    };
    const record: CheckRecord = {
      member: 'M', family: 'compression', code: 'aisc360-lrfd', clause: 'E3', title: 'flexural buckling', equation: 'φc·Pn', inputs: [],
      capacity: 200000, demand: 186000, quantity: 'force', combination: 'U', x: 0, ratio: 0.93, status: 'pass',
    };
    const u = utilisationTable(m, { members: [member], records: [record] });
    expect(u.header).toEqual(['member', 'group', 'section', 'material', 'length [m]', 'ratio', 'check', 'clause', 'combination', 'status', 'compression', 'bending_major']);
    expect(u.rows[0]).toEqual(['M', '=cmd', 'C', 'S', 5, 0.93, 'flexural buckling', 'E3', 'U', 'pass', 0.93, 0.41]);
    const c = checksTable(m, { members: [member], records: [record] });
    expect(c.header.slice(0, 9)).toEqual(['member', 'combination', 'check', 'clause', 'demand', 'capacity', 'ratio', 'status', 'note']);
    expect(c.rows[0].slice(4, 6)).toEqual([186, 200]);
    expect(c.rows[0][9]).toBe('kN');
    expect(toCsv(u).split('\r\n')[1]).toBe("M,'=cmd,C,S,5,0.93,flexural buckling,E3,U,pass,0.93,0.41");
  });
});

describe('numerical noise in exports', () => {
  it('writes reactions and member forces below 1e-9 of the largest reaction force as 0 (shared/design/noise.ts), and keeps the rest', () => {
    const m = tinyModel('metric');
    const a = fakeAnalysis();
    const reac = new Float64Array(a.reactions(0));
    reac[0] = 5e-6; // fx at A: 5e-10 of the 10 kN reaction → noise
    reac[2] = 1e-3; // fz: 1e-7 of it → kept
    const f = a.memberForces(0, 0);
    const N = Float64Array.from([-2e-6, 0, 3]); // −2e-6 N is noise against 10 kN; 3 N is not
    const noisy = { ...a, reactions: () => reac, memberForces: () => ({ ...f, N }) } as typeof a;
    const r = reactionTable(m, noisy);
    expect(r.rows[0][2]).toBe(0);
    expect(r.rows[0][4]).toBeCloseTo(1e-6, 12); // kN
    expect(r.rows[0][3]).toBeCloseTo(10, 12);
    const mf = memberForceTable(m, noisy);
    expect(mf.rows.slice(0, 3).map((row) => row[3])).toEqual([0, 0, 0.003]);
  });
});

describe('CSV serialiser', () => {
  it('quotes commas, quotes and line breaks (RFC 4180)', () => {
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
    expect(csvCell('two\nlines')).toBe('"two\nlines"');
    expect(csvCell(null)).toBe('');
  });

  it('neutralises text a spreadsheet would run as a formula, never numbers', () => {
    expect(csvCell('=HYPERLINK("x")')).toBe('"\'=HYPERLINK(""x"")"');
    expect(csvCell('+1')).toBe("'+1");
    expect(csvCell('-M1')).toBe("'-M1");
    expect(csvCell('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(csvCell(-12.5)).toBe('-12.5');
  });

  it('ends lines with CRLF', () => {
    expect(toCsv({ name: 't', header: ['a', 'b'], rows: [[1, 'x']] })).toBe('a,b\r\n1,x\r\n');
  });
});
