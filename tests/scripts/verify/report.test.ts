/**
 * The verification report is built from the tests it was given: every test appears once,
 * in the chapter of its folder, with the sources of its title and comments and the numbers
 * its comparisons registered. Fixture: a JSON report in vitest's format and two test files.
 */
import { describe, expect, it } from 'vitest';
import {
  buildReport,
  chapterOf,
  num,
  renderHtml,
  sourcesInComments,
  sourcesInTitle,
  testBody,
  type VitestJson,
} from '../../../scripts/verify/report.js';

const ROOT = '/repo';
const ENGINE = `import { it } from 'vitest';
describe('simply supported beam', () => {
  it('midspan moment wL²/8 (closed form)', () => {
    // Timoshenko, Strength of Materials, Table 1 (from memory)
    close(M, (w * L * L) / 8, 1e-9);
  });
  it('reactions balance the load', () => {
    expect(sum).toBeCloseTo(0, 9); // an invariant, no source words here
  });
});
`;
const DESIGN = `it('flexural buckling to EN 1993-1-1 6.3.1', () => {
  /* ECCS worked example 4.2
     (from memory) */
  expect(chi).toBeCloseTo(0.72, 2);
});
it.skip('not yet', () => {});
`;
const FILES: Record<string, string> = { [`${ROOT}/tests/shared/engine/beam.test.ts`]: ENGINE, [`${ROOT}/tests/shared/design/en.test.ts`]: DESIGN };

const JSON_REPORT: VitestJson = {
  testResults: [
    {
      name: `${ROOT}/tests/shared/design/en.test.ts`,
      assertionResults: [
        {
          ancestorTitles: [],
          fullName: 'flexural buckling to EN 1993-1-1 6.3.1',
          title: 'flexural buckling to EN 1993-1-1 6.3.1',
          status: 'failed',
          location: { line: 1, column: 1 },
          meta: { verification: [{ kind: 'within', expected: 0.72, computed: 0.7, difference: 0.02, tolerance: '±0.005' }] },
        },
        { ancestorTitles: [], fullName: 'not yet', title: 'not yet', status: 'skipped', location: { line: 6, column: 1 } },
      ],
    },
    {
      name: `${ROOT}/tests/shared/engine/beam.test.ts`,
      assertionResults: [
        {
          ancestorTitles: ['simply supported beam'],
          fullName: 'simply supported beam midspan moment wL²/8 (closed form)',
          title: 'midspan moment wL²/8 (closed form)',
          status: 'passed',
          location: { line: 3, column: 3 },
          meta: {
            verification: [
              { kind: 'within', quantity: 'M', expected: 12.5, computed: 12.5000001, difference: 1e-7, tolerance: 'rtol 1e-9' },
              { kind: 'bound', value: 3e-12, bound: 1e-9, relation: '≤' },
            ],
            verificationOmitted: 3,
          },
        },
        {
          ancestorTitles: ['simply supported beam'],
          fullName: 'simply supported beam reactions balance the load',
          title: 'reactions balance the load',
          status: 'passed',
          location: { line: 7, column: 3 },
        },
      ],
    },
  ],
};

const build = () =>
  buildReport(JSON_REPORT, { software: 'Trestle', version: '0.1.0 (commit abc1234)', date: '2026-12-05 18:00:00 UTC', root: ROOT, readFile: (f) => FILES[f] });

describe('verification report', () => {
  it('lists every verification test it was given, once each, passed, failed and skipped alike', () => {
    const r = build();
    const given = JSON_REPORT.testResults.flatMap((f) => f.assertionResults.map((t) => [...t.ancestorTitles, t.title].join(' › ')));
    const listed = r.chapters.flatMap((c) => c.files.flatMap((f) => f.problems.map((p) => p.description)));
    expect(listed.sort()).toEqual(given.sort());
    expect(r.counts).toEqual({ tests: 4, passed: 2, failed: 1, skipped: 1, records: 3 });
    const html = renderHtml(r);
    expect(html.match(/data-test="verification-problem"/g)).toHaveLength(given.length);
    for (const d of given) expect(html).toContain(d.replace(/'/g, '&#39;'));
  });
  it('groups the problems by chapter in the order analysis, design, … whatever the order of the files', () => {
    const r = build();
    expect(r.chapters.map((c) => c.title)).toEqual(['Analysis (direct stiffness method)', 'Design checks']);
    expect(r.chapters[0].files[0].file).toBe('tests/shared/engine/beam.test.ts');
    expect(chapterOf('tests/shared/stability/eigen.test.ts')).toBe('Stability and second-order analysis');
    expect(chapterOf('tests/other/x.test.ts')).toBe('tests/other');
  });
  it('takes the source from the title and from the comments beside the expectations', () => {
    const r = build();
    const [moment, reactions] = r.chapters[0].files[0].problems;
    expect(moment.source).toBe('closed form; Timoshenko, Strength of Materials, Table 1 (from memory)');
    expect(moment.where).toBe('tests/shared/engine/beam.test.ts:3');
    expect(reactions.source).toMatch(/no source named/);
    const buckling = r.chapters[1].files[0].problems[0];
    expect(buckling.source).toBe('flexural buckling to EN 1993-1-1 6.3.1; ECCS worked example 4.2 (from memory)');
    expect(buckling.status).toBe('failed');
  });
  it('shows expected, computed, difference and tolerance of each registered comparison, and the version and date', () => {
    const html = renderHtml(build());
    expect(html).toContain('<td>M: 12.5</td><td>12.5</td><td>1e-7</td><td>rtol 1e-9</td>');
    expect(html).toContain('<td>0.72</td><td>0.7</td><td>0.02</td><td>±0.005</td>');
    expect(html).toContain('<td>3e-12</td><td>≤ 1e-9</td>');
    expect(html).toContain('and 3 more comparisons');
    expect(html).toContain('no numbers registered');
    expect(html).toContain('<pre>expect(sum).toBeCloseTo(0, 9); // an invariant, no source words here</pre>');
    expect(html).toContain('0.1.0 (commit abc1234)');
    expect(html).toContain('2026-12-05 18:00:00 UTC');
    expect(html).not.toMatch(/<script/i);
  });
  it('reads a test body to the closing parenthesis, skipping strings and comments with parentheses', () => {
    const text = "it('a (b', () => {\n  // c) d\n  x(')');\n});\nit('next', () => {});\n";
    expect(testBody(text, 1)).toBe("it('a (b', () => {\n  // c) d\n  x(')');\n});");
    expect(sourcesInComments('// EN 1993-1-1 6.3.2\n/* nothing */\n')).toEqual(['EN 1993-1-1 6.3.2']);
    expect(sourcesInTitle('A = 53.8 cm² (EN 10365 tables, from memory) (0.5 %)')).toEqual(['EN 10365 tables, from memory']);
    expect(sourcesInTitle('rupture: 716.6 kips (Eq. D2-2)')).toEqual(['Eq. D2-2']);
    expect(sourcesInTitle('6.3.2 lateral-torsional buckling')).toEqual(['6.3.2 lateral-torsional buckling']);
    expect(sourcesInTitle('refuses a model without mass')).toEqual([]);
  });
  it('writes numbers with six significant digits', () => {
    expect(num(0.1 + 0.2)).toBe('0.3');
    expect(num(1234567.89)).toBe('1234570');
    expect(num(12345678.9)).toBe('1.23457e+7');
    expect(num(-2.5e-9)).toBe('-2.5e-9');
    expect(num(0)).toBe('0');
  });
});
