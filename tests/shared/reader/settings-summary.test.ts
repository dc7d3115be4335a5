/** The settings lines of the import preview and the export header block: only what applies to the code, readable. */
import { describe, expect, it } from 'vitest';
import { SETTINGS_DEFAULTS } from '../../../shared/model/defaults.js';
import type { Settings } from '../../../shared/model/types.js';
import { settingLines } from '../../../shared/reader/settings-summary.js';

const base = (over: Partial<Settings>): Settings => ({ ...SETTINGS_DEFAULTS, title: 'Frame', ...over }) as Settings;
const labels = (s: Settings) => settingLines(s).map((l) => l.label);
const value = (s: Settings, key: string) => settingLines(s).find((l) => l.key === key)?.value;

describe('settingLines', () => {
  it('lists the partial factors under EN 1993-1-1 only', () => {
    const en = base({ designCode: 'en1993-1-1', gammaM0: 1, gammaM1: 1.1, gammaM2: 1.25 });
    expect(labels(en)).toEqual(expect.arrayContaining(['Partial factor γM0', 'Partial factor γM1', 'Partial factor γM2']));
    expect(value(en, 'gamma_m1')).toBe('1.10');
    const aisc = base({ designCode: 'aisc360-lrfd', units: 'us' });
    expect(labels(aisc).some((l) => l.includes('γM'))).toBe(false);
    expect(value(aisc, 'design_code')).toBe('AISC 360-22 (LRFD)');
    expect(value(aisc, 'units')).toBe('US customary (kip, ft, ksi)');
  });

  it('leaves out the deflection limit and the stability warning without a design code', () => {
    const none = base({ designCode: 'none' });
    expect(settingLines(none).map((l) => l.key)).not.toEqual(expect.arrayContaining(['deflection_limit']));
    expect(settingLines(none).some((l) => l.key === 'stability_warning')).toBe(false);
    expect(value(none, 'design_code')).toBe('No design checks');
    expect(value(base({ designCode: 'en1993-1-1' }), 'deflection_limit')).toBe('span / 360');
  });

  it('shows the stability warning only for a first-order analysis under a code', () => {
    expect(value(base({ designCode: 'en1993-1-1', analysis: 'first_order' }), 'stability_warning')).toMatch(/^on/);
    expect(value(base({ designCode: 'en1993-1-1', analysis: 'second_order' }), 'stability_warning')).toBeUndefined();
  });

  it('names the combination rule and the analysis in words, never by key', () => {
    const s = base({ designCode: 'aisc360-asd', combinationRule: 'asce7-asd' });
    expect(settingLines(s, { generatedCombinations: 12 }).find((l) => l.key === 'combination_rule')?.value).toBe('generated: ASCE 7 allowable stress design (ASD) combinations (12)');
    expect(value(s, 'analysis')).toBe('First order (linear elastic)');
    for (const l of settingLines(s)) expect(l.value).not.toMatch(/aisc360|asce7|first_order|metric\b/);
  });
});
