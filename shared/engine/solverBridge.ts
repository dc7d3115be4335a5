/** The sparse solver used by the engine (shared/solver once it lands; dense until then). */
export { factoriseDense as factorise } from './denseSolver.js';
