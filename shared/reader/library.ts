/**
 * Sections and materials: the workbook's own rows, then built-in catalogue designations and
 * materials for names a member uses without defining them (a workbook row of the same name
 * wins over the built-in one).
 */
import { builtInMaterial } from '../materials/index.js';
import {
  SECTION_PROPS, type Material, type NetArea, type Section, type SectionDims, type SectionProps, type ShapeKind, type UnitSystem,
} from '../model/types.js';
import { formatNumber, fromSI, unitOf } from '../units/index.js';
import { catalogueSection, sectionProperties, validateDimensions } from '../sections/index.js';
import type { Problems } from './problems.js';
import type { ParsedTable } from './table.js';

/** Column names of the properties (canonical lower-case form → SectionProps key). */
const PROP_COLUMNS: Record<string, keyof SectionProps> = Object.fromEntries(SECTION_PROPS.map((p) => [p.toLowerCase(), p]));

const ZERO_PROPS: SectionProps = {
  A: 0, I_major: 0, I_minor: 0, J: 0, Cw: 0, S_major: 0, S_minor: 0, Z_major: 0, Z_minor: 0, Av_major: 0, Av_minor: 0, depth: 0,
};

/** `invalid` (optional) collects the materials whose row had an error already reported. */
export function readMaterials(t: ParsedTable | undefined, problems: Problems, invalid?: Set<string>): Map<string, Material> {
  const out = new Map<string, Material>();
  if (!t) return out;
  for (const r of t.rows) {
    const v = r.v;
    const id = v.material as string | undefined;
    if (id === undefined) continue;
    if (out.has(id)) {
      problems.error('materials', r.row, t.label.material ?? 'material', `material ${id} is defined twice (first on row ${out.get(id)!.row})`);
      continue;
    }
    if (r.invalid) invalid?.add(id);
    const E = v.e as number | undefined;
    if (E === undefined && !r.invalid) problems.error('materials', r.row, t.label.e ?? 'E', `material ${id} needs E`);
    const Ev = E ?? 0;
    let nu = v.nu as number | undefined;
    let G = v.g as number | undefined;
    if (G === undefined) {
      nu = nu ?? 0.3;
      G = Ev / (2 * (1 + nu));
    } else if (nu === undefined) {
      nu = Ev / (2 * G) - 1;
    }
    out.set(id, {
      id, E: Ev, G, nu, fy: v.fy as number | undefined, fu: v.fu as number | undefined,
      density: (v.density as number | undefined) ?? 0, alpha: (v.alpha as number | undefined) ?? 0, row: r.row,
    });
  }
  return out;
}

export interface SectionsRead {
  sections: Map<string, Section>;
  /** sections whose row had an error already reported */
  invalid: Set<string>;
  /** which property columns each section row gave (for requirement messages) */
  labels: Record<string, string>;
}

