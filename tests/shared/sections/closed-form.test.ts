/**
 * Section properties against closed-form expressions written out beside each expectation.
 * Tolerance 1e-9 relative (the same formula evaluated two ways) unless stated.
 */
import { describe, expect, it } from 'vitest';
import { anglePrincipalAxes, sectionProperties } from '../../../shared/sections/index.js';
import { close, MM } from './helpers.js';

const R = 1e-9;

describe('solid rectangle', () => {
  const b = 200 * MM, h = 400 * MM;
  const p = sectionProperties('rect', { h, b });
  it('gives A = bh, I = bh³/12 and hb³/12, S = bh²/6, Z = bh²/4', () => {
    close(p.A, b * h, R);
    close(p.I_major, (b * h ** 3) / 12, R);
    close(p.I_minor, (h * b ** 3) / 12, R);
    close(p.S_major, (b * h * h) / 6, R);
    close(p.S_minor, (h * b * b) / 6, R);
    close(p.Z_major, (b * h * h) / 4, R);
    close(p.Z_minor, (h * b * b) / 4, R);
    expect(p.depth).toBe(h);
  });
  it('gives the torsion constant of Roark Table 10.1 (β = 0.229 for a/c = 2; 0.141 for a square; from memory, 1 %)', () => {
    close(p.J, 0.229 * h * b ** 3, 0.01);
    const sq = sectionProperties('rect', { h: 0.1, b: 0.1 });
    close(sq.J, 0.141 * 0.1 ** 4, 0.01);
  });
  it('keeps the names on the axes for a flat bar laid flat (tables.md): I_major = b·h³/12 even when b > h', () => {
    const flat = sectionProperties('rect', { h: 10 * MM, b: 100 * MM });
    close(flat.I_major, (0.1 * 0.01 ** 3) / 12, R);
    expect(flat.I_minor).toBeGreaterThan(flat.I_major);
  });
});

describe('solid round bar', () => {
  const D = 50 * MM;
  const p = sectionProperties('round', { D });
  it('gives πD²/4, πD⁴/64, πD³/32, D³/6 and J = πD⁴/32', () => {
    close(p.A, (Math.PI * D * D) / 4, R);
    close(p.I_major, (Math.PI * D ** 4) / 64, R);
    close(p.I_minor, (Math.PI * D ** 4) / 64, R);
    close(p.S_major, (Math.PI * D ** 3) / 32, R);
    close(p.Z_major, D ** 3 / 6, R);
    close(p.J, (Math.PI * D ** 4) / 32, R);
  });
});

describe('circular hollow section', () => {
  const D = 219.1 * MM, t = 8 * MM, d = D - 2 * t;
  const p = sectionProperties('chs', { D, t });
  it('gives π(D²−d²)/4, π(D⁴−d⁴)/64, (D³−d³)/6 and J = 2I', () => {
    close(p.A, (Math.PI * (D * D - d * d)) / 4, R);
    close(p.I_major, (Math.PI * (D ** 4 - d ** 4)) / 64, R);
    close(p.S_minor, (Math.PI * (D ** 4 - d ** 4)) / 32 / D, R);
    close(p.Z_major, (D ** 3 - d ** 3) / 6, R);
    close(p.J, (Math.PI * (D ** 4 - d ** 4)) / 32, R);
  });
  it('agrees with the thin-walled Bredt value 4·Am²·t/p = π·(D − t)³·t/4 within (t/D)² (0.2 %)', () => {
    close(p.J, (Math.PI * (D - t) ** 3 * t) / 4, 0.002);
  });
  it('matches CHS 219.1×8 of EN 10210-2 tables: A = 53.1 cm², I = 2960 cm⁴ (from memory, 0.5 %)', () => {
    close(p.A, 53.1e-4, 0.005);
    close(p.I_major, 2960e-8, 0.005);
  });
});

