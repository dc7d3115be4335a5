/**
 * The pure parts of the workspace grid fixes (issue 13): the shared cell editor's start text
 * and list keys, a combination's factors on hover, undo steps, the not-checked reason, the
 * theme remembered per user and the question before unsaved edits are lost.
 */
import { describe, expect, it } from 'vitest';
import type { RouteLocationNormalized } from 'vue-router';
import { moveActive, startText } from '../../src/components/grid/cellEditorText.js';
import { combinationHover, factorText, termsText, type LoadingTerms } from '../../src/utils/combinationText.js';
import { EditHistory } from '../../src/utils/editHistory.js';
import { notCheckedReason, statusHover } from '../../src/utils/resultsRows.js';
import { storedTheme, storeTheme, themeKey } from '../../src/utils/themeStorage.js';
import { leaveQuestion, mayLeave } from '../../src/composables/unsavedGuard.js';

describe('cell editor text', () => {
  it('starts with the typed character (not selected) or the value (selected)', () => {
    expect(startText({ eventKey: 'H', value: 'W14X48' })).toEqual({ text: 'H', select: false });
    expect(startText({ eventKey: 'Enter', value: 'W14X48' })).toEqual({ text: 'W14X48', select: true });
    expect(startText({ eventKey: null, value: null })).toEqual({ text: '', select: true });
    expect(startText({ value: 0.85 })).toEqual({ text: '0.85', select: true });
  });
  it('moves through the list with the arrow keys and wraps', () => {
    expect(moveActive(-1, 3, 'ArrowDown')).toBe(0);
    expect(moveActive(2, 3, 'ArrowDown')).toBe(0);
    expect(moveActive(-1, 3, 'ArrowUp')).toBe(2);
    expect(moveActive(1, 3, 'ArrowUp')).toBe(0);
    expect(moveActive(0, 0, 'ArrowDown')).toBe(-1);
  });
});

describe('combination factors on hover', () => {
  // 1.35 G + 1.5 Q: EN 1990 Eq. (6.10) with the recommended γG = 1.35, γQ = 1.5 (Table A1.2(B)); demo data otherwise
  const loadings: LoadingTerms[] = [
    { id: 'G', kind: 'case', limitState: null },
    { id: 'Q', kind: 'case', limitState: null },
    { id: 'ULS1', kind: 'combination', limitState: 'strength', terms: [{ case: 'G', factor: 1.35 }, { case: 'Q', factor: 1.5 }] },
    { id: 'UPLIFT', kind: 'combination', limitState: 'strength', terms: [{ case: 'G', factor: 1 }, { case: 'W', factor: -1.5 }] },
  ];
  it('writes factors plainly', () => {
    expect(factorText(1.35)).toBe('1.35');
    expect(factorText(1.2000000000000002)).toBe('1.2');
    expect(termsText([{ case: 'G', factor: -0.9 }, { case: 'W', factor: 1.5 }])).toBe('− 0.9 × G + 1.5 × W');
  });
  it('shows a combination with its cases and factors', () => {
    expect(combinationHover('ULS1', loadings)).toBe('ULS1 (strength) = 1.35 × G + 1.5 × Q');
    expect(combinationHover('UPLIFT', loadings)).toBe('UPLIFT (strength) = 1 × G − 1.5 × W');
    expect(combinationHover('ULS1@max', loadings)).toBe('ULS1 (strength) = 1.35 × G + 1.5 × Q');
    expect(combinationHover('G', loadings)).toBe('G: load case');
  });
  it('shows a variant the analysis added as its base terms plus the added case', () => {
    // names as shared/stability/load-variants.ts gives them: `<combination> <direction> <rule>`
    expect(combinationHover('ULS1 +X notional', loadings)).toBe(
      'ULS1 +X notional (strength) = 1.35 × G + 1.5 × Q + 1 × ULS1 +X notional loads (notional forces along +X added by the analysis)',
    );
  });
  it('shows nothing for an unknown id rather than a guess', () => {
    expect(combinationHover('ULS9', loadings)).toBeNull();
    expect(combinationHover('', loadings)).toBeNull();
    expect(combinationHover('ULS1', null)).toBeNull();
  });
});

