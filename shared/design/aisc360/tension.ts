/**
 * AISC 360-22 D2 tensile strength: (a) yielding on the gross section, Pn = Fy·Ag;
 * (b) rupture on the effective net area, Pn = Fu·Ae with Ae = U·An. Connections are not
 * modelled: An = Ag and U = 1.0 unless given (stated in the record as assumptions).
 */
import { inp, notCheckedHead } from '../record.js';
import type { DesignGeometry } from '../geometry.js';
import type { NetArea } from '../../model/types.js';
import { netAreaProblem } from '../net-area.js';
import { AISC_FACTORS, factorInput, factorOn, factorWords } from './factors.js';
import type { AiscContext, Capacity } from './context.js';

export function tensionYieldD2a(g: DesignGeometry, c: AiscContext): Capacity {
  const f = AISC_FACTORS.tensionYield;
  const Pn = c.Fy * g.A;
  return {
    capacity: factorOn(c.method, f) * Pn,
    head: {
      family: 'tension', code: c.code, clause: 'D2(a)', title: 'tensile yielding',
      equation: `${factorWords(c.method, f, c.method === 'lrfd' ? 'φt·Pn' : 'Pn/Ωt', 'Fy·Ag')} (Eq. D2-1)`,
      inputs: [inp('Fy', 'yield stress', c.Fy, 'stress'), inp('Ag', 'gross area', g.A, 'area'), inp('Pn', 'nominal tensile strength', Pn, 'force'), factorInput(c.method, f, 't')],
      quantity: 'force',
    },
  };
}

/**
 * D2(b) rupture. `net` (sections or members table): Ae given is used directly; otherwise
 * Ae = U·An (Eq. D3-1) with An = Ag and U = 1.0 where not given — each default is stated in
 * the record as an assumption. Values outside their range (An or Ae not in (0, Ag],
 * U not in (0, 1]) are refused: not checked with the reason. `source` names where the
 * values came from ("section W12X26", "member M3").
 */
export function tensionRuptureD2b(g: DesignGeometry, c: AiscContext, net: NetArea = {}, source = ''): Capacity {
  if (c.Fu === undefined) {
    return { capacity: NaN, head: notCheckedHead('tension', c.code, 'D2(b)', 'tensile rupture', 'material gives no Fu: D2(b) rupture not evaluated') };
  }
  const bad = netAreaProblem(g.A, net);
  if (bad) return { capacity: NaN, head: notCheckedHead('tension', c.code, 'D2(b)', 'tensile rupture', `${bad}${source ? ` (${source})` : ''}`) };
  const f = AISC_FACTORS.tensionRupture;
  const from = source ? ` (given, ${source})` : ' (given)';
  let inputs, Ae: number, words: string;
  const assumed: string[] = [];
  if (net.Ae !== undefined) {
    Ae = net.Ae;
    words = 'Ae given';
    inputs = [inp('Fu', 'tensile strength', c.Fu, 'stress'), inp('Ag', 'gross area', g.A, 'area'), inp('Ae', `effective net area${from}`, Ae, 'area')];
    if (net.An !== undefined || net.U !== undefined) assumed.push('Ae given: An and U not used');
  } else {
    const an = net.An ?? g.A;
    const u = net.U ?? 1;
    Ae = u * an;
    words = 'Ae = U·An (Eq. D3-1)';
    if (net.An === undefined) assumed.push('An = Ag assumed (no net area given; holes not modelled)');
    if (net.U === undefined) assumed.push('U = 1.0 assumed (no shear lag factor given; connections not modelled)');
    inputs = [
      inp('Fu', 'tensile strength', c.Fu, 'stress'), inp('Ag', 'gross area', g.A, 'area'),
      inp('An', net.An === undefined ? 'net area (assumed = Ag)' : `net area${from}`, an, 'area'),
      inp('U', net.U === undefined ? 'shear lag factor (assumed 1.0)' : `shear lag factor${from}`, u, 'ratio'),
      inp('Ae', 'effective net area', Ae, 'area'),
    ];
  }
  const Pn = c.Fu * Ae;
  return {
    capacity: factorOn(c.method, f) * Pn,
    head: {
      family: 'tension', code: c.code, clause: 'D2(b)', title: 'tensile rupture',
      equation: `${factorWords(c.method, f, c.method === 'lrfd' ? 'φt·Pn' : 'Pn/Ωt', 'Fu·Ae')} (Eq. D2-2), ${words}`,
      inputs: [...inputs, ...(assumed.length ? [inp('assumed', 'assumptions', assumed.join(', '), 'text')] : []), inp('Pn', 'nominal tensile strength', Pn, 'force'), factorInput(c.method, f, 't')],
      quantity: 'force',
      note: assumed.length ? `assumptions: ${assumed.join('; ')}` : undefined,
    },
  };
}
