/**
 * analyseModel: the dispatcher on settings analysis / buckling_modes / modes / design_code /
 * stability_warning, and what the design checks take from its summary.
 */
import { describe, expect, it } from 'vitest';
import { ModelBuilder, STEEL_E } from '../engine/builders.js';
import { analyseModel } from '../../../shared/stability/index.js';
import { checkMember, checkModel } from '../../../shared/design/index.js';
import { catalogueSection } from '../../../shared/sections/index.js';
import type { Model } from '../../../shared/model/types.js';

const within = (a: number, b: number, rtol: number) => expect(Math.abs(a - b)).toBeLessThanOrEqual(rtol * Math.max(1, Math.abs(a), Math.abs(b)));

const L = 4, EI = STEEL_E * 1e-4; // builder section: I_major = 1e-4 m⁴, A = 0.01 m²

/** Fixed-base cantilever column (plane XZ, vertical Z): P down and H along +X at the tip. */
function column(code: Model['settings']['designCode'], P: number, H: number): Model {
  const b = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', 0, 0, L).support('A', 'fixed').member('C', 'A', 'B')
    .loadCase('P').loadCase('H').nodeLoad('P', 'B', { fz: -P }).nodeLoad('H', 'B', { fx: H })
    .combination('U', { P: 1, H: 1 }).combination('S', { P: 1, H: 1 }, 'service');
  b.model.cases[1].category = 'wind';
  b.model.materials[0].fy = 345e6;
  b.model.settings.designCode = code;
  b.model.settings.analysis = 'second_order';
  return b.build();
}

/** Base moment of a cantilever beam-column, P axial and H lateral at the tip: H·tan(kL)/k, k = √(P/EI) (Timoshenko & Gere, beam-columns). */
const baseMoment = (P: number, H: number, EIe: number) => { const k = Math.sqrt(P / EIe); return (H * Math.tan(k * L)) / k; };

function loadingIndex(r: ReturnType<typeof analyseModel>, id: string): number {
  const i = r.analysis.loadings.findIndex((l) => l.id === id && l.kind === 'combination');
  if (i < 0) throw new Error(`no loading ${id}`);
  return i;
}

