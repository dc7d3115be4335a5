/** An unstable model in an engineer's words, naming node and freedom (global axes). */
import { FREEDOMS } from '../model/types.js';
import { InstabilityError } from './types.js';

export function instabilityAt(nodeName: string, freedom: number): InstabilityError {
  const axis = 'XYZ'[freedom % 3];
  const message = freedom < 3
    ? `node ${nodeName} can translate freely along ${axis}: add a support or connect it`
    : `node ${nodeName} can rotate freely about ${axis}: add a rotational restraint or connect a member that resists it`;
  return new InstabilityError(message, nodeName, FREEDOMS[freedom]);
}