export function readSections(t: ParsedTable | undefined, problems: Problems, system: UnitSystem = 'metric'): SectionsRead {
  const sections = new Map<string, Section>();
  const invalid = new Set<string>();
  if (!t) return { sections, labels: {}, invalid };
  const lab = (c: string) => t.label[c] ?? c;
  for (const r of t.rows) {
    const v = r.v;
    const id = v.section as string | undefined;
    const shape = v.shape as ShapeKind | undefined;
    if (id === undefined) continue;
    if (sections.has(id)) {
      problems.error('sections', r.row, lab('section'), `section ${id} is defined twice (first on row ${sections.get(id)!.row})`);
      continue;
    }
    if (shape === undefined) continue; // already reported
    const dims: SectionDims = {};
    for (const c of ['d', 'bf', 'tf', 'tw', 'r', 'b', 't', 'h'] as const) {
      const x = v[c] as number | undefined;
      if (x === undefined) continue;
      // `D` and `d` are the same column name (case-insensitive): round shapes read it as D
      if (c === 'd' && (shape === 'chs' || shape === 'round')) dims.D = x;
      else dims[c] = x;
    }
    const given: (keyof SectionProps)[] = [];
    const props: SectionProps = { ...ZERO_PROPS };
    let ok = !r.invalid;
    if (shape !== 'custom') {
      const issues = validateDimensions(shape, dims);
      for (const i of issues) problems.error('sections', r.row, i.field === 'D' ? lab('d') : lab(i.field), `section ${id}: ${i.message}`);
      if (issues.length === 0 && ok) {
        try {
          const computed = sectionProperties(shape, dims);
          // huge dimensions can overflow a property (d⁴ of 1e80 m): refuse, never store it
          const bad = (Object.keys(computed) as (keyof SectionProps)[]).find((k) => !Number.isFinite(computed[k]));
          if (bad) {
            ok = false;
            problems.error('sections', r.row, lab(firstDimension(dims)), `section ${id}: the dimensions are so large that ${bad} overflows`);
          } else Object.assign(props, computed);
        } catch (e) {
          ok = false;
          problems.error('sections', r.row, lab('shape'), `section ${id}: properties of ${shape} sections cannot be computed (${(e as Error).message}); give them as a custom section`);
        }
      }
    }
    for (const [col, key] of Object.entries(PROP_COLUMNS)) {
      const x = v[col] as number | undefined;
      if (x === undefined) continue;
      props[key] = x;
      given.push(key);
    }
    if (shape === 'custom' && !given.includes('A') && !r.invalid) {
      problems.error('sections', r.row, lab('a'), `custom section ${id} needs A`);
    }
    if (!ok) invalid.add(id);
    const net = readNetArea('sections', r.row, `section ${id}`, v, ok ? props.A : undefined, lab, problems, system);
    sections.set(id, { id, shape, dims, props, given, ...(net ? { net } : {}), row: r.row });
  }
  return { sections, labels: t.label, invalid };
}

function firstDimension(dims: SectionDims): string {
  const k = Object.keys(dims)[0] ?? 'shape';
  return k === 'D' ? 'd' : k;
}

/**
 * The tension net area columns of a sections or members row (`an`, `u`, `ae`, already in SI),
 * or undefined when none is given. U and Ae on one row are refused (Ae = U·An: say one);
 * An and Ae may not exceed the gross area A where it is known.
 */
export function readNetArea(
  table: string, row: number, what: string, v: Record<string, unknown>, A: number | undefined,
  lab: (c: string) => string, problems: Problems, system: UnitSystem,
): NetArea | undefined {
  const area = (x: number) => `${formatNumber(fromSI(x, 'area', system))} ${unitOf('area', system)}`;
  const net: NetArea = {};
  if (v.an !== undefined) net.An = v.an as number;
  if (v.u !== undefined) net.U = v.u as number;
  if (v.ae !== undefined) net.Ae = v.ae as number;
  if (net.An === undefined && net.U === undefined && net.Ae === undefined) return undefined;
  if (net.U !== undefined && net.Ae !== undefined) {
    problems.error(table, row, lab('ae'), `${what}: give either U (with An or the gross area) or Ae, not both (Ae = U·An)`);
  }
  const tol = A !== undefined ? A * 1e-9 : 0;
  if (A !== undefined && A > 0) {
    if (net.An !== undefined && net.An > A + tol) {
      problems.error(table, row, lab('an'), `${what}: An = ${area(net.An)} exceeds the gross area A = ${area(A)}`);
    }
    if (net.Ae !== undefined && net.Ae > A + tol) {
      problems.error(table, row, lab('ae'), `${what}: Ae = ${area(net.Ae)} exceeds the gross area A = ${area(A)}`);
    }
  }
  return net;
}

/** The section a member names: the workbook's own first, then the catalogue. */
export function resolveSection(name: string, own: Map<string, Section>, used: Map<string, Section>): Section | undefined {
  const s = own.get(name) ?? used.get(name);
  if (s) return s;
  const c = catalogueSection(name);
  if (c) {
    const entry = { ...c, id: name, builtIn: true };
    used.set(name, entry);
    return entry;
  }
  return undefined;
}

export function resolveMaterial(name: string, own: Map<string, Material>, used: Map<string, Material>): Material | undefined {
  const m = own.get(name) ?? used.get(name);
  if (m) return m;
  const b = builtInMaterial(name);
  if (b) {
    const entry = { ...b, id: name, builtIn: true };
    used.set(name, entry);
    return entry;
  }
  return undefined;
}