describe('undo of grid edits', () => {
  it('puts back one step at a time, a paste as one step, last change first', () => {
    const h = new EditHistory<string, string | null>();
    h.push([{ member: 'M1', field: 'section', before: 'B300' }]);
    h.push([
      { member: 'M1', field: 'group', before: 'beams' },
      { member: 'M2', field: 'group', before: null },
    ]);
    h.push([]);
    expect(h.size).toBe(2);
    expect(h.pop()).toEqual([
      { member: 'M2', field: 'group', before: null },
      { member: 'M1', field: 'group', before: 'beams' },
    ]);
    expect(h.pop()).toEqual([{ member: 'M1', field: 'section', before: 'B300' }]);
    expect(h.pop()).toBeNull();
  });
  it('keeps at most its limit of steps', () => {
    const h = new EditHistory(2);
    for (let i = 0; i < 5; i++) h.push([{ member: `M${i}`, field: 'cb', before: i }]);
    expect(h.size).toBe(2);
    expect(h.pop()?.[0].member).toBe('M4');
    h.clear();
    expect(h.size).toBe(0);
  });
});

describe('not checked: the reason in the grid', () => {
  it('gives the design reason of a not-checked member and nothing for a checked one', () => {
    const row = { status: 'not checked' as const, warnings: ['not checked: class 4 section is outside the implemented scope', 'slender'] };
    expect(notCheckedReason(row)).toBe('class 4 section is outside the implemented scope');
    expect(statusHover(row)).toBe('not checked: class 4 section is outside the implemented scope\nslender');
    expect(notCheckedReason({ status: 'pass', warnings: [] })).toBe('');
    expect(statusHover({ status: 'pass', warnings: [] })).toBeUndefined();
    expect(notCheckedReason({ status: 'not checked', warnings: [] })).toMatch(/member page/);
  });
});

describe('theme per user', () => {
  it('remembers the choice by user id; light when nothing is stored', () => {
    const m = new Map<string, string>();
    const store = { getItem: (k: string) => m.get(k) ?? null, setItem: (k: string, v: string) => void m.set(k, v) };
    expect(storedTheme(store, 7)).toBe('light');
    storeTheme(store, 7, 'dark');
    expect(m.get(themeKey(7))).toBe('dark');
    expect(storedTheme(store, 7)).toBe('dark');
    expect(storedTheme(store, 8)).toBe('light');
    expect(storedTheme(store, null)).toBe('light');
    const broken = { getItem: () => { throw new Error('denied'); }, setItem: () => { throw new Error('full'); } };
    expect(storedTheme(broken, 7)).toBe('light');
    expect(() => storeTheme(broken, 7, 'dark')).not.toThrow();
  });
});

describe('leaving with unsaved edits', () => {
  const route = (name: string) => ({ name, path: `/${name}` }) as unknown as RouteLocationNormalized;
  it('asks only when edits would be lost, and discards them when the user leaves', () => {
    let discarded = 0;
    const asked: string[] = [];
    const base = { discard: () => void discarded++ };
    expect(mayLeave({ ...base, count: () => 0, confirm: () => false }, route('project'), route('model'))).toBe(true);
    expect(mayLeave({ ...base, count: () => 2, keeps: (to) => to.name === 'member', confirm: () => false }, route('member'), route('model'))).toBe(true);
    expect(mayLeave({ ...base, count: () => 2, confirm: (m) => (asked.push(m), false) }, route('project'), route('model'))).toBe(false);
    expect(discarded).toBe(0);
    expect(asked[0]).toBe(leaveQuestion(2));
    expect(mayLeave({ ...base, count: () => 1, confirm: () => true }, route('project'), route('model'))).toBe(true);
    expect(discarded).toBe(1);
    expect(leaveQuestion(1)).toContain('1 unsaved edit in');
  });
});
