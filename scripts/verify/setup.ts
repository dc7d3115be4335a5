/**
 * Setup file of the verification run only (./vitest.config.ts): remembers the running test
 * and records the numbers of its comparisons — toBeCloseTo (expected, computed, digits),
 * toBe/toEqual on numbers, and toBeLessThan(OrEqual) bounds, whose message, when written by
 * the tests' `close` helpers as "… <computed> vs <expected> (rtol <r>)", also gives the
 * expected and computed values. The assertions themselves are unchanged.
 */
import { beforeEach, chai } from 'vitest';
import { register, setCurrentTask } from './records.js';

beforeEach((ctx) => {
  setCurrentTask(ctx.task);
  return () => setCurrentTask(undefined);
});

const CLOSE_MESSAGE = /^(.*?)\s*(-?\d[\d.]*(?:e[+-]?\d+)?) vs (-?\d[\d.]*(?:e[+-]?\d+)?) \(rtol ([\d.e+-]+)\)/i;

chai.use((c, utils) => {
  const isNum = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);
  const negated = (a: object) => Boolean(utils.flag(a, 'negate'));

  c.Assertion.overwriteMethod('toBeCloseTo', (_super: (...args: unknown[]) => unknown) =>
    function (this: object, expected: unknown, digits: unknown = 2) {
      const computed = utils.flag(this, 'object');
      if (!negated(this) && isNum(computed) && isNum(expected) && isNum(digits)) {
        register({ kind: 'within', expected, computed, difference: Math.abs(computed - expected), tolerance: `±${0.5 * 10 ** -digits}` });
      }
      return _super.call(this, expected, digits);
    },
  );

  for (const name of ['toBe', 'toEqual', 'toStrictEqual']) {
    c.Assertion.overwriteMethod(name, (_super: (...args: unknown[]) => unknown) =>
      function (this: object, expected: unknown) {
        const computed = utils.flag(this, 'object');
        if (!negated(this) && isNum(computed) && isNum(expected)) {
          register({ kind: 'within', expected, computed, difference: Math.abs(computed - expected), tolerance: 'exact' });
        }
        return _super.call(this, expected);
      },
    );
  }

  for (const [name, relation] of [['toBeLessThanOrEqual', '≤'], ['toBeLessThan', '<']] as const) {
    c.Assertion.overwriteMethod(name, (_super: (...args: unknown[]) => unknown) =>
      function (this: object, bound: unknown) {
        const value = utils.flag(this, 'object');
        if (!negated(this) && isNum(value) && isNum(bound)) {
          const m = CLOSE_MESSAGE.exec(String(utils.flag(this, 'message') ?? ''));
          if (m) {
            const computed = Number(m[2]), expected = Number(m[3]);
            const quantity = m[1].trim() || undefined;
            register({ kind: 'within', quantity, expected, computed, difference: Math.abs(computed - expected), tolerance: `rtol ${m[4]}` });
          } else register({ kind: 'bound', value, bound, relation });
        }
        return _super.call(this, bound);
      },
    );
  }
});
