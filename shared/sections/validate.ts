/**
 * Dimension checks for dimensioned shapes: missing, non-numeric, zero or negative sizes,
 * and combinations that cannot be built. Each problem names its field; the reader adds
 * table, row and column.
 */
import type { SectionDims, ShapeKind } from '../model/types.js';

export type DimensionProblem = { field: keyof SectionDims; message: string };

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

export function validateDimensions(shape: ShapeKind, dims: SectionDims): DimensionProblem[] {
  const out: DimensionProblem[] = [];
  const need = SHAPE_DIMENSIONS[shape];
  if (!need) return [{ field: 'd', message: `unknown shape "${shape}"` }];
  for (const f of need) {
    const v = dims[f];
    if (v === undefined || v === null) out.push({ field: f, message: `${shape} sections need ${f}` });
    else if (typeof v !== 'number' || !Number.isFinite(v)) out.push({ field: f, message: `${f} must be a number` });
    else if (!(v > 0)) out.push({ field: f, message: `${f} must be greater than zero` });
  }
  if (shape === 'i' && dims.r !== undefined && dims.r !== null) {
    if (typeof dims.r !== 'number' || !Number.isFinite(dims.r)) out.push({ field: 'r', message: 'r must be a number' });
    else if (dims.r < 0) out.push({ field: 'r', message: 'root radius r must not be negative' });
  }
  if (out.length > 0) return out; // relations only make sense between valid sizes

  const { d, bf, tf, tw, b, t, h, D } = dims as Required<SectionDims>;
  switch (shape) {
    case 'i': {
      if (tf >= d / 2) out.push({ field: 'tf', message: 'flange thickness tf must be less than half the depth d' });
      if (tw >= bf) out.push({ field: 'tw', message: 'web thickness tw must be less than the flange width bf' });
      const r = dims.r ?? 0;
      if (out.length === 0 && r > 0) {
        if (tw + 2 * r > bf) out.push({ field: 'r', message: 'root radius r does not fit: tw + 2r exceeds the flange width bf' });
        else if (2 * tf + 2 * r > d) out.push({ field: 'r', message: 'root radius r does not fit: 2tf + 2r exceeds the depth d' });
      }
      break;
    }
    case 'channel':
      if (tf >= d / 2) out.push({ field: 'tf', message: 'flange thickness tf must be less than half the depth d' });
      if (tw >= bf) out.push({ field: 'tw', message: 'web thickness tw must be less than the flange width bf' });
      break;
    case 'tee':
      if (tf >= d) out.push({ field: 'tf', message: 'flange thickness tf must be less than the depth d' });
      if (tw >= bf) out.push({ field: 'tw', message: 'stem thickness tw must be less than the flange width bf' });
      break;
    case 'angle':
      if (t >= d) out.push({ field: 't', message: 'thickness t must be less than the leg d' });
      else if (t >= b) out.push({ field: 't', message: 'thickness t must be less than the leg b' });
      break;
    case 'rhs':
      if (t >= h / 2) out.push({ field: 't', message: 'wall thickness t must be less than half the depth h' });
      else if (t >= b / 2) out.push({ field: 't', message: 'wall thickness t must be less than half the width b' });
      break;
    case 'chs':
      if (t >= D / 2) out.push({ field: 't', message: 'wall thickness t must be less than half the diameter D' });
      break;
    default:
      break;
  }
  return out;
}