describe('doubly symmetric I by parts (welded, r = 0): d 400, bf 200, tf 16, tw 10 mm', () => {
  const d = 0.4, bf = 0.2, tf = 0.016, tw = 0.01, hw = d - 2 * tf;
  const p = sectionProperties('i', { d, bf, tf, tw });
  it('A = 2·bf·tf + hw·tw; I = (bf·d³ − (bf − tw)·hw³)/12; Iz = 2·tf·bf³/12 + hw·tw³/12', () => {
    close(p.A, 2 * bf * tf + hw * tw, R);
    close(p.I_major, (bf * d ** 3 - (bf - tw) * hw ** 3) / 12, R);
    close(p.I_minor, (2 * tf * bf ** 3) / 12 + (hw * tw ** 3) / 12, R);
    close(p.S_major, (bf * d ** 3 - (bf - tw) * hw ** 3) / 6 / d, R);
  });
  it('Z = bf·tf·(d − tf) + tw·hw²/4 and Zz = tf·bf²/2 + hw·tw²/4 (plastic moduli by parts)', () => {
    close(p.Z_major, bf * tf * (d - tf) + (tw * hw * hw) / 4, R);
    close(p.Z_minor, (tf * bf * bf) / 2 + (hw * tw * tw) / 4, R);
  });
  it('J = (2·bf·tf³ + (d − tf)·tw³)/3 and Cw = tf·bf³·(d − tf)²/24 (AISC Design Guide 9, from memory)', () => {
    close(p.J, (2 * bf * tf ** 3 + (d - tf) * tw ** 3) / 3, R);
    close(p.Cw, (tf * bf ** 3 * (d - tf) ** 2) / 24, R);
  });
  it('shear areas: d·tw (AISC G2.1) and 2·bf·tf (AISC G6)', () => {
    close(p.Av_major, d * tw, R);
    close(p.Av_minor, 2 * bf * tf, R);
  });
  it('root fillets add (4 − π)·r² to the area', () => {
    const r = 0.02;
    const q = sectionProperties('i', { d, bf, tf, tw, r });
    close(q.A - p.A, (4 - Math.PI) * r * r, 1e-9);
    expect(q.I_major).toBeGreaterThan(p.I_major);
  });
});

describe('rectangular hollow section (outer corner radius 2t, inner t)', () => {
  const h = 0.3, b = 0.2, t = 0.01;
  const p = sectionProperties('rhs', { h, b, t });
  it('A = t·(2(h + b) − 16t + 3πt): mid-line perimeter times t for these radii', () => {
    close(p.A, t * (2 * (h + b) - 16 * t + 3 * Math.PI * t), 1e-9);
  });
  it('lies below the sharp-cornered box (b·h³ − (b − 2t)(h − 2t)³)/12 by less than the four outer corner spandrels, area (1 − π/4)(2t)² each, at h/2', () => {
    const sharp = (b * h ** 3 - (b - 2 * t) * (h - 2 * t) ** 3) / 12;
    const bound = 4 * (1 - Math.PI / 4) * (2 * t) ** 2 * (h / 2) ** 2;
    expect(p.I_major).toBeLessThan(sharp);
    expect(sharp - p.I_major).toBeLessThan(bound);
    const zSharp = (b * h * h) / 4 - ((b - 2 * t) * (h - 2 * t) ** 2) / 4;
    expect(p.Z_major).toBeLessThan(zSharp);
    expect(zSharp - p.Z_major).toBeLessThan(4 * (1 - Math.PI / 4) * (2 * t) ** 2 * (h / 2));
  });
  it('J = 4·Ap²·t/p on the mid-line (Bredt–Batho), Ap = (h−t)(b−t) − (4−π)·rm², p = 2(h−t) + 2(b−t) − (8−2π)·rm, rm = 1.5t', () => {
    const rm = 1.5 * t;
    const Ap = (h - t) * (b - t) - (4 - Math.PI) * rm * rm;
    const per = 2 * (h - t) + 2 * (b - t) - (8 - 2 * Math.PI) * rm;
    close(p.J, (4 * Ap * Ap * t) / per, 1e-9);
  });
  it('a square tube has equal properties about both axes', () => {
    const s = sectionProperties('rhs', { h: 0.2, b: 0.2, t: 0.008 });
    close(s.I_major, s.I_minor, 1e-12);
    close(s.Z_major, s.Z_minor, 1e-12);
  });
});

describe('channel (sharp corners): d 200, bf 75, tf 11.5, tw 8.5 mm', () => {
  const d = 0.2, bf = 0.075, tf = 0.0115, tw = 0.0085, hw = d - 2 * tf;
  const p = sectionProperties('channel', { d, bf, tf, tw });
  const A = 2 * bf * tf + hw * tw;
  const xBar = (2 * bf * tf * (bf / 2) + hw * tw * (tw / 2)) / A; // 22.01 mm
  it('centroid x̄ = Σ(A·x)/A from the web back and I about both axes by parts', () => {
    close(p.A, A, R);
    close(xBar, 0.02201, 1e-3);
    close(p.I_major, (bf * d ** 3 - (bf - tw) * hw ** 3) / 12, R);
    const Iz = 2 * ((tf * bf ** 3) / 12 + bf * tf * (bf / 2 - xBar) ** 2) + (hw * tw ** 3) / 12 + hw * tw * (xBar - tw / 2) ** 2;
    close(p.I_minor, Iz, R);
    close(p.S_minor, Iz / (bf - xBar), R); // extreme fibre at the flange tips
  });
  it('minor-axis plastic modulus about the equal-area axis: here inside the web at xp = A/(2d)', () => {
    const xp = A / (2 * d); // d·tw > A/2, so the axis cuts the web
    expect(xp).toBeLessThan(tw);
    const Z = (d * xp * xp) / 2 + (d * (tw - xp) ** 2) / 2 + tf * ((bf - xp) ** 2 - (tw - xp) ** 2);
    close(p.Z_minor, Z, 1e-9);
  });
  it('Cw and J on centrelines (AISC Design Guide 9 closed forms, from memory)', () => {
    const b1 = bf - tw / 2, h1 = d - tf;
    close(p.J, (2 * b1 * tf ** 3 + h1 * tw ** 3) / 3, R);
    close(p.Cw, ((tf * b1 ** 3 * h1 ** 2) / 12) * ((3 * b1 * tf + 2 * h1 * tw) / (6 * b1 * tf + h1 * tw)), R);
  });
});

