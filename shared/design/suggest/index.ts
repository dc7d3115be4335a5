/**
 * Section suggestions (issue 16): the lightest section of each member's family that passes
 * every check with a run's forces (suggest.ts), and analyse → suggest → apply until stable
 * (iterate.ts). Candidates and limits in candidates.ts; shapes of the answers in types.ts.
 */
export * from './types.js';
export { suggestSections, normaliseLimits, SUGGEST_NOTES } from './suggest.js';
export { iterateSuggestions, applySections, changesOf, MAX_ITERATIONS, type IterateOptions } from './iterate.js';
export { familySections, familyOf, seriesOf, withinLimits, widthOf, depthOf } from './candidates.js';
export { suggestionsTable, SUGGESTIONS_HEADER } from './table.js';
