/** Keeping a run's stability summary: JSON without Infinity, shapes packed and found again, export tables, failure text. */
import { describe, expect, it } from 'vitest';
import { packShapes, shapeFromBlock, stabilityToJson } from '../../../server/runs/stability-codec.js';
import { MODES_HEADER, STABILITY_HEADER, modesTable, stabilityTable, stabilityTables } from '../../../server/runs/stability-tables.js';
import { runFailureText } from '../../../server/runs/run.service.js';
import { toCsv } from '../../../shared/exports/index.js';
import type { StabilitySummary } from '../../../shared/stability/types.js';

// invented numbers (demo data): two nodes, so every shape is 12 values long
const shape = (seed: number) => Float64Array.from({ length: 12 }, (_, i) => seed + i / 100);
const SUMMARY: StabilitySummary = {
  analysis: 'first_order',
  method: 'first-order elastic',
  secondOrder: [],
  critical: [
    { loading: 'ULS-1', alphaCr: [8.5, 21], shapes: [shape(1), shape(2)] },
    { loading: 'ULS-2', alphaCr: [Infinity], shapes: [shape(3)] },
  ],
  modes: [
    { mode: 1, frequency: 2.5, period: 0.4, massRatio: [0.8, 0, 0.01], shape: shape(10) },
    { mode: 2, frequency: 7.25, period: 1 / 7.25, massRatio: [0.1, 0.02, 0.6], shape: shape(20) },
  ],
  warnings: [{ loading: 'ULS-1', alphaCr: 8.5, amplifier: 1 / (1 - 1 / 8.5), reasons: ['en1993-1-1 5.2.1(3): αcr < 10'], message: 'combination ULS-1: αcr = 8.50 < 10' }],
};

describe('stability summary as kept with a run', () => {
  it('writes an infinite αcr as null and counts the kept shapes per loading', () => {
    const json = stabilityToJson(SUMMARY);
    expect(json.critical).toEqual([
      { loading: 'ULS-1', alphaCr: [8.5, 21], shapes: 2 },
      { loading: 'ULS-2', alphaCr: [null], shapes: 1 },
    ]);
    expect(JSON.parse(JSON.stringify(json))).toEqual(json);
    expect(json.modes[1]).toEqual({ mode: 2, frequency: 7.25, period: 1 / 7.25, massRatio: [0.1, 0.02, 0.6] });
    expect(json.warnings[0].amplifier).toBeCloseTo(1 / (1 - 1 / 8.5), 12);
  });

  it('finds each mode shape and buckled shape again in the packed block', () => {
    const json = stabilityToJson(SUMMARY);
    const block = packShapes(SUMMARY);
    expect(block.length).toBe(5 * 12);
    expect(shapeFromBlock(json, block, 2, 'mode', 2, undefined).displacements).toEqual(Array.from(shape(20)));
    const b = shapeFromBlock(json, block, 2, 'buckling', 2, 'ULS-1');
    expect(b.displacements).toEqual(Array.from(shape(2)));
    expect(b.label).toBe('ULS-1 buckling mode 2: αcr = 21.00');
    expect(shapeFromBlock(json, block, 2, 'buckling', 1, 'ULS-2').displacements).toEqual(Array.from(shape(3)));
    expect(shapeFromBlock(json, block, 2, 'buckling', 1, undefined).loading).toBe('ULS-1');
  });

  it('names the mode or loading that does not exist', () => {
    const json = stabilityToJson(SUMMARY);
    const block = packShapes(SUMMARY);
    expect(() => shapeFromBlock(json, block, 2, 'mode', 3)).toThrow('mode 3 does not exist: this run has 2 natural modes');
    expect(() => shapeFromBlock(json, block, 2, 'buckling', 1, 'SLS')).toThrow('loading "SLS" has no elastic critical load factors');
    expect(() => shapeFromBlock(json, block, 2, 'buckling', 2, 'ULS-2')).toThrow('buckling mode 2 of ULS-2 does not exist');
    const none = stabilityToJson({ ...SUMMARY, modes: [], critical: [] });
    expect(() => shapeFromBlock(none, new Float64Array(0), 2, 'mode', 1)).toThrow('settings modes = 0');
  });
});

describe('stability export tables', () => {
  it('have exactly the columns of tables.md, one row per loading and mode', () => {
    const json = stabilityToJson(SUMMARY);
    expect(STABILITY_HEADER).toEqual(['loading', 'mode', 'alpha_cr']);
    expect(MODES_HEADER).toEqual(['mode', 'frequency [Hz]', 'period [s]', 'mass_x', 'mass_y', 'mass_z']);
    expect(toCsv(stabilityTable(json))).toBe('loading,mode,alpha_cr\r\nULS-1,1,8.5\r\nULS-1,2,21\r\nULS-2,1,\r\n');
    expect(toCsv(modesTable(json)).split('\r\n')[1]).toBe('1,2.5,0.4,0.8,0,0.01');
  });

  it('are written when the settings ask for them or values exist', () => {
    const empty = stabilityToJson({ ...SUMMARY, modes: [], critical: [] });
    expect(stabilityTables(empty, { bucklingModes: 0, modes: 0 })).toEqual([]);
    expect(stabilityTables(empty, { bucklingModes: 2, modes: 3 }).map((t) => t.name)).toEqual(['stability', 'modes']);
    expect(stabilityTables(stabilityToJson(SUMMARY), { bucklingModes: 0, modes: 0 }).map((t) => t.name)).toEqual(['stability', 'modes']);
  });
});

describe('a failed run tells the user', () => {
  it('the analysis message as it is, and hides programming errors', () => {
    const unstable = new Error('combination ULS-3 is not stable at this load level: αcr = 0.83');
    expect(runFailureText(unstable)).toEqual({ text: 'combination ULS-3 is not stable at this load level: αcr = 0.83', internal: false });
    expect(runFailureText(new Error('second order cannot combine with moving loads')).internal).toBe(false);
    expect(runFailureText(new TypeError("Cannot read properties of undefined (reading 'x')")).internal).toBe(true);
    expect(runFailureText(new Error('bad\n    at analyse (/work/shared/stability/index.ts:12:3)')).text).toBe(
      'an internal error stopped the analysis (the server log has the details)',
    );
  });
});
