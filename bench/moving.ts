/**
 * Moving-load speed (issue 7): a 200-panel Pratt truss bridge (panel 5 m, depth 6 m, pin
 * jointed, the bottom chord is the lane), a 5-axle vehicle of our own, step 0.1 m, both
 * directions. Measures the moving-load phase of `analyse` (influence basis by one block
 * solve, the scan under the axles with its refined positions and extra stations (issue 11),
 * envelopes over every vehicle position); target ≤ 2000 ms.
 *
 * Usage: `import { benchMoving } from './moving.js'; benchMoving()`, or `npx tsx bench/moving.ts`.
 */
import { analyse } from '../shared/engine/index.js';
import type { Member, Model } from '../shared/model/types.js';

/** Pratt truss bridge along X, Z up, in the XZ plane; bottom chord L0..Ln is the lane. */
export function buildTrussBridge(panels: number, panel = 5, depth = 6): Model {
  const nodes: Model['nodes'] = [];
  const members: Member[] = [];
  for (let i = 0; i <= panels; i++) nodes.push({ id: `L${i}`, x: i * panel, y: 0, z: 0 });
  for (let i = 1; i < panels; i++) nodes.push({ id: `U${i}`, x: i * panel, y: 0, z: depth });
  const mem = (id: string, start: string, end: string, section: string) => members.push({
    id, start, end, section, material: 'S355', type: 'truss', roll: 0, releaseStart: 'fixed', releaseEnd: 'fixed', kMajor: 1, kMinor: 1,
  });
  for (let i = 0; i < panels; i++) mem(`B${i + 1}`, `L${i}`, `L${i + 1}`, 'CHORD');
  for (let i = 1; i < panels - 1; i++) mem(`T${i}`, `U${i}`, `U${i + 1}`, 'CHORD');
  mem('E1', 'L0', 'U1', 'CHORD');
  mem('E2', `L${panels}`, `U${panels - 1}`, 'CHORD');
  for (let i = 1; i < panels; i++) mem(`V${i}`, `L${i}`, `U${i}`, 'WEB');
  const half = panels / 2;
  for (let i = 1; i < panels - 1; i++) {
    // diagonals slope down towards midspan (Pratt)
    if (i < half) mem(`D${i}`, `U${i}`, `L${i + 1}`, 'WEB');
    else mem(`D${i}`, `U${i + 1}`, `L${i}`, 'WEB');
  }
  const props = (A: number) => ({ A, I_major: 1e-4, I_minor: 1e-4, J: 1e-5, Cw: 0, S_major: 1e-3, S_minor: 1e-3, Z_major: 1e-3, Z_minor: 1e-3, Av_major: A / 2, Av_minor: A / 2, depth: 0.4 });
  return {
    settings: { title: 'truss bridge bench', units: 'metric', verticalAxis: 'Z', designCode: 'none', combinationRule: 'table', deflectionLimit: 800, gammaM0: 1, gammaM1: 1, gammaM2: 1.25, stations: 11, analysis: 'first_order', bucklingModes: 0, modes: 0, stabilityWarning: true },
    inferred: { verticalAxisInferred: false, planeFrame: { plane: 'XZ', normal: 'Y' }, defaulted: [] },
    nodes,
    supports: [
      { node: 'L0', restrained: [true, true, true, false, false, false], springs: [0, 0, 0, 0, 0, 0] },
      { node: `L${panels}`, restrained: [false, true, true, false, false, false], springs: [0, 0, 0, 0, 0, 0] },
    ],
    materials: [{ id: 'S355', E: 210e9, G: 81e9, nu: 0.3, fy: 355e6, fu: 490e6, density: 7850, alpha: 12e-6 }],
    sections: [
      { id: 'CHORD', shape: 'custom', dims: {}, props: props(0.02), given: [] },
      { id: 'WEB', shape: 'custom', dims: {}, props: props(0.01), given: [] },
    ],
    members,
    cases: [{ id: 'DEAD', category: 'dead', title: 'self weight', selfWeight: 1, mass: false }, { id: 'TRAFFIC', category: 'live', title: 'vehicle', selfWeight: 0, mass: false }],
    nodeLoads: [], memberLoads: [], settlements: [],
    combinations: [{ id: 'ULS', limitState: 'strength', terms: [{ case: 'DEAD', factor: 1.35 }, { case: 'TRAFFIC', factor: 1.5 }] }],
    // a 5-axle vehicle of our own invention: 60, 120, 120, 90, 90 kN
    vehicles: [[0, 60], [3.8, 120], [5.1, 120], [10.6, 90], [11.9, 90]].map(([o, p], i) => ({ vehicle: 'HX5', axle: `A${i + 1}`, offset: o, load: p * 1e3 })),
    lanes: Array.from({ length: panels }, (_, i) => ({ lane: 'DECK', seq: i + 1, member: `B${i + 1}` })),
    movingLoads: [{ case: 'TRAFFIC', vehicle: 'HX5', lane: 'DECK', step: 0.1, direction: 'both' }],
    resultPoints: [],
  };
}

export interface MovingBenchRow {
  name: string; members: number; positions: number; basis: number; quantities: number;
  extraStations: number; refined: number; axleMs: number; movingMs: number; totalMs: number; cpuMs: number;
}

export function benchMoving(panels = 200): MovingBenchRow {
  const model = buildTrussBridge(panels);
  analyse(buildTrussBridge(10)); // warm-up
  const t0 = performance.now();
  const c0 = process.cpuUsage();
  const r = analyse(model);
  const totalMs = performance.now() - t0;
  // CPU time of this thread: on a shared machine the wall clock also counts other processes
  const cpuMs = process.cpuUsage(c0).user / 1000;
  const d = r.moving!.diagnostics;
  const row = {
    name: `truss bridge ${panels} panels`, members: model.members.length, positions: d.positions, basis: d.basis,
    quantities: d.quantities, extraStations: d.extraStations, refined: d.refined, axleMs: d.axleMilliseconds,
    movingMs: r.diagnostics.timings.moving, totalMs, cpuMs,
  };
  console.log(`moving loads: ${row.name} (${row.members} members), 5 axles, step 0.1 m, both directions: ` +
    `${row.positions} vehicle positions (${row.refined} found under the axles), ${row.basis} unit-load columns, ${row.quantities} quantities, ` +
    `${row.extraStations} stations added under the axles (scan ${row.axleMs.toFixed(0)} ms); ` +
    `influence lines + envelopes ${row.movingMs.toFixed(0)} ms (target ≤ 2000 ms), whole analysis ${row.totalMs.toFixed(0)} ms wall, ${row.cpuMs.toFixed(0)} ms CPU`);
  return row;
}

if (import.meta.url === `file://${process.argv[1]}`) benchMoving();
