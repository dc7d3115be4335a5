/**
 * The validated structural model, as every part of Trestle sees it after import.
 *
 * Everything here is in SI base units (N, m, Pa, kg, K, rad) whatever unit system the
 * workbook used; `settings.units` only says how results are shown and exported.
 * Identifiers are the user's text ids. `row` is the row number the user sees in the
 * workbook (sheet row, or CSV line) so later errors can still point back to the input.
 */

export type UnitSystem = 'metric' | 'us';
export type VerticalAxis = 'Y' | 'Z';
export type DesignCode = 'aisc360-lrfd' | 'aisc360-asd' | 'en1993-1-1' | 'none';
export type CombinationRule = 'table' | 'asce7-lrfd' | 'asce7-asd' | 'en1990-6.10';
export type LimitState = 'strength' | 'service';
/** settings `analysis` */
export type AnalysisOrder = 'first_order' | 'second_order';
export const ANALYSIS_ORDERS: readonly AnalysisOrder[] = ['first_order', 'second_order'];

export const DESIGN_CODES: readonly DesignCode[] = ['aisc360-lrfd', 'aisc360-asd', 'en1993-1-1', 'none'];
export const COMBINATION_RULES: readonly CombinationRule[] = ['table', 'asce7-lrfd', 'asce7-asd', 'en1990-6.10'];

export interface Settings {
  title: string;
  units: UnitSystem;
  verticalAxis: VerticalAxis;
  designCode: DesignCode;
  combinationRule: CombinationRule;
  /** span / N for service combinations */
  deflectionLimit: number;
  gammaM0: number;
  gammaM1: number;
  gammaM2: number;
  /** equally spaced result stations per member, both ends included (3–201); default 11 */
  stations: number;
  /** default first_order */
  analysis: AnalysisOrder;
  /** elastic critical load factors per strength loading (0 = off) */
  bucklingModes: number;
  /** natural frequencies and mode shapes (0 = off) */
  modes: number;
  /**
   * settings `stability_warning` (`on`/`off`, default on): under first_order with a design
   * code, warn where αcr < 10 or the sway amplifier exceeds 1.5 (checks.md "Stability").
   */
  stabilityWarning: boolean;
}

/** What the reader decided on the user's behalf; the import preview shows it. */
export interface Inferences {
  /** true when `vertical_axis` was not given and was inferred from the coordinates */
  verticalAxisInferred: boolean;
  /**
   * Set when every node lies in one plane containing the vertical axis and the supports
   * leave the out-of-plane freedoms free: those freedoms are restrained automatically.
   * `normal` is the global axis normal to the plane.
   */
  planeFrame: { plane: 'XY' | 'XZ' | 'YZ'; normal: 'X' | 'Y' | 'Z' } | null;
  /** settings that took their default value */
  defaulted: string[];
}

export interface Node {
  id: string;
  x: number;
  y: number;
  z: number;
  row?: number;
}

/** Freedom order everywhere: ux, uy, uz, rx, ry, rz. */
export type Six<T> = [T, T, T, T, T, T];
export const FREEDOMS = ['ux', 'uy', 'uz', 'rx', 'ry', 'rz'] as const;
export type Freedom = (typeof FREEDOMS)[number];

export interface Support {
  node: string;
  /** restrained freedoms */
  restrained: Six<boolean>;
  /** spring stiffness per freedom (N/m or N·m/rad); 0 = none */
  springs: Six<number>;
  row?: number;
}

export interface Material {
  id: string;
  E: number;
  G: number;
  nu: number;
  /** yield strength; undefined when not given (design checks then refuse the material) */
  fy?: number;
  fu?: number;
  /** mass density, kg/m3 */
  density: number;
  /** coefficient of thermal expansion, 1/K */
  alpha: number;
  /** where a built-in material's values come from */
  source?: string;
  builtIn?: boolean;
  row?: number;
}

export type ShapeKind = 'i' | 'channel' | 'angle' | 'tee' | 'rhs' | 'chs' | 'rect' | 'round' | 'custom';
export const SHAPE_KINDS: readonly ShapeKind[] = ['i', 'channel', 'angle', 'tee', 'rhs', 'chs', 'rect', 'round', 'custom'];

/** Section dimensions in metres; which are present depends on the shape (tables.md). */
export interface SectionDims {
  d?: number;
  bf?: number;
  tf?: number;
  tw?: number;
  r?: number;
  b?: number;
  t?: number;
  h?: number;
  D?: number;
}

/** Section properties (SI: m2, m4, m6, m3, m). Names follow tables.md. */
export interface SectionProps {
  A: number;
  I_major: number;
  I_minor: number;
  J: number;
  Cw: number;
  S_major: number;
  S_minor: number;
  Z_major: number;
  Z_minor: number;
  Av_major: number;
  Av_minor: number;
  /** overall depth along local z (temperature gradients) */
  depth: number;
}
export const SECTION_PROPS: readonly (keyof SectionProps)[] = [
  'A', 'I_major', 'I_minor', 'J', 'Cw', 'S_major', 'S_minor', 'Z_major', 'Z_minor', 'Av_major', 'Av_minor', 'depth',
];

/**
 * Tension net area (sections or members, tables.md): An net area, U shear lag factor
 * (AISC 360-22 D3), or Ae effective net area directly. Absent = An = Ag, U = 1 (stated in
 * the check record as assumptions).
 */
export interface NetArea {
  An?: number;
  U?: number;
  Ae?: number;
}

export interface Section {
  id: string;
  shape: ShapeKind;
  dims: SectionDims;
  /** full property set: given values override computed ones */
  props: SectionProps;
  /** the properties the user gave explicitly */
  given: (keyof SectionProps)[];
  /** catalogue source for built-in designations */
  source?: string;
  builtIn?: boolean;
  /** optional tension net area data */
  net?: NetArea;
  row?: number;
}

