/**
 * AISC 360-22 H1.1 doubly and singly symmetric members in flexure and axial force:
 * Pr/Pc ≥ 0.2: Pr/Pc + 8/9·(Mrx/Mcx + Mry/Mcy) ≤ 1.0 (Eq. H1-1a);
 * Pr/Pc < 0.2: Pr/(2Pc) + (Mrx/Mcx + Mry/Mcy) ≤ 1.0 (Eq. H1-1b).
 * Pc is the available tensile strength for tension, the compressive strength for compression.
 */
import { inp, type RecordHead } from '../record.js';
import type { DesignCode } from '../../model/types.js';

/** The H1-1 left-hand side from plain numbers (all magnitudes). */
export function h1(Pr: number, Pc: number, Mrx: number, Mcx: number, Mry: number, Mcy: number): number {
  const p = Pr / Pc;
  const m = Mrx / Mcx + Mry / Mcy;
  return p >= 0.2 ? p + (8 / 9) * m : p / 2 + m;
}

export function h1Head(code: DesignCode, Pr: number, Pc: number, Mrx: number, Mcx: number, Mry: number, Mcy: number, tension: boolean): RecordHead {
  const a = Pr / Pc >= 0.2;
  return {
    family: 'combined', code, clause: a ? 'H1-1a' : 'H1-1b', title: `axial ${tension ? 'tension' : 'compression'} and flexure`,
    equation: a ? 'Pr/Pc ≥ 0.2: Pr/Pc + 8/9·(Mrx/Mcx + Mry/Mcy) ≤ 1.0' : 'Pr/Pc < 0.2: Pr/(2Pc) + (Mrx/Mcx + Mry/Mcy) ≤ 1.0',
    inputs: [
      inp('Pr', `required axial strength (${tension ? 'tension' : 'compression'})`, Pr, 'force'), inp('Pc', 'available axial strength', Pc, 'force'),
      inp('Mrx', 'required flexural strength, major', Mrx, 'moment'), inp('Mcx', 'available flexural strength, major', Mcx, 'moment'),
      inp('Mry', 'required flexural strength, minor', Mry, 'moment'), inp('Mcy', 'available flexural strength, minor', Mcy, 'moment'),
      inp('Pr/Pc', 'axial ratio', Pr / Pc, 'ratio'),
    ],
    quantity: 'ratio',
    note: tension ? 'H1.2 Cb increase for axial tension not used (conservative)' : 'second-order effects are those of the analysis (first order unless the model includes them)',
  };
}
