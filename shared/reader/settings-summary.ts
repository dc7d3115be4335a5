/**
 * The settings of a model as people read them: the lines that apply to its design code, with
 * readable labels and values (code and unit system names, not raw keys). The import preview
 * and the header block of the exports both show these lines, so they say the same.
 *
 * What applies: title, units, vertical axis, design code, combinations, result stations,
 * analysis, buckling and natural modes always; the deflection limit only under a design code
 * (it is a design check, checks.md "Serviceability"); γM0, γM1, γM2 only under EN 1993-1-1
 * (tables.md settings); the first-order stability warning only under a design code with a
 * first-order analysis (checks.md "Stability").
 */
import type { AnalysisOrder, CombinationRule, DesignCode, Settings, UnitSystem } from '../model/types.js';

export const DESIGN_CODE_NAMES: Record<DesignCode, string> = {
  'aisc360-lrfd': 'AISC 360-22 (LRFD)',
  'aisc360-asd': 'AISC 360-22 (ASD)',
  'en1993-1-1': 'EN 1993-1-1',
  none: 'No design checks',
};

export const UNIT_SYSTEM_NAMES: Record<UnitSystem, string> = {
  metric: 'Metric (kN, m, MPa)',
  us: 'US customary (kip, ft, ksi)',
};

export const COMBINATION_RULE_NAMES: Record<CombinationRule, string> = {
  table: 'from the combinations table',
  'asce7-lrfd': 'generated: ASCE 7 strength design (LRFD) combinations',
  'asce7-asd': 'generated: ASCE 7 allowable stress design (ASD) combinations',
  'en1990-6.10': 'generated: EN 1990 expression (6.10)',
};

export const ANALYSIS_NAMES: Record<AnalysisOrder, string> = {
  first_order: 'First order (linear elastic)',
  second_order: 'Second order (P-Δ and P-δ, each loading on its own)',
};

/** A setting as shown: `key` is the settings-table key it comes from. */
export interface SettingLine {
  key: string;
  label: string;
  value: string;
}

/**
 * What the lines need: the model's settings, or the import preview's (keys as text; fields
 * added later may be absent in older previews).
 */
export interface SettingsForSummary extends Partial<Pick<Settings, 'gammaM0' | 'gammaM1' | 'gammaM2' | 'stations' | 'bucklingModes' | 'modes' | 'stabilityWarning'>> {
  title: string;
  units: string;
  verticalAxis: string;
  designCode: string;
  combinationRule: string;
  deflectionLimit: number;
  analysis?: string;
}

export interface SummaryExtras {
  /** vertical axis inferred from the coordinates (import preview) */
  verticalAxisInferred?: boolean;
  /** number of generated combinations (rule other than `table`) */
  generatedCombinations?: number;
}

const nameOf = <K extends string>(names: Record<K, string>, key: string): string => names[key as K] ?? key;
const factor = (v: number) => v.toFixed(2);
const modesText = (n: number | undefined, what: string) => (n ? `${n} ${what}` : 'off');

/** Does the setting apply to this design code and analysis? (see the file's header) */
export function settingApplies(key: string, s: Pick<SettingsForSummary, 'designCode' | 'analysis'>): boolean {
  const code = s.designCode;
  if (key === 'gamma_m0' || key === 'gamma_m1' || key === 'gamma_m2') return code === 'en1993-1-1';
  if (key === 'deflection_limit') return code !== 'none';
  if (key === 'stability_warning') return code !== 'none' && (s.analysis ?? 'first_order') === 'first_order';
  return true;
}

/** The lines of the settings that apply, in the order of tables.md. */
export function settingLines(s: SettingsForSummary, extras: SummaryExtras = {}): SettingLine[] {
  const all: (SettingLine | null)[] = [
    { key: 'title', label: 'Title', value: s.title || '—' },
    { key: 'units', label: 'Unit system', value: nameOf(UNIT_SYSTEM_NAMES, s.units) },
    {
      key: 'vertical_axis', label: 'Vertical axis',
      value: `${s.verticalAxis}${extras.verticalAxisInferred === undefined ? '' : extras.verticalAxisInferred ? ' (inferred from the geometry)' : ' (as given)'}`,
    },
    { key: 'design_code', label: 'Design code', value: nameOf(DESIGN_CODE_NAMES, s.designCode) },
    {
      key: 'combination_rule', label: 'Load combinations',
      value: `${nameOf(COMBINATION_RULE_NAMES, s.combinationRule)}${s.combinationRule !== 'table' && extras.generatedCombinations !== undefined ? ` (${extras.generatedCombinations})` : ''}`,
    },
    { key: 'deflection_limit', label: 'Deflection limit', value: `span / ${s.deflectionLimit}` },
    s.gammaM0 === undefined ? null : { key: 'gamma_m0', label: 'Partial factor γM0', value: factor(s.gammaM0) },
    s.gammaM1 === undefined ? null : { key: 'gamma_m1', label: 'Partial factor γM1', value: factor(s.gammaM1) },
    s.gammaM2 === undefined ? null : { key: 'gamma_m2', label: 'Partial factor γM2', value: factor(s.gammaM2) },
    s.stations === undefined ? null : { key: 'stations', label: 'Result stations per member', value: String(s.stations) },
    { key: 'analysis', label: 'Analysis', value: nameOf(ANALYSIS_NAMES, s.analysis ?? 'first_order') },
    s.bucklingModes === undefined ? null : { key: 'buckling_modes', label: 'Elastic critical load factors', value: modesText(s.bucklingModes, 'per strength loading') },
    s.modes === undefined ? null : { key: 'modes', label: 'Natural frequencies', value: modesText(s.modes, 'modes') },
    s.stabilityWarning === undefined ? null : { key: 'stability_warning', label: 'First-order stability warning', value: s.stabilityWarning ? 'on (αcr < 10 or amplifier > 1.5)' : 'off' },
  ];
  return all.filter((l): l is SettingLine => l !== null && settingApplies(l.key, s));
}
