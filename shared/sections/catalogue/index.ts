/**
 * The built-in catalogue: standard rolled shapes by designation. Each series file states
 * its source. Dimensions are converted to SI here; properties are computed from the
 * dimensions (../properties.ts) and the series' tabulated values, where recalled, take
 * precedence (they are listed in `given`, as "values that override computed ones").
 */
import type { Section, SectionProps } from '../../model/types.js';
import { sectionProperties } from '../properties.js';
import { HEA, HEB } from './he.js';
import { HSS_RECT } from './hss-rect.js';
import { HSS_ROUND, PIPE } from './hss-round.js';
import { IPE } from './ipe.js';
import type { CatalogueEntry, CatalogueSeries } from './types.js';
import { W } from './w.js';
import { UPN } from './upn.js';
import { ANGLES } from './angles.js';
import { CHS, RHS, SHS } from './en-hollow.js';

export const CATALOGUE_SERIES: readonly CatalogueSeries[] = [IPE, HEA, HEB, W, HSS_RECT, HSS_ROUND, PIPE, UPN, ANGLES, SHS, RHS, CHS];

/**
 * The lookup key of a designation: upper case, spaces removed, decimal numbers written
 * canonically ("HSS16.000X.500" and "HSS16X0.5" give the same key).
 */
export function normaliseDesignation(s: string): string {
  return s
    .replace(/\s+/g, '')
    .toUpperCase()
    .replace(/\d*\.\d+|\d+\.(?!\d)/g, (m) => String(parseFloat(m)));
}

const LENGTH = { mm: 1e-3, in: 0.0254 } as const;
/** length unit of tabulated properties: cm for mm series, in for inch series */
const PROP_LENGTH = { mm: 1e-2, in: 0.0254 } as const;
const POWER: Record<keyof SectionProps, number> = {
  A: 2, I_major: 4, I_minor: 4, J: 4, Cw: 6, S_major: 3, S_minor: 3, Z_major: 3, Z_minor: 3, Av_major: 2, Av_minor: 2, depth: 1,
};

let index: Map<string, { series: CatalogueSeries; entry: CatalogueEntry }> | undefined;

function lookup() {
  if (!index) {
    index = new Map();
    for (const series of CATALOGUE_SERIES) {
      for (const entry of series.entries) {
        for (const key of [entry.name, ...(entry.aliases ?? [])]) {
          const k = normaliseDesignation(key);
          if (!index.has(k)) index.set(k, { series, entry });
        }
      }
    }
  }
  return index;
}

function build(series: CatalogueSeries, entry: CatalogueEntry): Section {
  const L = LENGTH[series.unit];
  const dims: Section['dims'] = {};
  for (const [k, v] of Object.entries(entry.dims) as [keyof Section['dims'], number][]) dims[k] = v * L;
  const props = sectionProperties(entry.shape, dims);
  const given: (keyof SectionProps)[] = [];
  const P = PROP_LENGTH[series.unit];
  for (const [k, v] of Object.entries(entry.tabulated ?? {}) as [keyof SectionProps, number][]) {
    if (v === undefined) continue;
    props[k] = v * P ** POWER[k];
    given.push(k);
  }
  return { id: entry.name, shape: entry.shape, dims, props, given, source: series.source, builtIn: true };
}

/** A catalogue section by designation (case-insensitive, spaces ignored), or undefined. */
export function catalogueSection(designation: string): Section | undefined {
  const hit = lookup().get(normaliseDesignation(designation));
  return hit ? build(hit.series, hit.entry) : undefined;
}

/** All catalogue designations (canonical names). */
export function catalogueDesignations(): string[] {
  return CATALOGUE_SERIES.flatMap((s) => s.entries.map((e) => e.name));
}
