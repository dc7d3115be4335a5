/**
 * Stability benchmark (issue 10 item 7), printed, never asserted, on the synthetic building
 * frames of bench/engine.ts (demo data of our own):
 *   - lowest αcr of 20 strength combinations of the 10k-member frame, at the first-order
 *     warning's settings (lowestCriticalLoadFactors)            target ≤ 10 s
 *   - 10 natural modes of the 10k-member frame (naturalModes)   target ≤ 3 s
 *   - second order of 20 strength combinations (analyseSecondOrder, when present) target ≤ 20 s
 *   - with --all / BENCH_ALL=1: 10 natural modes of the 50k-member frame target ≤ 60 s
 * Each figure as CPU time (user + system) beside wall time, phases in CPU time.
 */
import type { Model } from '../shared/model/types.js';
import { lowestCriticalLoadFactors } from '../shared/stability/buckling.js';
import { naturalModes } from '../shared/stability/modes.js';
import { buildFrameModel } from './engine.js';

const cpuNow = (): number => {
  const c = process.cpuUsage();
  return (c.user + c.system) / 1000;
};

function timed<T>(f: () => T): { value: T; cpu: number; wall: number } {
  const c = cpuNow(), w = performance.now();
  const value = f();
  return { value, cpu: cpuNow() - c, wall: performance.now() - w };
}

const phases = (t: Record<string, number>) => Object.entries(t).map(([k, v]) => `${k} ${v.toFixed(0)}`).join(', ');

/** The first 20 strength combinations of a bench model. */
function twentyStrength(m: Model): string[] {
  return m.combinations.filter((c) => c.limitState === 'strength').slice(0, 20).map((c) => c.id);
}

function benchModes(name: string, m: Model, target: number): void {
  const r = timed(() => naturalModes(m, 10, { clock: cpuNow }));
  const d = r.value.diagnostics;
  console.log(`  ${name}: 10 natural modes  CPU ${r.cpu.toFixed(0)} ms, wall ${r.wall.toFixed(0)} ms (target ≤ ${target} ms)`);
  console.log(`    freedoms ${d.freedoms} (4 sub-elements per member), ${d.iterations} Lanczos blocks, ${d.solves} right-hand sides, largest residual ${d.residual.toExponential(1)}`);
  console.log(`    phases (CPU ms): ${phases(d.timings)}`);
  console.log(`    f [Hz]: ${r.value.modes.map((md) => md.frequency.toFixed(3)).join(' ')}`);
  const sums = [0, 1, 2].map((k) => r.value.modes.reduce((s, md) => s + md.massRatio[k], 0));
  console.log(`    Σ mass ratios of these modes X ${sums[0].toFixed(3)}, Y ${sums[1].toFixed(3)}, Z ${sums[2].toFixed(3)}`);
}

export async function benchStability(opts: { all: boolean }): Promise<void> {
  console.log('\nstability (bench/stability.ts), frame 10×10×30 (~10k members):');
  const m = buildFrameModel(10, 10, 30, 'aisc360-lrfd');
  // warm-up (JIT) on a small frame
  const small = buildFrameModel(3, 3, 4, 'aisc360-lrfd');
  naturalModes(small, 3);
  lowestCriticalLoadFactors(small, { loadings: twentyStrength(small) });

  const ids = twentyStrength(m);
  const b = timed(() => lowestCriticalLoadFactors(m, { loadings: ids, clock: cpuNow }));
  const bd = b.value.diagnostics;
  const alphas = b.value.critical.map((c) => c.alphaCr[0]);
  console.log(`  lowest αcr of ${ids.length} strength combinations  CPU ${b.cpu.toFixed(0)} ms, wall ${b.wall.toFixed(0)} ms (target ≤ 10000 ms)`);
  console.log(`    freedoms ${bd.freedoms} (${bd.subdivisions} sub-elements per member), right-hand sides ${bd.loadings.reduce((s, l) => s + l.solves, 0)}, all converged: ${bd.loadings.every((l) => l.converged)}`);
  console.log(`    phases (CPU ms): ${phases(bd.timings)}`);
  console.log(`    αcr from ${Math.min(...alphas).toFixed(3)} to ${Math.max(...alphas).toFixed(3)}`);

  benchModes('frame 10×10×30', m, 3000);

  type SecondOrder = (
    model: Model, o: { secondOrderLoadings: string[]; clock?: { now: () => number; timings: Record<string, number> } },
  ) => { loadings: { iterations: number }[]; analysis: { diagnostics: { freedoms: number; nnzFactor: number } } };
  let secondOrder: SecondOrder | undefined;
  try {
    secondOrder = (await import('../shared/stability/second-order.js')).analyseSecondOrder as never;
  } catch {
    secondOrder = undefined;
  }
  if (secondOrder) {
    const run: SecondOrder = secondOrder;
    const clock = { now: cpuNow, timings: {} as Record<string, number> };
    const s = timed(() => run(m, { secondOrderLoadings: ids, clock }));
    const its = s.value.loadings.map((l: { iterations: number }) => l.iterations);
    const sd = s.value.analysis.diagnostics;
    console.log(`  second order of ${ids.length} strength combinations  CPU ${s.cpu.toFixed(0)} ms, wall ${s.wall.toFixed(0)} ms (target ≤ 20000 ms); iterations ${Math.min(...its)}–${Math.max(...its)}`);
    console.log(`    freedoms ${sd.freedoms} (factor of the condensed system: ${sd.nnzFactor} nonzeros)`);
    console.log(`    phases (CPU ms): ${phases(clock.timings)}`);
  } else {
    console.log('  second order: shared/stability/second-order.ts not present, skipped');
  }

  if (opts.all) benchModes('frame 20×20×40 (~51k)', buildFrameModel(20, 20, 40, 'aisc360-lrfd'), 60000);
  else console.log('  frame 20×20×40 (~51k) modes skipped; pass --all or BENCH_ALL=1');
}
