/** The column lists of every model table (tables.md), as the row parser reads them. */
import {
  CASE_CATEGORIES, LOAD_DIRECTIONS, MEMBER_LOAD_KINDS, SHAPE_KINDS, type LimitState, type MemberType, type Release,
} from '../model/types.js';
import type { ColumnSpec, TableSpec } from './table.js';

export const RELEASES: readonly Release[] = ['fixed', 'pinned', 'pinned_major', 'pinned_minor'];
export const MEMBER_TYPES: readonly MemberType[] = ['frame', 'truss'];
export const LIMIT_STATES: readonly LimitState[] = ['strength', 'service'];
export const SUPPORT_TYPES = ['fixed', 'pinned'] as const;
export const FIXITY = ['1', '0', 'fixed', 'free', 'yes', 'no', 'true', 'false'] as const;
export const MOVING_DIRECTIONS = ['forward', 'backward', 'both'] as const;
/** cases `mass`: yes/no (true/false, 1/0 read the same) */
export const YES_NO = ['yes', 'no', 'true', 'false', '1', '0'] as const;

/** tension net area columns of sections and members: An, U (0 < U ≤ 1), Ae */
const NET_COLUMNS: ColumnSpec[] = [
  { name: 'an', kind: 'number', quantity: 'area', min: 0, exclusiveMin: true },
  { name: 'u', kind: 'number', min: 0, exclusiveMin: true, max: 1 },
  { name: 'ae', kind: 'number', quantity: 'area', min: 0, exclusiveMin: true },
];

const id = (name: string, required = true): ColumnSpec => ({ name, kind: 'id', required });
const num = (name: string, extra: Partial<ColumnSpec> = {}): ColumnSpec => ({ name, kind: 'number', ...extra });
const pos = (name: string, quantity: ColumnSpec['quantity']): ColumnSpec => num(name, { quantity, min: 0, exclusiveMin: true });
const nonneg = (name: string, quantity: ColumnSpec['quantity']): ColumnSpec => num(name, { quantity, min: 0 });

export const SECTION_DIM_COLUMNS = ['d', 'bf', 'tf', 'tw', 'r', 'b', 't', 'h'] as const;

