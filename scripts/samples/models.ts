/**
 * The demo models, as tables (header row first). All scenarios and numbers are invented
 * demo data of our own; they are not taken from any program's examples.
 */
import { roadBridgeTruss } from './road-bridge.js';

export type Value = string | number | null;
export type Table = Value[][];
export interface SampleModel {
  /** folder and file name under samples/ */
  name: string;
  tables: Record<string, Table>;
}

const r3 = (x: number) => Math.round(x * 1000) / 1000;

/**
 * A 30 m pedestrian bridge: two Pratt trusses 2.6 m apart, 10 panels of 3 m, 3.2 m deep,
 * floor beams at every bottom panel point, plan bracing top and bottom. Metric, EN 1993-1-1.
 */
export function footbridgeTruss(): SampleModel {
  const panels = 10;
  const p = 3.0;
  const h = 3.2;
  const w = 2.6;
  const nodes: Table = [['node', 'x', 'y', 'z']];
  for (const [side, y] of [['S', 0], ['N', w]] as const) {
    for (let i = 0; i <= panels; i++) nodes.push([`B${side}${i}`, r3(i * p), y, 0]);
    for (let i = 1; i < panels; i++) nodes.push([`T${side}${i}`, r3(i * p), y, h]);
  }
  const members: Table = [['member', 'start', 'end', 'section', 'material', 'type', 'group', 'k_major', 'k_minor', 'lb', 'deflection_limit']];
  const add = (id: string, a: string, b: string, section: string, type: string, group: string, extra: Value[] = [null, null, null, null]) =>
    members.push([id, a, b, section, 'S355J2', type, group, ...extra]);
  for (const s of ['S', 'N']) {
    for (let i = 0; i < panels; i++) add(`BC${s}${i + 1}`, `B${s}${i}`, `B${s}${i + 1}`, 'SHS120x6', 'frame', 'bottom chord');
    for (let i = 1; i < panels - 1; i++) add(`TC${s}${i + 1}`, `T${s}${i}`, `T${s}${i + 1}`, 'SHS120x6', 'frame', 'top chord', [0.9, 1.0, null, null]);
    add(`EP${s}1`, `B${s}0`, `T${s}1`, 'SHS140x8', 'frame', 'end post');
    add(`EP${s}2`, `B${s}${panels}`, `T${s}${panels - 1}`, 'SHS140x8', 'frame', 'end post');
    for (let i = 1; i < panels; i++) add(`V${s}${i}`, `B${s}${i}`, `T${s}${i}`, 'SHS100x5', 'truss', 'vertical');
    for (let i = 1; i < panels / 2; i++) add(`D${s}${i}`, `T${s}${i}`, `B${s}${i + 1}`, 'CHS76.1x3.2', 'truss', 'diagonal');
    for (let i = panels / 2 + 1; i < panels; i++) add(`D${s}${i}`, `T${s}${i}`, `B${s}${i - 1}`, 'CHS76.1x3.2', 'truss', 'diagonal');
  }
  for (let i = 0; i <= panels; i++) add(`FB${i}`, `BS${i}`, `BN${i}`, 'IPE220', 'frame', 'floor beam', [null, null, null, 400]);
  for (let i = 1; i < panels; i++) add(`TS${i}`, `TS${i}`, `TN${i}`, 'SHS100x5', 'frame', 'top strut');
  for (let i = 0; i < panels; i++) {
    const [a, b] = i % 2 === 0 ? [`BS${i}`, `BN${i + 1}`] : [`BN${i}`, `BS${i + 1}`];
    add(`PB${i + 1}`, a, b, 'CHS60.3x4', 'truss', 'plan bracing');
  }
  for (let i = 1; i < panels - 1; i++) {
    const [a, b] = i % 2 === 0 ? [`TS${i}`, `TN${i + 1}`] : [`TN${i}`, `TS${i + 1}`];
    add(`TB${i + 1}`, a, b, 'CHS76.1x4', 'truss', 'top bracing');
  }
  // deck on the floor beams: dead 1.8 kN/m2 surfacing and planks, live 5 kN/m2 crowd
  const memberLoads: Table = [['case', 'member', 'kind', 'direction', 'a', 'b', 'w1', 'w2']];
  for (let i = 0; i <= panels; i++) {
    const trib = i === 0 || i === panels ? p / 2 : p;
    memberLoads.push(['G2', `FB${i}`, 'uniform', 'global_z', null, null, r3(-1.8 * trib), null]);
    memberLoads.push(['Q', `FB${i}`, 'uniform', 'global_z', null, null, r3(-5.0 * trib), null]);
  }
  // a service vehicle on the deck: two 20 kN wheels on one floor beam near midspan
  memberLoads.push(['QV', 'FB5', 'point', 'global_z', 0.5, null, -20, null]);
  memberLoads.push(['QV', 'FB5', 'point', 'global_z', 2.1, null, -20, null]);
  // solar gain on the top chords only
  for (const s of ['S', 'N']) for (let i = 1; i < panels - 1; i++) memberLoads.push(['T', `TC${s}${i + 1}`, 'temperature', null, null, null, 25, null]);
  const nodeLoads: Table = [['case', 'node', 'fx', 'fy', 'fz']];
  // transverse wind 1.4 kN/m2 on the south truss, lumped at the panel points
  for (let i = 0; i <= panels; i++) nodeLoads.push(['W', `BS${i}`, null, r3(i === 0 || i === panels ? 1.4 * 0.8 * p / 2 : 1.4 * 0.8 * p), null]);
  for (let i = 1; i < panels; i++) nodeLoads.push(['W', `TS${i}`, null, r3(1.4 * 0.8 * p), null]);
  return {
    name: 'footbridge-truss',
    tables: {
      settings: [
        ['key', 'value'],
        ['title', 'Riverside footbridge (demo)'],
        ['units', 'metric'],
        ['vertical_axis', 'Z'],
        ['design_code', 'en1993-1-1'],
        ['combination_rule', 'table'],
        ['deflection_limit', 360],
      ],
      materials: [
        ['material', 'E [GPa]', 'nu', 'fy [MPa]', 'fu [MPa]', 'density', 'alpha'],
        ['S355J2', 210, 0.3, 355, 490, 7850, 0.000012],
      ],
      sections: [
        ['section', 'shape', 'h', 'b', 't', 'D'],
        ['SHS140x8', 'rhs', 140, 140, 8, null],
        ['SHS120x6', 'rhs', 120, 120, 6, null],
        ['SHS100x5', 'rhs', 100, 100, 5, null],
        ['CHS76.1x3.2', 'chs', null, null, 3.2, 76.1],
        ['CHS76.1x4', 'chs', null, null, 4, 76.1],
        ['CHS60.3x4', 'chs', null, null, 4, 60.3],
      ],
      nodes,
      supports: [
        ['node', 'type', 'ux', 'uy', 'uz'],
        ['BS0', 'pinned', null, null, null],
        ['BN0', 'pinned', null, null, null],
        ['BS10', null, 0, 1, 1],
        ['BN10', null, 0, 0, 1],
      ],
      members,
      cases: [
        ['case', 'category', 'title', 'self_weight'],
        ['G', 'dead', 'Self weight of the steelwork', 1],
        ['G2', 'dead', 'Deck planks and surfacing', null],
        ['Q', 'live', 'Crowd loading on the deck', null],
        ['QV', 'live', 'Service vehicle wheels', null],
        ['W', 'wind', 'Transverse wind', null],
        ['T', 'temperature', 'Sun on the top chords', null],
      ],
      node_loads: nodeLoads,
      member_loads: memberLoads,
      combinations: [
        ['combination', 'limit_state', 'G', 'G2', 'Q', 'QV', 'W', 'T'],
        ['ULS-crowd', 'strength', 1.35, 1.35, 1.5, null, 0.9, 0.9],
        ['ULS-vehicle', 'strength', 1.35, 1.35, null, 1.5, 0.9, null],
        ['ULS-wind', 'strength', 1.35, 1.35, 1.05, null, 1.5, null],
        ['ULS-uplift', 'strength', 1.0, 1.0, null, null, 1.5, null],
        ['SLS-crowd', 'service', 1, 1, 1, null, null, null],
      ],
    },
  };
}

