/** The work of one run, without a thread: phases in order and results packed for storage. */
import { gunzipSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { readCsvFiles } from '../../../shared/reader/index.js';
import type { RunPhase } from '../../../shared/schemas/runs.js';
import { computeRun, packRun } from '../../../server/runs/run-compute.js';
import { CSV } from '../models/fixture.js';

describe('computeRun', () => {
  it('reports each phase once, in order, and packs members, records and node results', async () => {
    const read = await readCsvFiles(Object.entries(CSV).map(([name, text]) => ({ name, text })));
    if (!read.ok) throw new Error('fixture does not read');
    const phases: RunPhase[] = [];
    const { output, analysed } = computeRun(JSON.stringify(read.model), 'en1993-1-1', (p) => phases.push(p));
    expect(phases).toEqual(['reading', 'assembling', 'factorising', 'solving', 'recovering', 'checking']);
    const packed = packRun(output, analysed.model);
    expect(JSON.parse(gunzipSync(packed.membersData).toString())).toHaveLength(2);
    expect(packed.counts.pass + packed.counts.fail + packed.counts.notChecked).toBe(2);
    // one row per loading: 3 nodes × 6 freedoms, displacements then reactions, 8 bytes each; 4 loadings (2 cases + 2 combinations)
    expect(packed.parts.loadingRows).toHaveLength(4);
    for (const row of packed.parts.loadingRows) expect(gunzipSync(row).byteLength).toBe(3 * 6 * 2 * 8);
    expect(packed.nodeData.byteLength).toBe(0);
    // one row per member, with its ends for the member page
    expect(packed.parts.memberIds).toHaveLength(2);
    const first = JSON.parse(packed.parts.memberRows[0]) as { index: number; start: string; util: { member: string } };
    expect(first.index).toBe(0);
    expect(first.util.member).toBe(packed.parts.memberIds[0]);
    expect(first.start).toBe(read.model.members[0].start);
  });
});
