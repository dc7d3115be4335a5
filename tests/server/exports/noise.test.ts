/**
 * Floating-point noise in exports is written as 0 (issue 13): below NOISE_RELATIVE = 1e-9 of
 * the largest value of its kind in the same loading (shared/design/noise.ts; the threshold is
 * common practice for double precision results, not a code rule).
 */
import { describe, expect, it } from 'vitest';
import type { Model } from '../../../shared/model/types.js';
import type { ResultTable } from '../../../shared/exports/index.js';
import { cleanTableNoise, columnKind } from '../../../server/exports/noise.js';
import { streamTable, type ExportTask } from '../../../server/exports/export-task.js';

const displacements = (): ResultTable => ({
  name: 'displacements',
  header: ['loading', 'node', 'ux [mm]', 'uy [mm]', 'uz [mm]', 'rx [rad]', 'ry [rad]', 'rz [rad]'],
  rows: [
    ['D', 'N1', 12.5, -3.2e-15, 0, 1e-3, 4e-17, -0],
    ['D', 'N2', -7.25, 2.0, 1.1e-12, -2e-3, 0, 0],
    // a small loading that is real: its values are judged against its own largest, not D's
    ['W', 'N1', 3e-6, 1e-6, 0, 2e-9, 0, 0],
    ['W', 'N2', -4e-6, 5e-16, 0, 0, 0, 0],
  ],
});

describe('export noise', () => {
  it('tells the kind of a column from its header', () => {
    expect(columnKind('ux [mm]')).toBe('translation');
    expect(columnKind('d_major [in]')).toBe('translation');
    expect(columnKind('M_major [kNm]')).toBe('moment');
    expect(columnKind('N [kN]')).toBe('force');
    expect(columnKind('ratio')).toBeUndefined();
    expect(columnKind('x [m]')).toBeUndefined();
    expect(columnKind('length [m]')).toBeUndefined();
  });

  it('writes values below 1e-9 of the largest of their kind in the loading as 0, and -0 as 0', () => {
    const t = cleanTableNoise(displacements());
    expect(t.rows[0]).toEqual(['D', 'N1', 12.5, 0, 0, 1e-3, 0, 0]);
    expect(Object.is(t.rows[0][7], -0)).toBe(false);
    // 1.1e-12 mm against 12.5 mm is 8.8e-14 of it: noise
    expect(t.rows[1]).toEqual(['D', 'N2', -7.25, 2.0, 0, -2e-3, 0, 0]);
    // loading W: 1e-6 mm is a third of its largest (4e-6 mm) and stays; 5e-16 mm is noise
    expect(t.rows[2]).toEqual(['W', 'N1', 3e-6, 1e-6, 0, 2e-9, 0, 0]);
    expect(t.rows[3]).toEqual(['W', 'N2', -4e-6, 0, 0, 0, 0, 0]);
  });

  it('leaves ratios, lengths and positions alone and cleans a demand against its capacity', () => {
    const checks: ResultTable = {
      name: 'checks',
      header: ['member', 'combination', 'check', 'clause', 'demand', 'capacity', 'ratio', 'status'],
      rows: [['M1', 'ULS', 'shear', '6.2.6', 3.1e-13, 512.4, 6.05e-16, 'pass'], ['M2', 'ULS', 'shear', '6.2.6', 120, 512.4, 0.234, 'pass']],
    };
    const t = cleanTableNoise(checks);
    expect(t.rows[0][4]).toBe(0);
    expect(t.rows[0][6]).toBe(6.05e-16); // a ratio is the check's own result, never rewritten here
    expect(t.rows[1][4]).toBe(120);
    const forces: ResultTable = { name: 'member_forces', header: ['loading', 'member', 'x [m]', 'N [kN]', 'M_major [kNm]'], rows: [['D', 'M1', 1e-16, 100, 1e-14]] };
    expect(cleanTableNoise(forces).rows[0]).toEqual(['D', 'M1', 1e-16, 100, 1e-14]); // M alone in its kind: nothing larger to compare with
  });

  it('writes no noise into the CSV an export streams', async () => {
    const chunks: Uint8Array[] = [];
    const task = { kind: 'export', format: 'csv', header: {} } as unknown as ExportTask;
    await streamTable(displacements(), task, { settings: { units: 'metric' } } as Model, (c) => chunks.push(c));
    const csv = Buffer.concat(chunks).toString('utf8');
    expect(csv.split('\r\n')[1]).toBe('D,N1,12.5,0,0,0.001,0,0');
    expect(csv).not.toMatch(/e-1[0-9]/);
  });
});