/**
 * A two-bay portal frame shed: pitched rafters, pinned bases, frames at 25 ft centres.
 * One frame drawn in the X–Y plane (a plane frame). US units, AISC 360 LRFD.
 */
export function portalFrameBuilding(): SampleModel {
  const span = 60;
  const eave = 20;
  const ridge = 26;
  const nodes: Table = [
    ['node', 'x', 'y'],
    ['A0', 0, 0], ['A1', 0, eave], ['R1', span / 2, ridge], ['B0', span, 0], ['B1', span, eave],
    ['R2', span * 1.5, ridge], ['C0', 2 * span, 0], ['C1', 2 * span, eave],
    // purlin-brace points at the rafter quarter points carry nothing special: rafters are one member each half
  ];
  const members: Table = [
    ['member', 'start', 'end', 'section', 'material', 'group', 'k_major', 'k_minor', 'l_minor', 'lb', 'cb', 'deflection_limit'],
    ['COL-A', 'A0', 'A1', 'W14X48', 'A992', 'outer column', 1.0, 1.0, 10, 10, null, null],
    ['COL-B', 'B0', 'B1', 'W12X40', 'A992', 'inner column', 1.0, 1.0, 10, 10, null, null],
    ['COL-C', 'C0', 'C1', 'W14X48', 'A992', 'outer column', 1.0, 1.0, 10, 10, null, null],
    ['RAF-1L', 'A1', 'R1', 'W14X68', 'A992', 'rafter', 1.0, 1.0, 5, 10, null, 240],
    ['RAF-1R', 'R1', 'B1', 'W14X68', 'A992', 'rafter', 1.0, 1.0, 5, 10, null, 240],
    ['RAF-2L', 'B1', 'R2', 'W14X68', 'A992', 'rafter', 1.0, 1.0, 5, 10, null, 240],
    ['RAF-2R', 'R2', 'C1', 'W14X68', 'A992', 'rafter', 1.0, 1.0, 5, 10, null, 240],
  ];
  // frame spacing 25 ft: dead 15 psf, roof live 20 psf, snow 25 psf, wind 20 psf on walls and 12 psf uplift
  const sp = 25;
  const memberLoads: Table = [['case', 'member', 'kind', 'direction', 'a', 'b', 'w1', 'w2']];
  for (const raf of ['RAF-1L', 'RAF-1R', 'RAF-2L', 'RAF-2R']) {
    memberLoads.push(['D', raf, 'uniform', 'global_y', null, null, r3(-0.015 * sp), null]);
    memberLoads.push(['Lr', raf, 'uniform', 'projected_y', null, null, r3(-0.020 * sp), null]);
    memberLoads.push(['S', raf, 'uniform', 'projected_y', null, null, r3(-0.02 * sp), null]);
    memberLoads.push(['W', raf, 'uniform', 'local_z', null, null, r3(0.012 * sp), null]);
  }
  // drifted snow against the ridge of bay 2, rising towards the valley at B1 (triangular)
  memberLoads.push(['S', 'RAF-2L', 'linear', 'projected_y', 0, 12, r3(-0.04 * sp), 0]);
  memberLoads.push(['W', 'COL-A', 'uniform', 'global_x', null, null, r3(0.020 * sp), null]);
  memberLoads.push(['W', 'COL-C', 'uniform', 'global_x', null, null, r3(0.010 * sp), null]);
  // a hoist hung from the inner rafter 8 ft from the valley
  const nodeLoads: Table = [['case', 'node', 'fx', 'fy', 'mz']];
  nodeLoads.push(['D', 'A1', null, -1.5, null], ['D', 'C1', null, -1.5, null]);
  memberLoads.push(['L', 'RAF-1R', 'point', 'global_y', 22, null, -9, null]);
  return {
    name: 'portal-frame-building',
    tables: {
      settings: [
        ['key', 'value'],
        ['title', 'Two-bay storage shed frame (demo)'],
        ['units', 'us'],
        ['design_code', 'aisc360-lrfd'],
        ['combination_rule', 'table'],
        ['deflection_limit', 180],
      ],
      materials: [
        ['material', 'E', 'G', 'fy', 'fu', 'density', 'alpha'],
        ['A992', 29000, 11200, 50, 65, 490, 0.0000065],
      ],
      nodes,
      supports: [['node', 'type'], ['A0', 'pinned'], ['B0', 'pinned'], ['C0', 'pinned']],
      members,
      cases: [
        ['case', 'category', 'title', 'self_weight'],
        ['D', 'dead', 'Roofing, purlins and self weight', 1],
        ['L', 'live', 'Hoist', null],
        ['Lr', 'roof_live', 'Roof maintenance', null],
        ['S', 'snow', 'Snow with drift in bay 2', null],
        ['W', 'wind', 'Wind from the left', null],
      ],
      node_loads: nodeLoads,
      member_loads: memberLoads,
      combinations: [
        ['combination', 'case', 'factor', 'limit_state'],
        ['LC1', 'D', 1.4, 'strength'],
        ['LC2', 'D', 1.2, 'strength'], ['LC2', 'L', 1.6, null], ['LC2', 'S', 0.5, null],
        ['LC3', 'D', 1.2, 'strength'], ['LC3', 'S', 1.6, null], ['LC3', 'W', 0.5, null], ['LC3', 'L', 1.0, null],
        ['LC4', 'D', 1.2, 'strength'], ['LC4', 'W', 1.0, null], ['LC4', 'S', 0.5, null], ['LC4', 'L', 1.0, null],
        ['LC5', 'D', 0.9, 'strength'], ['LC5', 'W', 1.0, null],
        ['SV1', 'D', 1.0, 'service'], ['SV1', 'S', 1.0, null],
        ['SV2', 'D', 1.0, 'service'], ['SV2', 'W', 0.6, null],
      ],
    },
  };
}

