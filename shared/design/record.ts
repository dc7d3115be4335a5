/**
 * Building blocks of check records: inputs with units, finished records, `not checked`
 * records. Every check function returns a full CheckRecord built with these.
 */
import type { DesignCode } from '../model/types.js';
import type { Quantity } from '../units/index.js';
import type { AxisPart, CheckFamily, CheckInput, CheckRecord, CheckStatus } from './types.js';

export function inp(symbol: string, name: string, value: number | string, quantity: Quantity): CheckInput {
  return { symbol, name, value, quantity };
}

/** What a check knows before the demand is known. */
export interface RecordHead {
  family: CheckFamily;
  code: DesignCode;
  clause: string;
  title: string;
  equation: string;
  inputs: CheckInput[];
  /** unit kind of capacity and demand */
  quantity: Quantity;
  note?: string;
  /** a check made about each axis: the parts (see AxisPart) */
  axes?: AxisPart[];
}

/** pass when ratio ≤ 1.0, fail above. */
export function statusOf(ratio: number): CheckStatus {
  return ratio <= 1 ? 'pass' : 'fail';
}

/** A finished record: ratio = demand / capacity (capacity 0 with demand 0 gives ratio 0). */
export function finish(
  head: RecordHead, member: string, combination: string,
  capacity: number, demand: number, x: number | null,
): CheckRecord {
  const ratio = demand === 0 ? 0 : capacity > 0 ? demand / capacity : Infinity;
  return interactionRecord(head, member, combination, ratio, x, capacity, demand);
}

/** A record whose ratio is computed directly (interaction equations): capacity 1, demand = ratio. */
export function interactionRecord(
  head: RecordHead, member: string, combination: string, ratio: number, x: number | null,
  capacity: number | null = 1, demand: number | null = ratio,
): CheckRecord {
  const rec: CheckRecord = {
    member,
    family: head.family,
    code: head.code,
    clause: head.clause,
    title: head.title,
    equation: head.equation,
    inputs: head.inputs,
    capacity,
    demand,
    quantity: head.quantity,
    combination,
    x,
    ratio,
    status: statusOf(ratio),
  };
  if (head.note) rec.note = head.note;
  if (head.axes) rec.axes = head.axes;
  return rec;
}

/** A check outside the implemented scope: never passing, always with its reason. */
export function notChecked(
  member: string, family: CheckFamily, code: DesignCode, clause: string, title: string,
  reason: string, combination = '', inputs: CheckInput[] = [],
): CheckRecord {
  return {
    member, family, code, clause, title, equation: '', inputs, capacity: null, demand: null,
    quantity: 'ratio', combination, x: null, ratio: null, status: 'not checked', note: reason,
  };
}

/** A head for a check that is not evaluated (kept inside member plans). */
export function notCheckedHead(family: CheckFamily, code: DesignCode, clause: string, title: string, reason: string): RecordHead {
  return { family, code, clause, title, equation: '', inputs: [], quantity: 'ratio', note: reason };
}