export type MemberType = 'frame' | 'truss';
export type Release = 'fixed' | 'pinned' | 'pinned_major' | 'pinned_minor';

export interface Member {
  id: string;
  start: string;
  end: string;
  section: string;
  /** tapered members: the section at the end node */
  sectionEnd?: string;
  material: string;
  type: MemberType;
  /** roll angle about local x, radians */
  roll: number;
  releaseStart: Release;
  releaseEnd: Release;
  group?: string;
  kMajor: number;
  kMinor: number;
  /** buckling lengths (m); undefined = member length */
  lMajor?: number;
  lMinor?: number;
  /** laterally unbraced length (m); undefined = member length; 0 = continuously braced */
  lb?: number;
  /** undefined = computed from the moment diagram */
  cb?: number;
  /** span / N; undefined = the setting */
  deflectionLimit?: number;
  /** tension net area of this member; overrides the section's */
  net?: NetArea;
  row?: number;
}

export type CaseCategory = 'dead' | 'live' | 'roof_live' | 'snow' | 'rain' | 'wind' | 'seismic' | 'temperature' | 'other';
export const CASE_CATEGORIES: readonly CaseCategory[] = ['dead', 'live', 'roof_live', 'snow', 'rain', 'wind', 'seismic', 'temperature', 'other'];

export interface LoadCase {
  id: string;
  category: CaseCategory;
  title: string;
  /** factor on self weight acting along −vertical; 0 = none */
  selfWeight: number;
  /** loads of this case along gravity count as mass for natural frequencies */
  mass: boolean;
  row?: number;
}

export interface NodeLoad {
  case: string;
  node: string;
  /** fx, fy, fz (N), mx, my, mz (N·m), global */
  values: Six<number>;
  row?: number;
}

export type MemberLoadKind = 'point' | 'moment' | 'uniform' | 'linear' | 'temperature' | 'temperature_gradient';
export const MEMBER_LOAD_KINDS: readonly MemberLoadKind[] = ['point', 'moment', 'uniform', 'linear', 'temperature', 'temperature_gradient'];
export type LoadDirection =
  | 'global_x' | 'global_y' | 'global_z'
  | 'projected_x' | 'projected_y' | 'projected_z'
  | 'local_x' | 'local_y' | 'local_z';
export const LOAD_DIRECTIONS: readonly LoadDirection[] = [
  'global_x', 'global_y', 'global_z', 'projected_x', 'projected_y', 'projected_z', 'local_x', 'local_y', 'local_z',
];

export interface MemberLoad {
  case: string;
  member: string;
  kind: MemberLoadKind;
  /** for temperature kinds the direction is irrelevant and set to local_x */
  direction: LoadDirection;
  /** start of the load from the start node (m) */
  a: number;
  /** end of the load from the start node (m); for point/moment equal to a */
  b: number;
  /** N, N·m, N/m or K depending on kind */
  w1: number;
  w2: number;
  row?: number;
}

export interface Settlement {
  case: string;
  node: string;
  /** prescribed displacement per freedom (m or rad); null = not prescribed */
  values: Six<number | null>;
  row?: number;
}

export interface CombinationTerm {
  case: string;
  factor: number;
}

export interface Combination {
  id: string;
  limitState: LimitState;
  terms: CombinationTerm[];
  /** generated combinations: the published source of the factors */
  source?: string;
  generated?: boolean;
  row?: number;
}

/** Moving loads (vehicles crossing a deck). Empty arrays when the workbook has none. */
export interface VehicleAxle {
  vehicle: string;
  axle: string;
  /** distance behind the leading axle (m), >= 0 */
  offset: number;
  /** N, acting along −vertical */
  load: number;
  row?: number;
}
export interface LaneMember {
  lane: string;
  seq: number;
  member: string;
  row?: number;
}
export interface MovingLoad {
  case: string;
  vehicle: string;
  lane: string;
  /** m; undefined = lane length / 200 */
  step?: number;
  direction: 'forward' | 'backward' | 'both';
  row?: number;
}

/** table `result_points`: an extra exact result position on one member */
export interface ResultPoint {
  member: string;
  /** distance from the start node (m), 0 ≤ x ≤ L */
  x: number;
  row?: number;
}

export interface Model {
  settings: Settings;
  inferred: Inferences;
  nodes: Node[];
  supports: Support[];
  materials: Material[];
  sections: Section[];
  members: Member[];
  cases: LoadCase[];
  nodeLoads: NodeLoad[];
  memberLoads: MemberLoad[];
  settlements: Settlement[];
  /** the combinations in force: from the table, generated by the rule, or one per case */
  combinations: Combination[];
  vehicles: VehicleAxle[];
  lanes: LaneMember[];
  movingLoads: MovingLoad[];
  /** extra result positions; empty when the workbook has none */
  resultPoints: ResultPoint[];
}

/** One problem found in the input. `row` is the row the user sees (sheet row / CSV line). */
export interface Problem {
  severity: 'error' | 'warning';
  table: string;
  row?: number;
  column?: string;
  message: string;
}

/** Problems of one table and column (column null: the table or file as a whole). */
export interface ProblemCount {
  table: string;
  column: string | null;
  errors: number;
  warnings: number;
}

/** `problemCounts` counts every problem when the list holds only the first ones (shared/reader/problems.ts). */
export type ReadResult =
  | { ok: true; model: Model; warnings: Problem[]; counts: Record<string, number>; problemCounts?: ProblemCount[] }
  | { ok: false; problems: Problem[]; counts: Record<string, number>; problemCounts?: ProblemCount[] };
