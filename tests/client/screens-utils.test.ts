/** Pure helpers of the working screens: bands, deltas, cell validation, paste, rows, filters, diagrams, picture numbers. */
import { describe, expect, it } from 'vitest';
import { barWidth, formatDelta, formatRatio, isChanged, ratioBand, ratioDelta } from '../../src/utils/ratioBand.js';
import { validateMemberCell, type EditChoices } from '../../src/utils/memberEdits.js';
import { parseClipboard, pastePlacements } from '../../src/utils/paste.js';
import { buildGridRows, countStatuses, EMPTY_FILTER, rowPasses, type GridRow } from '../../src/utils/resultsRows.js';
import { diagramData, DIAGRAMS, displayQuantity } from '../../src/utils/diagrams.js';
import { defaultDeflectionScale, modelExtent, segmentColors, segmentPositions, viewDirection } from '../../src/utils/pictureGeometry.js';
import { acceptedFiles } from '../../src/utils/importFiles.js';
import { formatDuration, phaseSteps } from '../../src/utils/runFormat.js';
import type { MemberRow, Stations } from '../../shared/schemas/runs.js';
import type { EditableMember } from '../../shared/schemas/models.js';

const choices: EditChoices = { sections: ['B300', 'B400'], catalogue: ['IPE 300', 'HEA 200', 'W12X26'], materials: ['Steel355'], builtInMaterials: ['S355', 'A992'] };

describe('ratio bands', () => {
  it('puts 0.9 and 1.0 in the lower bands and anything not checked in its own band', () => {
    expect(ratioBand(0.9)).toBe('low');
    expect(ratioBand(0.9000001)).toBe('near');
    expect(ratioBand(1.0)).toBe('near');
    expect(ratioBand(1.0000001)).toBe('over');
    expect(ratioBand(0.5, 'not checked')).toBe('none');
    expect(ratioBand(null)).toBe('none');
  });
  it('formats ratios and signed changes, and ignores changes below the last shown digit', () => {
    expect(formatRatio(1.23456)).toBe('1.235');
    expect(formatRatio(null)).toBe('—');
    expect(ratioDelta(0.8, 1.0)).toBeCloseTo(-0.2, 12);
    expect(ratioDelta(0.8, null)).toBeNull();
    expect(formatDelta(-0.2)).toBe('−0.200');
    expect(formatDelta(0.0123)).toBe('+0.012');
    expect(formatDelta(0.0001)).toBe('0.000');
    expect(isChanged(0.0004)).toBe(false);
    expect(isChanged(-0.0006)).toBe(true);
  });
  it('draws ratio 1.0 at 80 % of the cell and caps the bar', () => {
    expect(barWidth(1)).toBe(80);
    expect(barWidth(5)).toBe(100);
    expect(barWidth(null)).toBe(0);
  });
});

describe('member cell validation', () => {
  it('accepts a model section or a catalogue designation written loosely, by its canonical name', () => {
    expect(validateMemberCell('section', 'B400', choices)).toEqual({ ok: true, value: 'B400' });
    expect(validateMemberCell('section', 'ipe300', choices)).toEqual({ ok: true, value: 'IPE 300' });
    expect(validateMemberCell('section', 'w12x26', choices)).toEqual({ ok: true, value: 'W12X26' });
  });
  it('refuses an unknown section or material and a blank one', () => {
    const r = validateMemberCell('section', 'NOPE1', choices);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/unknown section "NOPE1"/);
    expect(validateMemberCell('section', ' ', choices).ok).toBe(false);
    expect(validateMemberCell('material', 's355', choices)).toEqual({ ok: true, value: 'S355' });
    expect(validateMemberCell('material', 'S999', choices).ok).toBe(false);
  });
  it('needs positive numbers and lets default-able fields be cleared', () => {
    expect(validateMemberCell('k_major', '0.7', choices)).toEqual({ ok: true, value: 0.7 });
    expect(validateMemberCell('k_major', '', choices).ok).toBe(false);
    expect(validateMemberCell('lb', '', choices)).toEqual({ ok: true, value: null });
    expect(validateMemberCell('cb', '1.2e0', choices)).toEqual({ ok: true, value: 1.2 });
    const neg = validateMemberCell('l_major', '-3', choices);
    expect(neg.ok).toBe(false);
    if (!neg.ok) expect(neg.message).toBe('must be greater than zero');
    const text = validateMemberCell('deflection_limit', 'L/300', choices);
    expect(text.ok).toBe(false);
    if (!text.ok) expect(text.message).toMatch(/not a number/);
  });
  it('keeps a group as typed, up to 200 characters', () => {
    expect(validateMemberCell('group', ' roof ', choices)).toEqual({ ok: true, value: 'roof' });
    expect(validateMemberCell('group', 'x'.repeat(201), choices).ok).toBe(false);
  });
});

