/**
 * Section properties and the built-in catalogue. (Contract stub: the sections work
 * replaces the bodies; signatures stay.)
 */
import type { Section, SectionDims, SectionProps, ShapeKind } from '../model/types.js';

/** Which dimensions each shape needs (tables.md "sections"); `r` is optional for `i`. */
export const SHAPE_DIMENSIONS: Record<ShapeKind, (keyof SectionDims)[]> = {
  i: ['d', 'bf', 'tf', 'tw'],
  channel: ['d', 'bf', 'tf', 'tw'],
  angle: ['d', 'b', 't'],
  tee: ['d', 'bf', 'tf', 'tw'],
  rhs: ['h', 'b', 't'],
  chs: ['D', 't'],
  rect: ['h', 'b'],
  round: ['D'],
  custom: [],
};

/** Problems with a shape's dimensions (missing, negative, impossible such as t >= d/2). */
export function validateDimensions(shape: ShapeKind, dims: SectionDims): { field: keyof SectionDims; message: string }[] {
  const out: { field: keyof SectionDims; message: string }[] = [];
  for (const f of SHAPE_DIMENSIONS[shape]) {
    const v = dims[f];
    if (v === undefined) out.push({ field: f, message: `${shape} sections need ${f}` });
    else if (!(v > 0)) out.push({ field: f, message: `${f} must be greater than zero` });
  }
  return out;
}

/** Properties of a dimensioned shape (SI). Call only after validateDimensions returned []. */
export function sectionProperties(shape: ShapeKind, dims: SectionDims): SectionProps {
  void shape; void dims;
  throw new Error('sectionProperties: not implemented yet');
}

/** A catalogue section by designation (case-insensitive, spaces ignored), or undefined. */
export function catalogueSection(designation: string): Section | undefined {
  void designation;
  return undefined;
}

/** All catalogue designations. */
export function catalogueDesignations(): string[] {
  return [];
}
