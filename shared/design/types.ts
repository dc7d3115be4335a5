/**
 * Design-check records: what every check returns and what the schedule, the member
 * detail and the exports show. Values are SI; `quantity` says how to convert for display.
 */
import type { DesignCode } from '../model/types.js';
import type { Quantity } from '../units/index.js';

export type CheckStatus = 'pass' | 'fail' | 'not checked';
export const CHECK_STATUSES: readonly CheckStatus[] = ['pass', 'fail', 'not checked'];

export type CheckFamily =
  | 'tension' | 'compression' | 'bending_major' | 'bending_minor' | 'shear_major' | 'shear_minor'
  | 'combined' | 'torsion' | 'deflection' | 'slenderness';
export const CHECK_FAMILIES: readonly CheckFamily[] = [
  'tension', 'compression', 'bending_major', 'bending_minor', 'shear_major', 'shear_minor',
  'combined', 'torsion', 'deflection', 'slenderness',
];

/** One input of a calculation, with its unit kind so it can be shown in any unit system. */
export interface CheckInput {
  /** symbol as in the code: "Fy", "KL/r", "λ_LT" */
  symbol: string;
  /** plain words: "yield stress" */
  name: string;
  value: number | string;
  quantity: Quantity;
}

/**
 * One axis of a check made about each axis (AISC E3, EN 6.3.1): its own inputs and
 * intermediates and its capacity; the record's capacity is the smallest of them.
 */
export interface AxisPart {
  axis: 'major' | 'minor';
  inputs: CheckInput[];
  /** SI, same quantity as the record */
  capacity: number;
}

export interface CheckRecord {
  member: string;
  family: CheckFamily;
  code: DesignCode;
  /** clause of the code, e.g. "E3", "6.3.1.1" */
  clause: string;
  /** short title: "flexural buckling" */
  title: string;
  /** the equation in words, e.g. "φc·Pn = 0.90 · Fcr · Ag" */
  equation: string;
  inputs: CheckInput[];
  /** SI; null when not checked */
  capacity: number | null;
  demand: number | null;
  /** unit kind of capacity and demand ('ratio' for interaction checks) */
  quantity: Quantity;
  combination: string;
  /** position along the member where the demand governs (m) */
  x: number | null;
  ratio: number | null;
  status: CheckStatus;
  /** reason when not checked, or a remark */
  note?: string;
  /** moving loads: position of the leading axle along the lane (m) when it governed */
  vehiclePosition?: number;
  /** moving loads: which envelope governed */
  envelope?: 'max' | 'min';
  /** the analysis the forces come from (StabilitySummary.method), e.g. the direct analysis method */
  analysis?: string;
  /** first-order stability warning of a combination in which this member is in compression */
  stability?: string;
  /** a check made about each axis: one part per axis (exports write a row per axis) */
  axes?: AxisPart[];
}

export interface MemberUtilisation {
  member: string;
  group: string;
  section: string;
  material: string;
  length: number;
  /** governing ratio; null when nothing could be checked */
  ratio: number | null;
  check: string;
  clause: string;
  combination: string;
  status: CheckStatus;
  /** governing ratio per family (null = no ratio; absent = family does not apply) */
  families: Partial<Record<CheckFamily, number | null>>;
  /** status per family */
  familyStatus: Partial<Record<CheckFamily, CheckStatus>>;
  warnings: string[];
  vehiclePosition?: number;
  /** moving loads: the envelope (max or min) of the governing combination */
  envelope?: 'max' | 'min';
}

/** The design checks of a whole model (checkModel). */
export interface DesignResult {
  code: DesignCode;
  /** one per member, in model order */
  members: MemberUtilisation[];
  /** for each member and check, the record of its governing combination (empty when recordsOmitted) */
  records: CheckRecord[];
  /**
   * true when there were more records than DesignOptions.maxRecords: none are returned (the
   * schedule rows are complete; a caller wanting records recomputes them)
   */
  recordsOmitted?: boolean;
  /** members by status */
  counts: { pass: number; fail: number; notChecked: number };
  /**
   * member-combination evaluations; total time (ms); time of the evaluation loop alone
   * (ms, without plans, records and schedule rows)
   */
  diagnostics: { evaluations: number; milliseconds: number; evaluationMilliseconds: number };
}