describe('paste from a spreadsheet', () => {
  it('splits lines and tabs, drops the trailing line break and unquotes quoted cells', () => {
    expect(parseClipboard('a\tb\r\nc\td\r\n')).toEqual([['a', 'b'], ['c', 'd']]);
    expect(parseClipboard('"x ""y"""\n1')).toEqual([['x "y"'], ['1']]);
    expect(parseClipboard('')).toEqual([]);
    expect(parseClipboard('\n')).toEqual([['']]);
  });
  it('places cells down from the focused cell and drops those past the last row or column', () => {
    const places = pastePlacements([['1', '2'], ['3', '4'], ['5', '6']], { rowIndex: 8, columnIndex: 4 }, 10, 5);
    expect(places).toEqual([
      { rowIndex: 8, columnIndex: 4, text: '1' },
      { rowIndex: 9, columnIndex: 4, text: '3' },
    ]);
  });
});

const runRow = (member: string, ratio: number | null, previousRatio: number | null, status: MemberRow['status'] = 'pass'): MemberRow => ({
  member, group: 'g', section: 'B300', material: 'Steel355', length: 6, ratio, check: 'c', clause: '6.2.5', combination: 'ULS', status,
  families: {}, familyStatus: {}, warnings: [], previousRatio,
});
const editable = (member: string, section = 'B300'): EditableMember => ({
  member, start: 'N1', end: 'N2', type: 'frame', section, material: 'Steel355', group: 'beams', k_major: 1, k_minor: 1,
  l_major: null, l_minor: null, lb: 3, cb: null, deflection_limit: null, length: 19.685,
});

describe('grid rows', () => {
  it('joins run results with the model version, keeps members missing from the run as not run', () => {
    const rows = buildGridRows([runRow('M1', 0.8, 1.0)], [editable('M1', 'B400'), editable('M2')], (m) => m / 0.3048);
    expect(rows).toHaveLength(2);
    expect(rows[0]).toMatchObject({ member: 'M1', section: 'B400', ratio: 0.8, lb: 3, length: 19.685 });
    expect(rows[0].delta).toBeCloseTo(-0.2, 12);
    expect(rows[1]).toMatchObject({ member: 'M2', status: 'not run', ratio: null });
  });
  it('converts the run length when there is no model version to join', () => {
    const rows = buildGridRows([runRow('M1', 0.5, null)], null, (m) => m / 0.3048);
    expect(rows[0].length).toBeCloseTo(19.685, 3); // 6 m / 0.3048 m/ft (exact definition of the foot)
  });
  it('filters by status, group, section, ratio range and changed rows', () => {
    const rows: GridRow[] = buildGridRows([runRow('A', 0.5, 0.5), runRow('B', 1.2, 1.0, 'fail'), runRow('C', null, null, 'not checked')], null, (m) => m);
    const pass = (f: Partial<typeof EMPTY_FILTER>) => rows.filter((r) => rowPasses(r, { ...EMPTY_FILTER, ...f })).map((r) => r.member);
    expect(pass({})).toEqual(['A', 'B', 'C']);
    expect(pass({ statuses: ['fail'] })).toEqual(['B']);
    expect(pass({ ratioMin: 0.6 })).toEqual(['B']);
    expect(pass({ ratioMax: 0.6 })).toEqual(['A']);
    expect(pass({ changedOnly: true })).toEqual(['B']);
    expect(pass({ sections: ['B400'] })).toEqual([]);
    expect(countStatuses(rows)).toEqual({ pass: 1, fail: 1, notChecked: 1, notRun: 0 });
  });
});

describe('diagrams', () => {
  const stations: Stations = {
    x: [0, 3, 6], N: [1000, 1000, 1000], V_major: [-5000, 0, 5000], V_minor: [0, 0, 0], T: [0, 0, 0],
    M_major: [0, 7500, 0], M_minor: [0, 0, 0], d_major: [0, -0.004, 0], d_minor: [0, 0, 0],
  };
  it('converts SI stations to kN, kNm and mm and finds the peak', () => {
    const m = diagramData(DIAGRAMS.find((d) => d.key === 'M_major')!, stations, 'metric');
    expect(m.unit).toBe('kNm');
    expect(m.series[0].values).toEqual([0, 7.5, 0]);
    expect(m.peak).toEqual({ value: 7.5, x: 3 });
    const d = diagramData(DIAGRAMS.find((x) => x.key === 'deflection')!, stations, 'metric');
    expect(d.series[0].values[1]).toBeCloseTo(-4, 12);
    expect(d.series).toHaveLength(2);
  });
  it('shows US units: 1 kip = 4448.2216152605 N (exact by definition of the pound-force)', () => {
    const n = diagramData(DIAGRAMS[0], { ...stations, N: [4448.2216152605, 0, 0] }, 'us');
    expect(n.unit).toBe('kip');
    expect(n.series[0].values[0]).toBeCloseTo(1, 12);
    expect(n.xUnit).toBe('ft');
  });
  it('converts a check input by its quantity and leaves text alone', () => {
    expect(displayQuantity(355e6, 'stress', 'metric')).toEqual({ text: '355', unit: 'MPa' });
    expect(displayQuantity(0.5, 'ratio', 'metric')).toEqual({ text: '0.5', unit: '' });
    expect(displayQuantity('class 1', 'text', 'metric')).toEqual({ text: 'class 1', unit: '' });
  });
});

