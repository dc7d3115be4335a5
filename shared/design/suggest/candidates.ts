/**
 * Candidates of a section suggestion: the family a member's section belongs to (a catalogue
 * series, or the model's own sections of that shape), the sections of that family ordered by
 * mass per length, and the limits (maximum depth, same width).
 */
import type { Model, Section, ShapeKind } from '../../model/types.js';
import { CATALOGUE_SERIES, catalogueSection, normaliseDesignation } from '../../sections/catalogue/index.js';
import type { SuggestLimits } from './types.js';

let seriesOfName: Map<string, string> | undefined;

/** The catalogue series of a designation ("W14X48" → "W"), or undefined. */
export function seriesOf(designation: string): string | undefined {
  if (!seriesOfName) {
    seriesOfName = new Map();
    for (const s of CATALOGUE_SERIES) {
      for (const e of s.entries) for (const k of [e.name, ...(e.aliases ?? [])]) {
        const key = normaliseDesignation(k);
        if (!seriesOfName.has(key)) seriesOfName.set(key, s.series);
      }
    }
  }
  return seriesOfName.get(normaliseDesignation(designation));
}

/** A section of the model (its own or a catalogue one it uses), else the catalogue's. */
export function sectionById(model: Model, id: string): Section | undefined {
  return model.sections.find((s) => s.id === id) ?? catalogueSection(id);
}

/**
 * The family of a member's section: catalogue sections (built in) belong to their series;
 * the model's own sections to "own <shape>".
 */
export function familyOf(section: Section): { key: string; series?: string; shape: ShapeKind } {
  const series = section.builtIn ? seriesOf(section.id) : undefined;
  return series ? { key: `series:${series}:${section.shape}`, series, shape: section.shape } : { key: `own:${section.shape}`, shape: section.shape };
}

export function familyLabel(f: { series?: string; shape: ShapeKind }): string {
  return f.series ? `${f.series} series and the model's own ${f.shape} sections` : `the model's own ${f.shape} sections`;
}

/**
 * The sections of a family: the catalogue series (when the section is a catalogue one) and the
 * model's own sections of the same shape; one per id, lightest first (area, then id).
 */
export function familySections(model: Model, f: { series?: string; shape: ShapeKind }): Section[] {
  const out = new Map<string, Section>();
  if (f.series) {
    const series = CATALOGUE_SERIES.find((s) => s.series === f.series);
    for (const e of series?.entries ?? []) {
      if (e.shape !== f.shape) continue;
      // the model's spelling of a designation it already uses, else the canonical one
      const inModel = model.sections.find((s) => s.builtIn && normaliseDesignation(s.id) === normaliseDesignation(e.name));
      const s = inModel ?? catalogueSection(e.name);
      if (s) out.set(s.id, s);
    }
  }
  for (const s of model.sections) if (!s.builtIn && s.shape === f.shape) out.set(s.id, s);
  return [...out.values()].filter((s) => s.props.A > 0).sort((a, b) => a.props.A - b.props.A || a.id.localeCompare(b.id));
}

/** Overall depth of a section (m): the depth property, else undefined. */
export function depthOf(s: Section): number | undefined {
  const d = s.props.depth;
  return d > 0 ? d : undefined;
}

/** The width kept by `keepWidth`: bf of I, channel and tee; b of hollow and solid rectangles and angles; D of round shapes. */
export function widthOf(s: Section): number | undefined {
  const d = s.dims;
  switch (s.shape) {
    case 'i': case 'channel': case 'tee': return d.bf;
    case 'rhs': case 'rect': case 'angle': return d.b;
    case 'chs': case 'round': return d.D;
    default: return undefined;
  }
}

/** Widths equal within half a millimetre (rolled tolerances are larger; tabulated values round to 0.1 mm). */
const WIDTH_TOLERANCE = 0.5e-3;

/**
 * Whether a candidate meets the limits for members whose sections are `current`; else why not.
 */
export function withinLimits(candidate: Section, current: Section[], limits: SuggestLimits): string | null {
  if (limits.maxDepth !== undefined) {
    const depth = depthOf(candidate);
    if (depth === undefined) return 'depth unknown';
    if (depth > limits.maxDepth * (1 + 1e-9)) return 'deeper than the maximum depth';
  }
  if (limits.keepWidth) {
    const w = widthOf(candidate);
    if (w === undefined) return 'width unknown';
    for (const c of current) {
      const wc = widthOf(c);
      if (wc === undefined || Math.abs(wc - w) > WIDTH_TOLERANCE) return 'width differs';
    }
  }
  return null;
}