describe('tee (sharp corners)', () => {
  it('puts the plastic neutral axis in the flange when bf·tf ≥ A/2: d = bf = 100, tf = tw = 10 mm', () => {
    const p = sectionProperties('tee', { d: 0.1, bf: 0.1, tf: 0.01, tw: 0.01 });
    // A = 1900 mm², zp = 950/100 = 9.5 mm below the top
    // Z = bf·zp²/2 + bf·(tf − zp)²/2 + tw·hs·(tf − zp + hs/2) = 4512.5 + 12.5 + 40950 mm³
    close(p.Z_major, 45475e-9, 1e-9);
    // centroid ȳ = (1000·5 + 900·55)/1900 = 28.684 mm; I by parts
    const zBar = (1000 * 5 + 900 * 55) / 1900;
    const I = (100 * 1000) / 12 + 1000 * (zBar - 5) ** 2 + (10 * 90 ** 3) / 12 + 900 * (55 - zBar) ** 2;
    close(p.I_major, I * 1e-12, R);
    close(p.S_major, (I / (100 - zBar)) * 1e-9, R);
  });
  it('puts the plastic neutral axis in the stem when the stem holds more than half the area', () => {
    const d = 0.3, bf = 0.1, tf = 0.01, tw = 0.01;
    const p = sectionProperties('tee', { d, bf, tf, tw });
    const A = bf * tf + (d - tf) * tw; // 3900 mm²
    const zp = tf + (A / 2 - bf * tf) / tw; // 105 mm below the top
    const Z = bf * tf * (zp - tf / 2) + (tw * (zp - tf) ** 2) / 2 + (tw * (d - zp) ** 2) / 2;
    close(p.Z_major, Z, 1e-9);
    close(p.Z_minor, (tf * bf * bf) / 4 + ((d - tf) * tw * tw) / 4, R);
  });
});

describe('angle about its principal axes', () => {
  it('equal angle 100×100×10: major axis along the axis of symmetry (α = 45°), centroid (b² + bt − t²)/(2(2b − t))', () => {
    const dims = { d: 0.1, b: 0.1, t: 0.01 };
    const ax = anglePrincipalAxes(dims);
    const p = sectionProperties('angle', dims);
    close(ax.alpha, Math.PI / 4, 1e-12);
    close(ax.yBar, (0.01 + 0.001 - 0.0001) / (2 * 0.19), 1e-9);
    close(ax.Iy, ax.Iz, 1e-12);
    close(p.I_major, ax.Iy + Math.abs(ax.Iyz), 1e-12);
    close(p.I_minor, ax.Iy - Math.abs(ax.Iyz), 1e-12);
    // EN 10056-1 L100×100×10 (root radius 12 mm): Iu = 284, Iv = 74.1 cm⁴ (from memory);
    // the sharp-cornered outline gives 286.6 / 73.4 — the root fillet explains the 1 %
    close(p.I_major, 284e-8, 0.015);
    close(p.I_minor, 74.1e-8, 0.015);
  });
  it('equal angle: Z about the axis of symmetry = √2·(t(b² − t²)/2 − (b − t)t²/2 + t³/6)', () => {
    const b = 0.1, t = 0.01;
    const p = sectionProperties('angle', { d: b, b, t });
    close(p.Z_major, Math.SQRT2 * ((t * (b * b - t * t)) / 2 - ((b - t) * t * t) / 2 + t ** 3 / 6), 1e-9);
  });
  it('unequal angle L6×4×1/2: tan α = 0.440, Ix = 17.3 in⁴, Iy = 6.22 in⁴ (AISC Manual Table 1-7, from memory; 1.5 %, toe/root fillets ignored)', () => {
    const dims = { d: 6 * 0.0254, b: 4 * 0.0254, t: 0.5 * 0.0254 };
    const ax = anglePrincipalAxes(dims);
    const in4 = 0.0254 ** 4;
    close(Math.tan(ax.alpha), 0.44, 0.01);
    close(ax.Iy / in4, 17.3, 0.015);
    close(ax.Iz / in4, 6.22, 0.015);
    // invariants of the rotation: trace and determinant
    const p = sectionProperties('angle', dims);
    close(p.I_major + p.I_minor, ax.Iy + ax.Iz, 1e-12);
    close(p.I_major * p.I_minor, ax.Iy * ax.Iz - ax.Iyz * ax.Iyz, 1e-9);
    close(p.A, (6 + 4 - 0.5) * 0.5 * 0.0254 ** 2, R);
  });
});