describe('picture numbers', () => {
  const g = {
    nodes: [['N1', 0, 0, 0], ['N2', 6, 0, 0], ['N3', 12, 0, 0]] as [string, number, number, number][],
    members: [{ id: 'M1', start: 0, end: 1, ratio: 0.5, status: 'pass' as const }, { id: 'M2', start: 1, end: 2, ratio: 1.2, status: 'fail' as const }],
    displacements: [0, 0, 0, 0, 0, 0, 0, -0.01, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0],
  };
  it('lays out two points per member and displaces them by scale × displacement', () => {
    expect(Array.from(segmentPositions(g))).toEqual([0, 0, 0, 6, 0, 0, 6, 0, 0, 12, 0, 0]);
    const p = segmentPositions(g, 100);
    expect(p[4]).toBeCloseTo(-1, 6);
    expect(p[7]).toBeCloseTo(-1, 6);
  });
  it('colours each member by band and sizes the model', () => {
    const c = segmentColors(g.members);
    expect(c.length).toBe(12);
    expect(c[6]).not.toBe(c[0]);
    expect(modelExtent(g.nodes)).toEqual({ center: [6, 0, 0], size: 12 });
  });
  it('picks a round deflection scale that makes the largest displacement about 5 % of the model', () => {
    expect(defaultDeflectionScale(0.01, 12)).toBe(50); // 0.05 × 12 / 0.01 = 60 → rounded down to 50 (picture-view.test.ts has more)
    expect(defaultDeflectionScale(0, 12)).toBe(1);
  });
  it('looks at a plane frame along its normal with the vertical axis up', () => {
    expect(viewDirection('Y', 'Z')).toEqual({ dir: [0, 0, 1], up: [0, 1, 0] });
    expect(viewDirection('Z', 'Y')).toEqual({ dir: [0, -1, 0], up: [0, 0, 1] }); // from −Y so +X runs right (picture-view.test.ts)
    expect(viewDirection('Z', null).up).toEqual([0, 0, 1]);
  });
});

describe('import files and run display', () => {
  it('accepts one workbook or several CSV files, nothing else', () => {
    expect(acceptedFiles([{ name: 'a.csv' }, { name: 'b.CSV' }]).problem).toBeNull();
    expect(acceptedFiles([{ name: 'm.xlsx' }]).problem).toBeNull();
    expect(acceptedFiles([{ name: 'm.xlsx' }, { name: 'n.xlsx' }]).problem).toMatch(/one workbook/);
    expect(acceptedFiles([{ name: 'm.xlsx' }, { name: 'a.csv' }]).problem).toMatch(/not both/);
    expect(acceptedFiles([{ name: 'm.txt' }]).problem).toMatch(/m.txt/);
  });
  it('marks phases before the current one done', () => {
    const steps = phaseSteps('solving', 'running');
    expect(steps.find((s) => s.phase === 'factorising')?.state).toBe('done');
    expect(steps.find((s) => s.phase === 'solving')?.state).toBe('active');
    expect(steps.find((s) => s.phase === 'checking')?.state).toBe('todo');
    expect(formatDuration(850)).toBe('0.85 s');
    expect(formatDuration(75_000)).toBe('1 min 15 s');
  });
});

describe('breadcrumbs of the model pages', () => {
  it('leads from the projects through the project and the model to the member', async () => {
    const { breadcrumbsFor } = await import('../../src/utils/breadcrumbs.js');
    const model = { id: 4, name: 'Beam', projectId: 2 };
    const member = breadcrumbsFor({ routeName: 'member', params: { runId: '9', member: 'M1' }, projectName: 'Bridge', model });
    expect(member.map((c) => c.title)).toEqual(['Projects', 'Bridge', 'Beam', 'Member M1']);
    expect(member[2].to).toEqual({ name: 'model', params: { id: 4 } });
    expect(breadcrumbsFor({ routeName: 'model', params: { id: '4' }, model }).map((c) => c.title)).toEqual(['Projects', 'Project 2', 'Beam']);
    expect(breadcrumbsFor({ routeName: 'import', params: { id: '2' }, projectName: 'Bridge' }).map((c) => c.title)).toEqual(['Projects', 'Bridge', 'Import']);
  });
});