/**
 * A small 3D braced plant structure: two bays by one, two levels, pinned beam ends,
 * X bracing, a vessel on the upper level and a pipe bridge stub. Metric, EN 1993-1-1,
 * combinations generated by EN 1990 (6.10).
 */
export function plantStructure(): SampleModel {
  const xs = [0, 6, 12];
  const ys = [0, 5];
  const zs = [0, 4, 8];
  const nodes: Table = [['node', 'x', 'y', 'z']];
  const id = (i: number, j: number, k: number) => `N${i}${j}${k}`;
  for (let k = 0; k < zs.length; k++) for (let j = 0; j < ys.length; j++) for (let i = 0; i < xs.length; i++) nodes.push([id(i, j, k), xs[i], ys[j], zs[k]]);
  nodes.push(['P1', 15, 0, 8], ['P2', 15, 5, 8]);
  const members: Table = [['member', 'start', 'end', 'section', 'material', 'type', 'release_start', 'release_end', 'roll', 'group', 'k_major', 'k_minor', 'lb']];
  const m = (idm: string, a: string, b: string, section: string, extra: Partial<Record<'type' | 'rs' | 're' | 'roll' | 'group' | 'k' | 'kz' | 'lb', Value>>) =>
    members.push([idm, a, b, section, 'S355', extra.type ?? null, extra.rs ?? null, extra.re ?? null, extra.roll ?? null, extra.group ?? null, extra.k ?? null, extra.kz ?? null, extra.lb ?? null]);
  for (let i = 0; i < xs.length; i++) for (let j = 0; j < ys.length; j++) for (let k = 0; k < 2; k++) {
    m(`C${i}${j}${k + 1}`, id(i, j, k), id(i, j, k + 1), 'HEB200', { group: 'column', k: 1.0, kz: 1.0 });
  }
  for (let k = 1; k < zs.length; k++) {
    for (let j = 0; j < ys.length; j++) for (let i = 0; i < 2; i++) {
      m(`BX${i}${j}${k}`, id(i, j, k), id(i + 1, j, k), k === 2 ? 'IPE360' : 'IPE300', { rs: 'pinned', re: 'pinned', group: 'main beam', lb: 3 });
    }
    for (let i = 0; i < xs.length; i++) m(`BY${i}${k}`, id(i, 0, k), id(i, 1, k), 'IPE240', { rs: 'pinned', re: 'pinned', group: 'cross beam' });
    // plan bracing in bay 1
    m(`HB${k}a`, id(0, 0, k), id(1, 1, k), 'CHS76.1x5', { type: 'truss', group: 'plan bracing' });
    m(`HB${k}b`, id(0, 1, k), id(1, 0, k), 'CHS76.1x5', { type: 'truss', group: 'plan bracing' });
  }
  // vertical X bracing: both long faces in bay 1, both short faces at x = 0 and x = 12
  for (let k = 0; k < 2; k++) {
    for (let j = 0; j < ys.length; j++) {
      m(`VX${j}${k + 1}a`, id(0, j, k), id(1, j, k + 1), 'CHS101.6x5', { type: 'truss', group: 'vertical bracing' });
      m(`VX${j}${k + 1}b`, id(1, j, k), id(0, j, k + 1), 'CHS101.6x5', { type: 'truss', group: 'vertical bracing' });
    }
    for (const i of [0, 2]) {
      m(`VY${i}${k + 1}a`, id(i, 0, k), id(i, 1, k + 1), 'CHS88.9x5', { type: 'truss', group: 'vertical bracing' });
      m(`VY${i}${k + 1}b`, id(i, 1, k), id(i, 0, k + 1), 'CHS88.9x5', { type: 'truss', group: 'vertical bracing' });
    }
  }
  // pipe bridge stub: cantilevers beyond the last frame, a cross piece of a given (custom) section
  m('PC1', id(2, 0, 2), 'P1', 'HEA200', { group: 'pipe bridge' });
  m('PC2', id(2, 1, 2), 'P2', 'HEA200', { group: 'pipe bridge' });
  m('PX', 'P1', 'P2', 'PIPE-SHOE', { group: 'pipe bridge', rs: 'pinned', re: 'pinned' });
  const memberLoads: Table = [['case', 'member', 'kind', 'direction', 'a', 'b', 'w1', 'w2']];
  // grating 0.6 kN/m2 and operation load 4 kN/m2 on the main beams (2.5 m each side)
  for (let k = 1; k < zs.length; k++) for (let j = 0; j < ys.length; j++) for (let i = 0; i < 2; i++) {
    memberLoads.push(['G', `BX${i}${j}${k}`, 'uniform', 'global_z', null, null, -1.5, null]);
    memberLoads.push(['Q', `BX${i}${j}${k}`, 'uniform', 'global_z', null, null, -10, null]);
  }
  // vessel on the upper level, bay 2: four legs 1 m and 5 m along the main beams
  for (const j of [0, 1]) {
    memberLoads.push(['G', `BX1${j}2`, 'point', 'global_z', 1.5, null, -60, null]);
    memberLoads.push(['G', `BX1${j}2`, 'point', 'global_z', 4.5, null, -60, null]);
  }
  // pipes on the bridge stub and their thermal drag, pipes expanding in the sun
  memberLoads.push(['G', 'PX', 'uniform', 'global_z', null, null, -8, null]);
  memberLoads.push(['T', 'PC1', 'temperature', null, null, null, 30, null]);
  memberLoads.push(['T', 'PC2', 'temperature', null, null, null, 30, null]);
  const nodeLoads: Table = [['case', 'node', 'fx', 'fy', 'fz', 'mx', 'my', 'mz']];
  // wind along X on the vessel and cladding, at both levels
  for (const k of [1, 2]) for (const j of [0, 1]) nodeLoads.push(['WX', id(0, j, k), k === 2 ? 34 : 15, null, null, null, null, null]);
  for (const k of [1, 2]) for (const i of [0, 1, 2]) nodeLoads.push(['WY', id(i, 0, k), null, k === 2 ? 14 : 7, null, null, null, null]);
  // pipe anchor friction at the stub end
  nodeLoads.push(['Q', 'P1', 12, null, null, null, null, null]);
  return {
    name: 'plant-structure',
    tables: {
      settings: [
        ['key', 'value'],
        ['title', 'Process plant platform (demo)'],
        ['units', 'metric'],
        ['vertical_axis', 'Z'],
        ['design_code', 'en1993-1-1'],
        ['combination_rule', 'en1990-6.10'],
        ['deflection_limit', 250],
        ['gamma_m0', 1.0],
        ['gamma_m1', 1.0],
      ],
      sections: [
        ['section', 'shape', 'D', 't', 'A [cm2]', 'I_major [cm4]', 'I_minor [cm4]', 'J [cm4]', 'depth'],
        ['CHS76.1x5', 'chs', 76.1, 5, null, null, null, null, null],
        ['CHS88.9x5', 'chs', 88.9, 5, null, null, null, null, null],
        ['CHS101.6x5', 'chs', 101.6, 5, null, null, null, null, null],
        ['PIPE-SHOE', 'custom', null, null, 40, 2500, 900, 60, 200],
      ],
      nodes,
      // pinned bases whose base plates stop the columns twisting
      supports: [['node', 'type', 'rz'], ...[0, 1, 2].flatMap((i) => [0, 1].map((j) => [id(i, j, 0), 'pinned', 1]))],
      members,
      cases: [
        ['case', 'category', 'title', 'self_weight'],
        ['G', 'dead', 'Steel, grating, vessel and pipes', 1],
        ['Q', 'live', 'Operation and maintenance', null],
        ['WX', 'wind', 'Wind along X', null],
        ['WY', 'wind', 'Wind along Y', null],
        ['T', 'temperature', 'Pipe bridge in the sun', null],
      ],
      node_loads: nodeLoads,
      member_loads: memberLoads,
    },
  };
}

