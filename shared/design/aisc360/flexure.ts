/**
 * Shared shape of every AISC flexural strength: Mn(Cb) = min(Mcap, Cb·M1), where Mcap is
 * the smallest Cb-independent limit (yielding, local buckling) and M1 the lateral-torsional
 * buckling strength for Cb = 1 (F2-2, F2-3, F7-10, F7-11, F11-2, F11-3 are all linear in Cb
 * up to the Mp cap). Infinity when lateral-torsional buckling does not apply.
 */
import { inp, type RecordHead } from '../record.js';
import type { Capacity } from './context.js';

export interface FlexureCapacity {
  /** the record head without Cb */
  head: RecordHead;
  /** φ or 1/Ω */
  factor: number;
  /** nominal limit independent of Cb (N·m); NaN = not checked */
  Mcap: number;
  /** nominal LTB strength at Cb = 1 (N·m); Infinity when LTB does not apply */
  M1: number;
  /** describes the LTB range for the record */
  ltb: string;
}

/** Design flexural strength for a given Cb: factor·min(Mcap, Cb·M1). */
export function designMoment(fc: FlexureCapacity, cb: number): number {
  const m = cb * fc.M1;
  return fc.factor * (m < fc.Mcap ? m : fc.Mcap);
}

/** The full capacity (with Cb among the inputs) for a record. */
export function flexureAt(fc: FlexureCapacity, cb: number, cbSource: string): Capacity {
  if (Number.isNaN(fc.Mcap)) return { head: fc.head, capacity: NaN };
  const capacity = designMoment(fc, cb);
  const ltbGoverns = Number.isFinite(fc.M1) && cb * fc.M1 < fc.Mcap;
  const inputs = fc.M1 === Infinity ? fc.head.inputs
    : [...fc.head.inputs, inp('Cb', `lateral-torsional buckling modification factor (${cbSource})`, cb, 'ratio')];
  const governs = ltbGoverns ? `lateral-torsional buckling governs (${fc.ltb})` : fc.M1 === Infinity ? 'no lateral-torsional buckling' : `limit Mcap governs; LTB ${fc.ltb}`;
  return {
    capacity,
    head: {
      ...fc.head,
      inputs: [...inputs, inp('Mn', 'nominal flexural strength', capacity / fc.factor, 'moment'),
        fc.head.code === 'aisc360-asd' ? inp('Ωb', 'safety factor (ASD)', 1 / fc.factor, 'ratio') : inp('φb', 'resistance factor (LRFD)', fc.factor, 'ratio')],
      note: fc.head.note ? `${fc.head.note}; ${governs}` : governs,
    },
  };
}
