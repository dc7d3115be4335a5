/**
 * Tension net-area data (sections or members table, tables.md): the member's own values
 * override the section's as a whole (a member that gives any of An, U, Ae uses only its
 * own). Checked here once for both codes.
 */
import type { NetArea } from '../model/types.js';

/** The net-area data that applies to a member and where it came from. */
export function memberNetArea(memberId: string, sectionId: string, memberNet?: NetArea, sectionNet?: NetArea): { net: NetArea; source: string } {
  const has = (n?: NetArea) => !!n && (n.An !== undefined || n.U !== undefined || n.Ae !== undefined);
  if (has(memberNet)) return { net: memberNet!, source: `member ${memberId}` };
  if (has(sectionNet)) return { net: sectionNet!, source: `section ${sectionId}` };
  return { net: {}, source: '' };
}

/** Why net-area data cannot be used, or null (An, Ae in (0, Ag]; U in (0, 1]). */
export function netAreaProblem(Ag: number, net: NetArea): string | null {
  const tol = 1e-9 * Ag;
  const rel = (v: number) => `${(v / Ag).toPrecision(4)}·Ag`;
  if (net.An !== undefined && !(net.An > 0 && net.An <= Ag + tol)) return `net area An = ${rel(net.An)} is not in (0, Ag]: rupture not evaluated`;
  if (net.Ae !== undefined && !(net.Ae > 0 && net.Ae <= Ag + tol)) return `effective net area Ae = ${rel(net.Ae)} is not in (0, Ag]: rupture not evaluated`;
  if (net.U !== undefined && !(net.U > 0 && net.U <= 1)) return `shear lag factor U = ${net.U} is not in (0, 1]: rupture not evaluated`;
  return null;
}