describe('analyseModel: AISC 360-22 direct analysis method', () => {
  const P = 200e3, H = 10e3;
  // αPr/Py ≤ 1.6·200 kN / (345 MPa · 0.01 m²) = 0.093 ≤ 0.5: τb = 1, EI* = 0.8·EI (C2.3)

  it('LRFD: strength at 0.8·EI (exact beam-column within 0.3%), service at the unreduced EI', () => {
    const r = analyseModel(column('aisc360-lrfd', P, H));
    const mU = Math.abs(r.analysis.memberForces(0, loadingIndex(r, 'U')).M_major[0]);
    const mS = Math.abs(r.analysis.memberForces(0, loadingIndex(r, 'S')).M_major[0]);
    within(mU, baseMoment(P, H, 0.8 * EI), 3e-3);
    within(mS, baseMoment(P, H, EI), 3e-3);
    expect(r.stability.method).toMatch(/^second-order elastic \(P-Δ and P-δ, \d+ sub-elements per member, axial forces converged to 1e-6\) — AISC 360-22 direct analysis method \(C2\): notional loads 0\.002αYi \(α = 1/);
    // the combination has lateral load: no notional loads (C2.2b(4) checked, drift ratio ≤ 1.7)
    expect(r.model.combinations.map((c) => c.id)).toEqual(['U', 'S']);
    expect(r.notes.join('\n')).toMatch(/C2\.2b\(4\) checked/);
  });

  it('ASD: analysed at 1.6× and divided by 1.6 — forces against an LRFD run of the same loads by the closed form', () => {
    const lrfd = analyseModel(column('aisc360-lrfd', P, H));
    const asd = analyseModel(column('aisc360-asd', P, H));
    const mL = Math.abs(lrfd.analysis.memberForces(0, loadingIndex(lrfd, 'U')).M_major[0]);
    const mA = Math.abs(asd.analysis.memberForces(0, loadingIndex(asd, 'U')).M_major[0]);
    // ASD: (1/1.6)·(1.6H)·tan(k'L)/k', k' = √(1.6P/0.8EI); LRFD: H·tan(kL)/k, k = √(P/0.8EI)
    const expected = baseMoment(1.6 * P, H, 0.8 * EI) / baseMoment(P, H, 0.8 * EI); // = 1.0492
    within(mA / mL, expected, 1e-3);
    within(mA, baseMoment(1.6 * P, H, 0.8 * EI), 3e-3);
    // axial force and base shear come back at the ASD level exactly: N = −P, V = H (statics)
    within(Math.abs(asd.analysis.memberForces(0, loadingIndex(asd, 'U')).N[0]), P, 1e-6);
    // the service combination is not scaled
    within(Math.abs(asd.analysis.memberForces(0, loadingIndex(asd, 'S')).M_major[0]), baseMoment(P, H, EI), 3e-3);
    expect(asd.stability.method).toMatch(/ASD combinations analysed at 1\.6× load and forces divided by 1\.6/);
  });

  it('gravity-only combinations are replaced by ±X notional variants, and the records name the method', () => {
    const m = column('aisc360-lrfd', P, H);
    m.combinations = [{ id: 'G', limitState: 'strength', terms: [{ case: 'P', factor: 1.4 }] }];
    const r = analyseModel(m);
    expect(r.analysis.loadings.filter((l) => l.kind === 'combination').map((l) => l.id)).toEqual(['G +X notional', 'G -X notional']);
    const so = r.stability.secondOrder.find((l) => l.loading === 'G +X notional')!;
    expect(so.additions).toMatch(/notional loads Ni = 0\.002·α·Yi along \+X/);
    // the base moment of the +X variant: Ni = 0.002·1.4P at the tip with axial 1.4P on 0.8EI
    const mG = Math.abs(r.analysis.memberForces(0, loadingIndex(r, 'G +X notional')).M_major[0]);
    within(mG, baseMoment(1.4 * P, 0.002 * 1.4 * P, 0.8 * EI), 3e-3);
    const d = checkModel(r.model, r.analysis, { stability: r.stability });
    expect(d.records.length).toBeGreaterThan(0);
    for (const rec of d.records) expect(rec.analysis).toBe(r.stability.method);
  });
});

describe('analyseModel: AISC 360-22 C2.2b(4)', () => {
  it('a lateral combination whose drift ratio exceeds 1.7 gets notional loads too', () => {
    // P = 0.9 MN on the fixed-free column: P/Pcr(0.8EI) = 0.9/(0.8·3.084) = 0.365, second- over first-order
    // drift ≈ 1/(1 − 0.365)/0.8 ≈ 1.97 (first order at the unreduced EI) > 1.7; αPr/Py = 0.9/3.45 = 0.26: τb = 1
    const P = 0.9e6, H = 10e3;
    const r = analyseModel(column('aisc360-lrfd', P, H));
    expect(r.model.combinations.map((c) => c.id)).toEqual(['U +X notional', 'U -X notional', 'S']);
    expect(r.notes.join('\n')).toMatch(/above 1\.7 in U: notional loads added/);
    // +X variant: H + 0.002·P at the tip (Ni = 0.002·1.0·Yi, C2-1), on 0.8·EI — exact beam-column within 0.3%
    const m = Math.abs(r.analysis.memberForces(0, loadingIndex(r, 'U +X notional')).M_major[0]);
    within(m, baseMoment(P, H + 0.002 * P, 0.8 * EI), 3e-3);
    const mMinus = Math.abs(r.analysis.memberForces(0, loadingIndex(r, 'U -X notional')).M_major[0]);
    within(mMinus, baseMoment(P, H - 0.002 * P, 0.8 * EI), 3e-3);
  });

  it('notional loads reach the supports: Σ horizontal reactions = −0.002·ΣYi (statics, two-column frame)', () => {
    const b = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', 6, 0, 0).node('C', 0, 0, L).node('D', 6, 0, L)
      .support('A', 'fixed').support('B', 'fixed').member('AC', 'A', 'C').member('BD', 'B', 'D').member('CD', 'C', 'D')
      .loadCase('D').memberLoad('D', 'CD', 'uniform', 'global_z', -30e3).combination('G', { D: 1.4 });
    b.model.materials[0].fy = 345e6;
    b.model.settings.designCode = 'aisc360-lrfd';
    b.model.settings.analysis = 'second_order';
    const r = analyseModel(b.build());
    const R = r.analysis.reactions(loadingIndex(r, 'G +X notional'));
    const ia = r.analysis.nodeIds.indexOf('A'), ib = r.analysis.nodeIds.indexOf('B');
    // ΣYi = 1.4 · 30 kN/m · 6 m = 252 kN → ΣNi = 0.504 kN along +X
    within(R[ia * 6] + R[ib * 6], -0.002 * 252e3, 1e-6);
  });
});

describe('analyseModel: EN 1993-1-1 second order', () => {
  it('adds the sway imperfection to every strength combination and reports αcr of each', () => {
    const m = column('en1993-1-1', 200e3, 10e3);
    const r = analyseModel(m);
    expect(r.analysis.loadings.filter((l) => l.kind === 'combination').map((l) => l.id)).toEqual(['U +X sway imperfection', 'U -X sway imperfection', 'S']);
    // αcr of the original combination: fixed-free column π²EI/(4L²)/P (Euler, K = 2) = 3.084e6/2e5 = 15.4, within 0.5%
    expect(r.stability.critical.map((c) => c.loading)).toEqual(['U']);
    within(r.stability.critical[0].alphaCr[0], (Math.PI ** 2 * EI) / (4 * L * L) / 200e3, 5e-3);
    // h = 4 m: αh = 2/√4 = 1; one column: m = 1, αm = 1 → φ = 1/200; imperfection force 0.005·200 kN = 1 kN at the tip
    const plus = r.model.combinations[0];
    const extra = plus.terms[plus.terms.length - 1].case;
    within(r.model.nodeLoads.find((nl) => nl.case === extra)!.values[0], 1e3, 1e-12);
    const mU = Math.abs(r.analysis.memberForces(0, loadingIndex(r, 'U +X sway imperfection')).M_major[0]);
    within(mU, baseMoment(200e3, 11e3, EI), 3e-3);
    expect(r.stability.method).toMatch(/EN 1993-1-1 5\.3\.2 global sway imperfection/);
  });
});

/** Portal frame, fixed bases, 4 m columns, 6 m beam, P down at each column top; braced = a diagonal truss. */
function portal(code: Model['settings']['designCode'], P: number, braced: boolean): Model {
  const b = new ModelBuilder({ planeNormal: 'Y' }).node('A', 0, 0, 0).node('B', 6, 0, 0).node('C', 0, 0, L).node('D', 6, 0, L)
    .support('A', 'fixed').support('B', 'fixed').member('AC', 'A', 'C').member('BD', 'B', 'D').member('CD', 'C', 'D')
    .loadCase('G').nodeLoad('G', 'C', { fz: -P }).nodeLoad('G', 'D', { fz: -P }).combination('ULS1', { G: 1 });
  if (braced) b.member('AD', 'A', 'D', { type: 'truss' });
  b.model.materials[0].fy = 355e6;
  b.model.settings.designCode = code;
  return b.build();
}

describe('analyseModel: first-order stability warning', () => {
  // bounds (Euler): sway portal, fixed bases, rigid beam: Pcr = π²EI/L² per column (K = 1) = 1.2337e7 N, a flexible
  // beam lowers it; braced: each column at least fixed–pinned, Pcr ≥ π²EI/(0.7L)² = 2.518e7 N (K = 0.7, from memory)
  const PcrSwayUpper = (Math.PI ** 2 * EI) / (L * L), PcrBracedLower = (Math.PI ** 2 * EI) / (0.7 * L) ** 2;

  it('EN: warns for the sway portal (αcr < 10) and names the combination; not for the braced one', () => {
    const P = 1.5e6;
    const sway = analyseModel(portal('en1993-1-1', P, false));
    expect(sway.stability.critical[0].alphaCr[0]).toBeLessThanOrEqual(PcrSwayUpper / P); // ≤ 8.2
    expect(sway.stability.warnings.map((w) => w.loading)).toEqual(['ULS1']);
    expect(sway.stability.warnings[0].message).toMatch(/combination ULS1: αcr = .* < 10 .*analysis = second_order/);
    const braced = analyseModel(portal('en1993-1-1', P, true));
    expect(braced.stability.critical[0].alphaCr[0]).toBeGreaterThanOrEqual(PcrBracedLower / P); // ≥ 16.8
    expect(braced.stability.warnings).toEqual([]);
  });

  it('AISC: warns where the amplifier exceeds 1.5 (αcr < 3), not at αcr ≈ 5–8', () => {
    const heavy = analyseModel(portal('aisc360-lrfd', 4.5e6, false));
    expect(heavy.stability.critical[0].alphaCr[0]).toBeLessThanOrEqual(PcrSwayUpper / 4.5e6); // ≤ 2.74: amplifier ≥ 1.57
    expect(heavy.stability.warnings.map((w) => w.reasons)).toEqual([['aisc360-22 C: amplifier > 1.5']]);
    expect(analyseModel(portal('aisc360-lrfd', 1.5e6, false)).stability.warnings).toEqual([]);
  });

  it('stability_warning = off suppresses it (and says so)', () => {
    const m = portal('en1993-1-1', 1.5e6, false);
    m.settings.stabilityWarning = false;
    const r = analyseModel(m);
    expect(r.stability.warnings).toEqual([]);
    expect(r.stability.critical).toEqual([]);
    expect(r.notes.join('\n')).toMatch(/stability_warning = off/);
  });

  it('no design code: no αcr and no warning', () => {
    const r = analyseModel(portal('none', 1.5e6, false));
    expect(r.stability.critical).toEqual([]);
    expect(r.stability.warnings).toEqual([]);
    expect(r.stability.method).toBe('first-order elastic');
  });

  it('the design checks carry the warning to each member in compression in that combination (the columns, not the unloaded beam)', () => {
    const r = analyseModel(portal('en1993-1-1', 1.5e6, false));
    const d = checkModel(r.model, r.analysis, { stability: r.stability });
    const row = (id: string) => d.members.find((u) => u.member === id)!;
    expect(row('AC').warnings[0]).toMatch(/^stability: first-order forces in combination ULS1 \(αcr = .*\) where αcr < 10 \(EN 1993-1-1 5\.2\.1\(3\)\)/);
    expect(row('BD').warnings[0]).toMatch(/^stability:/);
    expect(row('CD').warnings.some((w) => w.startsWith('stability:'))).toBe(false);
    const colRecords = d.records.filter((x) => x.member === 'AC' && x.family !== 'deflection');
    expect(colRecords.length).toBeGreaterThan(0);
    for (const rec of colRecords) expect(rec.stability).toMatch(/ULS1/);
  });
});

describe('analyseModel: what it refuses', () => {
  it('second order with moving loads is refused with a message, not run first order', () => {
    const m = column('none', 100e3, 1e3);
    m.movingLoads = [{ case: 'P', vehicle: 'V', lane: 'L1', direction: 'forward' }];
    expect(() => analyseModel(m)).toThrow(/second-order analysis cannot combine with moving-load envelopes/);
  });

  it('a loading beyond its critical load stops with its name', () => {
    // fixed-free column: Pcr = π²EI/(4L²) = 3.08 MN (Euler); 4 MN is beyond it
    expect(() => analyseModel(column('none', 4e6, 1e3))).toThrow(/combination U is not stable at this load level/);
  });
});

describe('analyseModel: requested modes', () => {
  it('buckling_modes = n gives n αcr per strength combination with shapes; modes = n natural modes', () => {
    const m = portal('none', 1e6, false);
    m.settings.bucklingModes = 2;
    m.materials[0].density = 7850;
    m.settings.modes = 2;
    const r = analyseModel(m);
    expect(r.stability.critical.length).toBe(1);
    expect(r.stability.critical[0].alphaCr.length).toBe(2);
    expect(r.stability.critical[0].shapes?.length).toBe(2);
    expect(r.stability.modes.length).toBe(2);
    expect(r.stability.totalMass).toBeDefined();
  });
});

describe('design records under second order', () => {
  /** W12X26 / HEB200 cantilever column, 4 m, gravity-only combination G = 1.4·P (catalogue sections). */
  function rolled(code: Model['settings']['designCode'], section: string): Model {
    const m = column(code, 300e3, 0);
    m.sections.push(catalogueSection(section)!);
    m.members[0].section = section;
    m.combinations = [{ id: 'G', limitState: 'strength', terms: [{ case: 'P', factor: 1.4 }] }];
    return m;
  }

  it('AISC: every record names the method; the compression record says K = 1 under the direct analysis method (C3)', () => {
    const r = analyseModel(rolled('aisc360-lrfd', 'W12X26'));
    const d = checkModel(r.model, r.analysis, { stability: r.stability });
    const comp = d.records.find((x) => x.family === 'compression' && x.status !== 'not checked')!;
    expect(comp).toBeDefined();
    expect(comp.note).toMatch(/K = 1: direct analysis method \(AISC 360-22 C3\)/);
    expect(comp.analysis).toMatch(/direct analysis method/);
    const li = r.analysis.loadings.findIndex((l) => l.id === 'G +X notional');
    const recs = checkMember(r.model, r.analysis, 0, li, { stability: r.stability });
    expect(recs.every((x) => x.analysis === r.stability.method)).toBe(true);
  });

  it('EN: the buckling record says the system length is used after the global second-order analysis (5.2.2(7)(b))', () => {
    const r = analyseModel(rolled('en1993-1-1', 'HEB200'));
    const d = checkModel(r.model, r.analysis, { stability: r.stability });
    const comp = d.records.filter((x) => x.family === 'compression' && x.status !== 'not checked');
    expect(comp.length).toBeGreaterThan(0);
    for (const x of comp) expect(x.note).toMatch(/K = 1: buckling length from the system length/);
  });

  it('a member given k_major says so instead', () => {
    const m = rolled('aisc360-lrfd', 'W12X26');
    m.members[0].kMajor = 2;
    const r = analyseModel(m);
    const d = checkModel(r.model, r.analysis, { stability: r.stability });
    expect(d.records.find((x) => x.family === 'compression' && x.status !== 'not checked')!.note).toMatch(/K given by the member \(k_major = 2, k_minor = 1\)/);
  });
});
