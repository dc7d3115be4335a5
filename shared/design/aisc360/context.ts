/** What every AISC 360-22 check needs besides the section: method, code and material (SI). */
import type { DesignCode } from '../../model/types.js';
import type { RecordHead } from '../record.js';
import type { AiscMethod } from './factors.js';

export interface AiscContext {
  code: DesignCode;
  method: AiscMethod;
  /** Pa */
  E: number;
  G: number;
  Fy: number;
  /** undefined when the material gives none (rupture then not checked) */
  Fu?: number;
}

export function aiscContext(method: AiscMethod, E: number, G: number, Fy: number, Fu?: number): AiscContext {
  return { code: method === 'lrfd' ? 'aisc360-lrfd' : 'aisc360-asd', method, E, G, Fy, Fu };
}

/** A design strength with the record head that explains it; capacity NaN = not checked (reason in head.note). */
export interface Capacity {
  head: RecordHead;
  capacity: number;
}
