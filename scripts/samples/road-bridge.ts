/**
 * A 48 m road-bridge truss (demo of our own): one of the two main Pratt trusses of a single
 * lane road bridge, drawn as a plane frame in X–Z. 8 panels of 6 m, 6.5 m deep; the bottom
 * chord is continuous (frame members) and carries its share of the deck directly, so the
 * vehicle runs along it (the lane). A four-axle design vehicle of our own invention (TRX-4).
 * Metric; member checks of EN 1993-1-1 with the partial factors EN 1993-2 recommends for
 * bridges (see BRIDGE_PARTIAL_FACTORS). Every other number is invented demo data.
 */
import type { SampleModel, Table, Value } from './models.js';

/**
 * Partial factors for a steel bridge: EN 1993-2 6.1 (1), Note 2B, recommended values
 * γM0 = 1.00, γM1 = 1.10, γM2 = 1.25 (from memory; a national annex may set others). The
 * settings `gamma_m0`, `gamma_m1`, `gamma_m2` apply them to the EN 1993-1-1 member checks.
 */
export const BRIDGE_PARTIAL_FACTORS = { gamma_m0: 1.0, gamma_m1: 1.1, gamma_m2: 1.25 } as const;

export function roadBridgeTruss(): SampleModel {
  const panels = 8, p = 6.0, h = 6.5;
  const nodes: Table = [['node', 'x', 'y', 'z']];
  for (let i = 0; i <= panels; i++) nodes.push([`L${i}`, i * p, 0, 0]);
  for (let i = 1; i < panels; i++) nodes.push([`U${i}`, i * p, 0, h]);
  const members: Table = [['member', 'start', 'end', 'section', 'material', 'type', 'group', 'k_major', 'k_minor', 'lb']];
  const add = (id: string, a: string, b: string, section: string, type: string, group: string, extra: Value[] = [null, null, null]) =>
    members.push([id, a, b, section, 'S355', type, group, ...extra]);
  for (let i = 0; i < panels; i++) add(`BC${i + 1}`, `L${i}`, `L${i + 1}`, 'BOTTOM', 'frame', 'bottom chord', [null, null, 3]);
  for (let i = 1; i < panels - 1; i++) add(`TC${i + 1}`, `U${i}`, `U${i + 1}`, 'TOP', 'truss', 'top chord', [0.9, 0.9, null]);
  add('EP1', 'L0', 'U1', 'POST', 'truss', 'end post');
  add('EP2', `L${panels}`, `U${panels - 1}`, 'POST', 'truss', 'end post');
  for (let i = 1; i < panels; i++) add(`V${i}`, `L${i}`, `U${i}`, 'HANGER', 'truss', 'vertical');
  for (let i = 1; i < panels / 2; i++) add(`D${i}`, `U${i}`, `L${i + 1}`, 'DIAG', 'truss', 'diagonal');
  for (let i = panels / 2 + 1; i < panels; i++) add(`D${i}`, `U${i}`, `L${i - 1}`, 'DIAG', 'truss', 'diagonal');
  // deck slab, surfacing and cross girders shared by this truss: 28 kN/m on the bottom chord
  const memberLoads: Table = [['case', 'member', 'kind', 'direction', 'a', 'b', 'w1', 'w2']];
  for (let i = 0; i < panels; i++) memberLoads.push(['G2', `BC${i + 1}`, 'uniform', 'global_z', null, null, -28, null]);
  // lane load beside the vehicle, 9 kN/m on the whole deck
  for (let i = 0; i < panels; i++) memberLoads.push(['QL', `BC${i + 1}`, 'uniform', 'global_z', null, null, -9, null]);
  return {
    name: 'road-bridge-truss',
    tables: {
      settings: [
        ['key', 'value'],
        ['title', 'Mill Lane road bridge, main truss (demo)'],
        ['units', 'metric'],
        ['vertical_axis', 'Z'],
        ['design_code', 'en1993-1-1'],
        ['combination_rule', 'table'],
        ['deflection_limit', 600],
        // bridge partial factors, EN 1993-2 6.1 (1) (from memory): see BRIDGE_PARTIAL_FACTORS
        ['gamma_m0', BRIDGE_PARTIAL_FACTORS.gamma_m0],
        ['gamma_m1', BRIDGE_PARTIAL_FACTORS.gamma_m1],
        ['gamma_m2', BRIDGE_PARTIAL_FACTORS.gamma_m2],
      ],
      materials: [
        ['material', 'E [GPa]', 'nu', 'fy [MPa]', 'fu [MPa]', 'density', 'alpha'],
        ['S355', 210, 0.3, 355, 490, 7850, 0.000012],
      ],
      sections: [
        ['section', 'shape', 'd', 'bf', 'tf', 'tw', 'h', 'b', 't'],
        ['BOTTOM', 'i', 500, 300, 25, 14, null, null, null],
        ['TOP', 'rhs', null, null, null, null, 300, 300, 12.5],
        ['POST', 'rhs', null, null, null, null, 300, 300, 16],
        ['HANGER', 'rhs', null, null, null, null, 180, 180, 8],
        ['DIAG', 'rhs', null, null, null, null, 250, 250, 10],
      ],
      nodes,
      supports: [
        ['node', 'ux', 'uz'],
        ['L0', 1, 1],
        [`L${panels}`, 0, 1],
      ],
      members,
      cases: [
        ['case', 'category', 'title', 'self_weight'],
        ['G', 'dead', 'Self weight of the truss', 1],
        ['G2', 'dead', 'Deck, surfacing and cross girders', null],
        ['QL', 'live', 'Lane load beside the vehicle', null],
        ['TRAFFIC', 'live', 'Design vehicle TRX-4 crossing', null],
      ],
      member_loads: memberLoads,
      combinations: [
        ['combination', 'case', 'factor', 'limit_state'],
        ['ULS-traffic', 'G', 1.35, 'strength'],
        ['ULS-traffic', 'G2', 1.35, 'strength'],
        ['ULS-traffic', 'QL', 1.35, 'strength'],
        ['ULS-traffic', 'TRAFFIC', 1.35, 'strength'],
        ['SLS-traffic', 'G', 1, 'service'],
        ['SLS-traffic', 'G2', 1, 'service'],
        ['SLS-traffic', 'QL', 1, 'service'],
        ['SLS-traffic', 'TRAFFIC', 1, 'service'],
      ],
      // TRX-4: our own design vehicle, 450 kN on four axles over 9.2 m
      vehicles: [
        ['vehicle', 'axle', 'offset [m]', 'load [kN]'],
        ['TRX-4', 'front', 0, 60],
        ['TRX-4', 'drive 1', 3.6, 140],
        ['TRX-4', 'drive 2', 4.9, 140],
        ['TRX-4', 'rear', 9.2, 110],
      ],
      lanes: [['lane', 'seq', 'member'], ...Array.from({ length: panels }, (_, i): Value[] => ['DECK', i + 1, `BC${i + 1}`])],
      moving_loads: [
        ['case', 'vehicle', 'lane', 'step [m]', 'direction'],
        ['TRAFFIC', 'TRX-4', 'DECK', 0.2, 'both'],
      ],
    },
  };
}
