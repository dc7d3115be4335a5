/**
 * Second order in the worker paths: the run reports its phases once and in order, keeps the
 * stability summary, and a member-detail re-analysis (worker without the run in memory) gives
 * the same second-order diagrams and records as the run itself.
 */
import { describe, expect, it } from 'vitest';
import { readCsvFiles } from '../../../shared/reader/index.js';
import type { RunPhase, RunStability } from '../../../shared/schemas/runs.js';
import { computeRun, packRun } from '../../../server/runs/run-compute.js';
import { runWorkerTask, stationsJson } from '../../../server/runs/worker-tasks.js';
import type { MemberTaskResult } from '../../../server/runs/worker-protocol.js';
import { PORTAL } from './stability-fixture.js';

async function portalJson(extra: string): Promise<string> {
  const files = Object.entries({ ...PORTAL, 'settings.csv': PORTAL['settings.csv'] + extra }).map(([name, text]) => ({ name, text }));
  const read = await readCsvFiles(files);
  if (!read.ok) throw new Error(`fixture does not read: ${JSON.stringify(read.problems)}`);
  return JSON.stringify(read.model);
}

describe('a second-order run in the worker', () => {
  it('reports each phase once in order and keeps the order, method and iterations', async () => {
    const json = await portalJson('analysis,second_order\n');
    const phases: RunPhase[] = [];
    const { output, analysed } = computeRun(json, 'en1993-1-1', (p) => phases.push(p));
    expect(new Set(phases).size).toBe(phases.length);
    expect(phases[0]).toBe('reading');
    expect(phases.at(-1)).toBe('checking');
    const packed = packRun(output, analysed.model);
    const s = JSON.parse(packed.stabilityJson) as RunStability;
    expect(s.analysis).toBe('second_order');
    expect(s.secondOrder.every((l) => l.converged && l.iterations > 0)).toBe(true);
    expect(s.modes).toHaveLength(3);
    // EN 1993-1-1 5.3.2 with second order: the sway imperfection variants are in the analysed model, kept with the run
    expect(packed.analysedModelData.byteLength).toBeGreaterThan(0);
  });

  it('re-analyses a member the same way as the run (same second-order stations and records)', async () => {
    const json = await portalJson('analysis,second_order\n');
    const { output, analysed } = computeRun(json, 'en1993-1-1');
    const loadings = output.loadings;
    const combo = loadings.findIndex((l) => l.kind === 'combination' && l.limitState === 'strength');
    expect(combo).toBeGreaterThanOrEqual(0);
    // run id 987654 is in no worker's memory: the task re-analyses from the model JSON
    const fresh = runWorkerTask({ kind: 'member', runId: 987654, modelJson: json, designCode: 'en1993-1-1', member: 0, loading: combo, governing: combo }, () => {}) as MemberTaskResult;
    const expected = stationsJson(analysed.analysis.memberForces(0, combo));
    const scale = Math.max(1, ...expected.M_major.map(Math.abs));
    fresh.stations.M_major.forEach((m, i) => expect(Math.abs(m - expected.M_major[i])).toBeLessThanOrEqual(1e-9 * scale));
    expect(fresh.governingRecords.length).toBeGreaterThan(0);
    expect(fresh.governingRecords[0].combination).toBe(loadings[combo].id);
  });

  it('a first-order re-analysis takes the run\'s own warnings and method instead of computing αcr again', async () => {
    // no buckling modes asked for (the warning alone), and a gravity load that brings αcr under 10
    const files = Object.entries({
      ...PORTAL,
      'settings.csv': 'key,value\ntitle,Stability portal\nunits,metric\ndesign_code,en1993-1-1\n',
      'member_loads.csv': 'case,member,kind,direction,w1\nG,B1,uniform,global_y,-400\n',
    }).map(([name, text]) => ({ name, text }));
    const read = await readCsvFiles(files);
    if (!read.ok) throw new Error('fixture does not read');
    const json = JSON.stringify(read.model);
    const { output, analysed } = computeRun(json, 'en1993-1-1');
    const stored = JSON.parse(packRun(output, analysed.model).stabilityJson) as RunStability;
    expect(stored.analysis).toBe('first_order');
    expect(stored.warnings.length).toBeGreaterThan(0);
    const combo = output.loadings.findIndex((l) => l.kind === 'combination' && l.limitState === 'strength');
    const task = { kind: 'member' as const, modelJson: json, designCode: 'en1993-1-1' as const, member: 0, loading: combo, governing: combo };
    // runs 987655 and 987656 are in no worker's memory: both re-analyse, one with the run's summary
    const withSummary = runWorkerTask({ ...task, runId: 987655, stability: stored }, () => {}) as MemberTaskResult;
    const computed = runWorkerTask({ ...task, runId: 987656 }, () => {}) as MemberTaskResult;
    expect(withSummary.governingRecords).toEqual(computed.governingRecords);
    expect(withSummary.stations).toEqual(computed.stations);
    expect(withSummary.governingRecords.every((r) => r.analysis === stored.method)).toBe(true);
  });
});
