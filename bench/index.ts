/**
 * `npm run bench`: speed figures (printed, never asserted). Engine phases on synthetic frames
 * and a long truss; the solver alone when bench/solver.ts is present.
 * Targets (issue 3): 10k-member frame with 20 cases, assembly + factorisation + solve ≤ 2 s;
 * 50k members ≤ 40 s; a 10k-member truss ≤ 0.1 s.
 * Optional arguments pick models: `npm run bench -- frame1k frame10k frame50k truss10k solver api`.
 */
import type { RawTable } from '../shared/reader/index.js';
import { benchEngine, buildFrameModel, buildTrussModel, type EngineBenchRow, printEngineRow } from './engine.js';

const ALL = ['frame1k', 'frame10k', 'frame50k', 'truss10k', 'solver', 'api'];
const wanted = process.argv.slice(2).filter((a) => ALL.includes(a));
const pick = wanted.length ? wanted : ALL;

async function reader(): Promise<((t: RawTable[]) => { ok: boolean }) | null> {
  try {
    const mod = await import('../shared/reader/index.js');
    return mod.readTables as never;
  } catch {
    return null;
  }
}

async function main(): Promise<void> {
  const read = await reader();
  const rows: EngineBenchRow[] = [];
  const run = (name: string, build: () => ReturnType<typeof buildFrameModel>, recover = true) => {
    const r = benchEngine(name, build, read, recover);
    printEngineRow(r);
    rows.push(r);
  };
  // warm-up (JIT) on a small model
  benchEngine('warm-up', () => buildFrameModel(3, 3, 4), null, true);
  if (pick.includes('frame1k')) run('frame 5×5×12 (~1k)', () => buildFrameModel(5, 5, 12));
  if (pick.includes('frame10k')) run('frame 10×10×30 (~10k)', () => buildFrameModel(10, 10, 30));
  if (pick.includes('truss10k')) run('truss 2500 panels (~10k)', () => buildTrussModel(2500));
  if (pick.includes('frame50k')) run('frame 20×20×40 (~51k)', () => buildFrameModel(20, 20, 40), true);
  console.log('\ntargets: 10k frame core ≤ 2000 ms; 50k frame core ≤ 40000 ms; 10k truss core ≤ 100 ms (core = assembly + loads + ordering + factorisation + solve)');
  for (const r of rows) console.log(`  ${r.name.padEnd(26)} core ${r.coreMs.toFixed(0)} ms`);
  if (pick.includes('moving')) (await import('./moving.js')).benchMoving();
  if (pick.includes('solver')) {
    try {
      const mod = (await import('./solver.js')) as { benchSolver?: () => unknown };
      if (typeof mod.benchSolver === 'function') {
        console.log('\nsolver alone (bench/solver.ts):');
        await mod.benchSolver();
      }
    } catch (e) {
      console.log(`solver bench not run: ${(e as Error).message}`);
    }
  }
  if (pick.includes('api')) {
    // bench/api.ts: upload, commit, run, edit-one-section rerun through the HTTP API (10k frame)
    const { benchApi } = await import('./api.js');
    console.log('\nHTTP API on the 10×10×30 frame (ms):');
    const f = await benchApi();
    console.log(`  upload→preview ${f.uploadToPreviewMs.toFixed(0)}, commit ${f.commitMs.toFixed(0)}, full run ${f.fullRunMs.toFixed(0)}, edit ${f.editMs.toFixed(0)}, rerun ${f.rerunMs.toFixed(0)}`);
    console.log(`  bare analysis + checks ${f.bareAnalysisAndChecksMs?.toFixed(0) ?? '–'}; (edit + rerun) / bare = ${f.rerunOverBare?.toFixed(2) ?? '–'} (target ≤ 1.2)`);
  }
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
