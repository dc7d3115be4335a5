/** What every EN 1993-1-1 check needs besides the section (SI; partial factors from the settings). */
import type { RecordHead } from '../record.js';

export interface EnContext {
  E: number;
  G: number;
  fy: number;
  /** undefined when the material gives none (6.2.3(2)b then not checked) */
  fu?: number;
  gammaM0: number;
  gammaM1: number;
  gammaM2: number;
  /** hollow sections: hot finished (EN 10210) selects buckling curve a, otherwise c */
  hotFinished: boolean;
}

/** A design resistance with its record head; capacity NaN = not checked (reason in head.note). */
export interface Resistance {
  head: RecordHead;
  capacity: number;
}

/** ε = √(235 MPa / fy) (Table 5.2). */
export function epsilon(fy: number): number {
  return Math.sqrt(235e6 / fy);
}
