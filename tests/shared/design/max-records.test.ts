/**
 * checkModel's maxRecords (a large model's run keeps only its schedule rows): the member rows
 * and counts are those of a check keeping every record; records are all kept up to the limit
 * and none past it (recordsOmitted). Reference: checkModel without the option.
 */
import { describe, expect, it } from 'vitest';
import { buildFrameModel } from '../../../bench/engine.js';
import { analyse } from '../../../shared/engine/index.js';
import { checkModel } from '../../../shared/design/index.js';

describe('checkModel maxRecords', () => {
  for (const code of ['aisc360-lrfd', 'en1993-1-1'] as const) {
    it(`${code}: same schedule rows; records kept up to the limit, none past it`, () => {
      const model = buildFrameModel(2, 2, 3, code);
      const r = analyse(model);
      const all = checkModel(model, r);
      expect(all.records.length).toBeGreaterThan(10);
      expect(all.recordsOmitted).toBeUndefined();
      const within = checkModel(model, r, { maxRecords: all.records.length });
      expect(within.recordsOmitted).toBeUndefined();
      expect(JSON.stringify(within.records)).toBe(JSON.stringify(all.records));
      const past = checkModel(model, r, { maxRecords: all.records.length - 1 });
      expect(past.recordsOmitted).toBe(true);
      expect(past.records).toEqual([]);
      expect(JSON.stringify(past.members)).toBe(JSON.stringify(all.members));
      expect(past.counts).toEqual(all.counts);
      expect(past.diagnostics.evaluations).toBe(all.diagnostics.evaluations);
    });
  }
});
