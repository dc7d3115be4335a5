/**
 * Section properties, design geometry and the built-in catalogue.
 *
 * - `sectionProperties(shape, dims)`: SI properties of a dimensioned shape (one file per
 *   shape under ./shapes, each stating its approximations: I with root fillets, RHS with
 *   outer corner radius 2t, angle about its principal axes).
 * - `validateDimensions(shape, dims)`: problems, each naming its field.
 * - `designGeometry(section)`: slenderness ratios and shear-centre data for the checks.
 * - `catalogueSection(designation)`: built-in rolled shapes (./catalogue, source per series).
 */
export { SHAPE_DIMENSIONS, validateDimensions, type DimensionProblem } from './validate.js';
export { sectionProperties } from './properties.js';
export { designGeometry, type DesignGeometry, type SlendernessRatios } from './geometry.js';
export { anglePrincipalAxes, type AngleAxes } from './shapes/angle.js';
export { rhsCornerRadii } from './shapes/rhs.js';
export { catalogueSection, catalogueDesignations, normaliseDesignation } from './catalogue/index.js';
