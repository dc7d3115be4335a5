/**
 * Issue 14 item 6: a rerun of the same connectivity (an edit of sections) reuses the kept
 * ordering and symbolic analysis (shared/engine/solverBridge.ts) and gives the answers of a
 * fresh analysis to 1e-12 (relative); a changed pattern (a new member, a member moved to
 * another node) never reuses a stale analysis. Expected values: the same model analysed from
 * scratch (no kept analysis) — the reference is the computation itself, no engineering figure.
 * Model: the bench's 3D frame (bench/engine.ts, demo data: 20 cases, 30 combinations, member
 * loads including point loads).
 */
import { beforeEach, describe, expect, it } from 'vitest';
import { buildFrameModel } from '../../../bench/engine.js';
import { analyse } from '../../../shared/engine/index.js';
import { forgetPatterns } from '../../../shared/engine/solverBridge.js';
import type { AnalysisResult } from '../../../shared/engine/types.js';
import { FORCE_KEYS } from '../../../shared/engine/types.js';
import type { Model } from '../../../shared/model/types.js';

const frame = (): Model => buildFrameModel(3, 2, 4, 'aisc360-lrfd');

/** Largest |a − b| / max(1e-300, largest |b| of the same quantity) over every result. */
function worstRelative(a: AnalysisResult, b: AnalysisResult): number {
  let worst = 0;
  const cmp = (x: ArrayLike<number>, y: ArrayLike<number>) => {
    expect(x.length).toBe(y.length);
    let scale = 0;
    for (let i = 0; i < y.length; i++) scale = Math.max(scale, Math.abs(y[i]));
    for (let i = 0; i < y.length; i++) worst = Math.max(worst, Math.abs(x[i] - y[i]) / Math.max(scale, 1e-300));
  };
  expect(a.loadings.map((l) => l.id)).toEqual(b.loadings.map((l) => l.id));
  for (let l = 0; l < b.loadings.length; l++) {
    cmp(a.displacements(l), b.displacements(l));
    cmp(a.reactions(l), b.reactions(l));
    for (let m = 0; m < b.memberIds.length; m++) {
      const fa = a.memberForces(m, l), fb = b.memberForces(m, l);
      cmp(fa.x, fb.x);
      for (const k of FORCE_KEYS) cmp(fa[k], fb[k]);
    }
  }
  return worst;
}

/** Ordering time of an analysis: exactly 0 when the kept pattern analysis was reused. */
const orderingMs = (r: AnalysisResult) => r.diagnostics.timings.ordering;

describe('rerun after an edit of sections: kept ordering and symbolic analysis', () => {
  beforeEach(() => forgetPatterns());

  it('reuses the kept analysis of the same connectivity and agrees with a fresh analysis to 1e-12', () => {
    const first = analyse(frame());
    expect(orderingMs(first)).toBeGreaterThan(0);
    // the grid edit: one beam and one column get another section (stiffness and self weight change)
    const edited = frame();
    edited.members = edited.members.map((m) => (m.id === 'BX1_1_2' ? { ...m, section: 'COL' } : m.id === 'C2_1_3' ? { ...m, section: 'BEAM' } : m));
    const reused = analyse(edited);
    expect(orderingMs(reused)).toBe(0);
    forgetPatterns();
    const fresh = analyse(edited);
    expect(orderingMs(fresh)).toBeGreaterThan(0);
    expect(worstRelative(reused, fresh)).toBeLessThan(1e-12);
    // and the edit did change the results (the comparison is not of two equal inputs)
    expect(worstRelative(first, fresh)).toBeGreaterThan(1e-6);
  });

  it('a new member gets a fresh analysis, never the kept one', () => {
    analyse(frame());
    const more = frame();
    // a brace between two free nodes not yet joined: new off-diagonal blocks in K
    more.members.push({ ...more.members.find((m) => m.type === 'truss')!, id: 'XNEW', start: 'N0_0_1', end: 'N1_1_2' });
    const after = analyse(more);
    expect(orderingMs(after)).toBeGreaterThan(0);
    forgetPatterns();
    expect(worstRelative(after, analyse(more))).toBeLessThan(1e-12);
    expect(after.diagnostics.equilibrium.every((e) => e.residual < 1e-9)).toBe(true);
  });

  it('reuse is decided by the pattern of K itself: a new member to a fixed base adds no entry, reuses, and agrees', () => {
    analyse(frame());
    const more = frame();
    // N1_1_0 is fixed (no equations): the new brace only adds to N2_1_1's own diagonal block
    more.members.push({ ...more.members.find((m) => m.type === 'truss')!, id: 'XBASE', start: 'N1_1_0', end: 'N2_1_1' });
    const after = analyse(more);
    expect(orderingMs(after)).toBe(0);
    forgetPatterns();
    expect(worstRelative(after, analyse(more))).toBeLessThan(1e-12);
  });

  it('a member moved to another node (same member count) gets a fresh analysis', () => {
    analyse(frame());
    const moved = frame();
    moved.members = moved.members.map((m) => (m.id === 'X0_2' ? { ...m, end: 'N2_0_2' } : m));
    const after = analyse(moved);
    expect(orderingMs(after)).toBeGreaterThan(0);
    forgetPatterns();
    expect(worstRelative(after, analyse(moved))).toBeLessThan(1e-12);
  });
});
