/**
 * Design records of envelope loadings: which envelope governed and where the vehicle stood.
 * The demand quantity of a check family decides which vehicle position is reported (for
 * interaction checks the major-axis moment, or N when the member carries no moment).
 */
import type { CheckRecord } from '../design/types.js';
import type { AnalysisResult, ForceKey, StationForces } from '../engine/types.js';

const KEY_OF: Record<string, ForceKey> = {
  tension: 'N', compression: 'N', bending_major: 'M_major', bending_minor: 'M_minor',
  shear_major: 'V_major', shear_minor: 'V_minor', torsion: 'T', deflection: 'd_major', combined: 'M_major',
};

/** Set `envelope` and `vehiclePosition` on a record of an envelope loading (no-op otherwise). */
export function stampVehicle(analysis: AnalysisResult, member: number, loading: number, sf: StationForces, rec: CheckRecord): CheckRecord {
  const ld = analysis.loadings[loading];
  if (!ld?.envelope || !analysis.moving) return rec;
  rec.envelope = ld.envelope;
  let key = KEY_OF[rec.family];
  if (!key) return rec;
  let st = 0;
  if (rec.x !== null) {
    let best = Infinity;
    for (let i = 0; i < sf.x.length; i++) {
      const dx = Math.abs(sf.x[i] - rec.x);
      if (dx < best) { best = dx; st = i; }
    }
  }
  if (rec.family === 'combined' && Math.abs(sf.M_major[st]) < 1e-9 * Math.max(1, Math.abs(sf.N[st]))) key = 'N';
  const at = analysis.moving.memberPosition(member, loading, key, st);
  if (at) rec.vehiclePosition = at.lead;
  return rec;
}
