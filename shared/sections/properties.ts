/** Section properties of every dimensioned shape (SI), dispatching to one file per shape. */
import type { SectionDims, SectionProps, ShapeKind } from '../model/types.js';
import { angleProperties } from './shapes/angle.js';
import { channelProperties } from './shapes/channel.js';
import { chsProperties } from './shapes/chs.js';
import { iProperties } from './shapes/ishape.js';
import { rhsProperties } from './shapes/rhs.js';
import { rectProperties, roundProperties } from './shapes/solid.js';
import { teeProperties } from './shapes/tee.js';
import { validateDimensions } from './validate.js';

const BY_SHAPE: Record<Exclude<ShapeKind, 'custom'>, (d: SectionDims) => SectionProps> = {
  i: iProperties,
  channel: channelProperties,
  angle: angleProperties,
  tee: teeProperties,
  rhs: rhsProperties,
  chs: chsProperties,
  rect: rectProperties,
  round: roundProperties,
};

/** Properties of a dimensioned shape. Throws (naming the field) if the dimensions are invalid. */
export function sectionProperties(shape: ShapeKind, dims: SectionDims): SectionProps {
  if (shape === 'custom') throw new Error('custom sections have no dimensions: give their properties');
  const problems = validateDimensions(shape, dims);
  if (problems.length > 0) throw new Error(`${shape} section: ${problems.map((p) => p.message).join('; ')}`);
  return BY_SHAPE[shape](dims);
}