export const TABLES: Record<string, TableSpec> = {
  settings: {
    name: 'settings',
    columns: [{ name: 'key', kind: 'text', required: true }, { name: 'value', kind: 'text' }],
  },
  materials: {
    name: 'materials',
    columns: [
      id('material'),
      pos('e', 'stress'), pos('g', 'stress'),
      num('nu', { min: 0, maxExclusive: 0.5 }),
      pos('fy', 'stress'), pos('fu', 'stress'),
      nonneg('density', 'density'), nonneg('alpha', 'thermal_expansion'),
    ],
  },
  sections: {
    name: 'sections',
    columns: [
      id('section'),
      { name: 'shape', kind: 'enum', values: SHAPE_KINDS, required: true },
      // dimensions: the parser only refuses non-numbers here; validateDimensions judges the values
      ...SECTION_DIM_COLUMNS.map((n) => num(n, { quantity: 'section_dim' })),
      pos('a', 'area'), nonneg('i_major', 'inertia'), nonneg('i_minor', 'inertia'), nonneg('j', 'inertia'),
      nonneg('cw', 'warping'),
      nonneg('s_major', 'modulus'), nonneg('s_minor', 'modulus'), nonneg('z_major', 'modulus'), nonneg('z_minor', 'modulus'),
      nonneg('av_major', 'area'), nonneg('av_minor', 'area'), nonneg('depth', 'section_dim'),
      ...NET_COLUMNS,
    ],
  },
  nodes: {
    name: 'nodes',
    columns: [id('node'), num('x', { quantity: 'length', required: true }), num('y', { quantity: 'length', required: true }), num('z', { quantity: 'length' })],
  },
  supports: {
    name: 'supports',
    columns: [
      id('node'),
      { name: 'type', kind: 'enum', values: SUPPORT_TYPES },
      ...['ux', 'uy', 'uz', 'rx', 'ry', 'rz'].map((n): ColumnSpec => ({ name: n, kind: 'enum', values: FIXITY })),
      ...['k_ux', 'k_uy', 'k_uz'].map((n) => nonneg(n, 'spring_trans')),
      ...['k_rx', 'k_ry', 'k_rz'].map((n) => nonneg(n, 'spring_rot')),
    ],
  },
  members: {
    name: 'members',
    columns: [
      id('member'), id('start'), id('end'), id('section'), id('material'),
      { name: 'type', kind: 'enum', values: MEMBER_TYPES },
      num('roll', { quantity: 'rotation', defaultUnit: 'deg' }),
      { name: 'release_start', kind: 'enum', values: RELEASES },
      { name: 'release_end', kind: 'enum', values: RELEASES },
      id('section_end', false),
      { name: 'group', kind: 'text' },
      pos('k_major', 'ratio'), pos('k_minor', 'ratio'),
      // lb = 0: continuously braced (no lateral-torsional buckling); buckling lengths stay > 0
      pos('l_major', 'length'), pos('l_minor', 'length'), nonneg('lb', 'length'),
      pos('cb', 'ratio'), pos('deflection_limit', 'ratio'),
      ...NET_COLUMNS,
    ],
  },
  cases: {
    name: 'cases',
    columns: [
      id('case'),
      { name: 'category', kind: 'enum', values: CASE_CATEGORIES },
      { name: 'title', kind: 'text' },
      num('self_weight'),
      { name: 'mass', kind: 'enum', values: YES_NO },
    ],
  },
  node_loads: {
    name: 'node_loads',
    columns: [
      id('case'), id('node'),
      ...['fx', 'fy', 'fz'].map((n) => num(n, { quantity: 'force' })),
      ...['mx', 'my', 'mz'].map((n) => num(n, { quantity: 'moment' })),
    ],
  },
  member_loads: {
    name: 'member_loads',
    columns: [
      id('case'), id('member'),
      { name: 'kind', kind: 'enum', values: MEMBER_LOAD_KINDS, required: true },
      { name: 'direction', kind: 'enum', values: LOAD_DIRECTIONS },
      nonneg('a', 'length'), nonneg('b', 'length'),
      num('w1', { noUnit: true, required: true }), num('w2', { noUnit: true }),
    ],
  },
  settlements: {
    name: 'settlements',
    columns: [
      id('case'), id('node'),
      ...['ux', 'uy', 'uz'].map((n) => num(n, { quantity: 'length' })),
      ...['rx', 'ry', 'rz'].map((n) => num(n, { quantity: 'rotation' })),
    ],
  },
  vehicles: {
    name: 'vehicles',
    columns: [id('vehicle'), id('axle'), num('offset', { quantity: 'length', min: 0, required: true }), num('load', { quantity: 'force', min: 0, required: true })],
  },
  lanes: {
    name: 'lanes',
    columns: [id('lane'), num('seq', { required: true }), id('member')],
  },
  moving_loads: {
    name: 'moving_loads',
    columns: [
      id('case'), id('vehicle'), id('lane'), pos('step', 'length'),
      { name: 'direction', kind: 'enum', values: MOVING_DIRECTIONS },
    ],
  },
  result_points: {
    name: 'result_points',
    columns: [id('member'), num('x', { quantity: 'length', min: 0, required: true })],
  },
};

/** combinations: long form */
export const COMBINATIONS_LONG: TableSpec = {
  name: 'combinations',
  columns: [id('combination'), id('case'), num('factor', { required: true }), { name: 'limit_state', kind: 'enum', values: LIMIT_STATES }],
};

/** combinations: wide form — every other column is a case id holding its factor */
export const COMBINATIONS_WIDE: TableSpec = {
  name: 'combinations',
  columns: [id('combination'), { name: 'limit_state', kind: 'enum', values: LIMIT_STATES }],
  keepExtra: true,
};

/** Every table of the contract, in the order problems are reported and templates list them. */
export const KNOWN_TABLES = [
  'settings', 'nodes', 'supports', 'materials', 'sections', 'members', 'cases', 'node_loads', 'member_loads', 'settlements',
  'combinations', 'vehicles', 'lanes', 'moving_loads', 'result_points',
];
