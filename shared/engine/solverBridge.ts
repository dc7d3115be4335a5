/** The sparse solver used by the engine by default (shared/solver). */
export { factorise } from '../solver/index.js';