/**
 * A workshop's three-storey, two-bay moment frame with fixed bases and no bracing: a sway
 * frame, analysed to second order (EN 1993-1-1 5.2 with the sway imperfection of 5.3.2),
 * with its critical load factors and natural modes. Plane frame in X–Z, metric.
 */
export function swayMomentFrame(): SampleModel {
  const xs = [0, 6.5, 13];
  const zs = [0, 4.2, 7.8, 11.4];
  const id = (i: number, k: number) => `N${i}${k}`;
  const nodes: Table = [['node', 'x', 'y', 'z']];
  for (let k = 0; k < zs.length; k++) for (let i = 0; i < xs.length; i++) nodes.push([id(i, k), xs[i], 0, zs[k]]);
  const members: Table = [['member', 'start', 'end', 'section', 'material', 'group', 'lb', 'deflection_limit']];
  for (let i = 0; i < xs.length; i++) for (let k = 0; k < 3; k++) {
    members.push([`C${i}${k + 1}`, id(i, k), id(i, k + 1), i === 1 ? 'HEB220' : 'HEB180', 'S355', i === 1 ? 'inner column' : 'outer column', null, null]);
  }
  for (let k = 1; k < zs.length; k++) for (let i = 0; i < 2; i++) {
    // floor beams braced by the deck (lb = 0); the roof beams by purlins at 1.625 m
    members.push([`B${i}${k}`, id(i, k), id(i + 1, k), k === 3 ? 'IPE330' : 'IPE400', 'S355', k === 3 ? 'roof beam' : 'floor beam', k === 3 ? 1.625 : 0, 300]);
  }
  const memberLoads: Table = [['case', 'member', 'kind', 'direction', 'a', 'b', 'w1', 'w2']];
  for (let k = 1; k < zs.length; k++) for (let i = 0; i < 2; i++) {
    memberLoads.push(['G', `B${i}${k}`, 'uniform', 'global_z', null, null, k === 3 ? -12 : -30, null]);
    memberLoads.push(['Q', `B${i}${k}`, 'uniform', 'global_z', null, null, k === 3 ? -6 : -32, null]);
  }
  // a crane rail bracket on the inner column below the first floor
  memberLoads.push(['Q', 'C11', 'point', 'global_x', 3.2, null, 6, null]);
  const nodeLoads: Table = [['case', 'node', 'fx', 'fy', 'fz']];
  nodeLoads.push(['W', id(0, 1), 16, null, null], ['W', id(0, 2), 14, null, null], ['W', id(0, 3), 8, null, null]);
  nodeLoads.push(['W', id(2, 1), 9, null, null], ['W', id(2, 2), 8, null, null], ['W', id(2, 3), 4.5, null, null]);
  return {
    name: 'sway-moment-frame',
    tables: {
      settings: [
        ['key', 'value'],
        ['title', 'Workshop moment frame, second order (demo)'],
        ['units', 'metric'],
        ['vertical_axis', 'Z'],
        ['design_code', 'en1993-1-1'],
        ['combination_rule', 'table'],
        ['analysis', 'second_order'],
        ['buckling_modes', 3],
        ['modes', 4],
        ['stations', 21],
      ],
      nodes,
      supports: [['node', 'type'], ...[0, 1, 2].map((i) => [id(i, 0), 'fixed'])],
      members,
      cases: [
        ['case', 'category', 'title', 'self_weight', 'mass'],
        ['G', 'dead', 'Steel, floors and roof', 1, 'yes'],
        ['Q', 'live', 'Workshop floors and roof access', null, 'no'],
        ['W', 'wind', 'Wind from the left', null, 'no'],
      ],
      node_loads: nodeLoads,
      member_loads: memberLoads,
      // the bracket position on the inner column, read exactly
      result_points: [['member', 'x'], ['C11', 3.2]],
      combinations: [
        ['combination', 'limit_state', 'G', 'Q', 'W'],
        ['ULS-1', 'strength', 1.35, 1.5, null],
        ['ULS-2', 'strength', 1.35, 1.05, 1.5],
        ['ULS-3', 'strength', 1.0, null, 1.5],
        ['SLS-1', 'service', 1.0, 1.0, null],
        ['SLS-2', 'service', 1.0, null, 1.0],
      ],
    },
  };
}

export const SAMPLES = [footbridgeTruss, portalFrameBuilding, plantStructure, roadBridgeTruss, swayMomentFrame];
