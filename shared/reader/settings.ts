/** The `settings` table: key/value pairs with defaults (tables.md "settings"). */
import {
  ANALYSIS_ORDERS, COMBINATION_RULES, DESIGN_CODES, type AnalysisOrder, type CombinationRule, type DesignCode, type Settings,
  type UnitSystem, type VerticalAxis,
} from '../model/types.js';
import { MODES_MAX, SETTINGS_DEFAULTS, STATIONS_MAX, STATIONS_MIN } from '../model/defaults.js';
import { canonicalName, matchEnum } from './names.js';
import type { Problems } from './problems.js';
import { parseNumber, type RawTable } from './table.js';

export interface SettingsRead {
  settings: Settings;
  /** keys that took their default value */
  defaulted: string[];
  /** true when vertical_axis was given */
  verticalAxisGiven: boolean;
  /** row of each key that was given (later checks point back to it) */
  rows: Partial<Record<SettingKey, number>>;
  count: number;
}

const KEYS = [
  'title', 'units', 'vertical_axis', 'design_code', 'combination_rule', 'deflection_limit', 'gamma_m0', 'gamma_m1', 'gamma_m2',
  'stations', 'analysis', 'buckling_modes', 'modes', 'stability_warning',
] as const;
export type SettingKey = (typeof KEYS)[number];
type Key = SettingKey;

/** Whole-number settings and their allowed ranges. */
const INTEGER_RANGES: Partial<Record<Key, [number, number]>> = {
  stations: [STATIONS_MIN, STATIONS_MAX],
  buckling_modes: [0, MODES_MAX],
  modes: [0, MODES_MAX],
};

export const DEFAULT_SETTINGS: Omit<Settings, 'title'> = SETTINGS_DEFAULTS;

export function readSettings(raw: RawTable | undefined, fallbackTitle: string, problems: Problems): SettingsRead {
  const s: Settings = { title: fallbackTitle, ...DEFAULT_SETTINGS };
  const given = new Set<Key>();
  const rows: Partial<Record<Key, number>> = {};
  let count = 0;
  if (raw) {
    const rowNo = (i: number) => raw.rowNumbers?.[i] ?? i + 1;
    const blank = (c: unknown) => c === null || c === undefined || String(c).trim() === '';
    let h = 0;
    while (h < raw.rows.length && raw.rows[h].every(blank)) h++;
    const header = (raw.rows[h] ?? []).map((c) => (blank(c) ? '' : canonicalName(String(c))));
    const ki = header.indexOf('key');
    const vi = header.indexOf('value');
    if (h < raw.rows.length && (ki < 0 || vi < 0)) {
      problems.error('settings', rowNo(h), ki < 0 ? 'key' : 'value', 'the settings table needs the columns key and value');
    } else {
      header.forEach((c, i) => {
        if (c && i !== ki && i !== vi) problems.warning('settings', rowNo(h), String(raw.rows[h][i]), `unknown column "${String(raw.rows[h][i]).trim()}" is ignored`);
      });
      for (let i = h + 1; i < raw.rows.length; i++) {
        const cells = raw.rows[i];
        if (!cells || cells.every(blank)) continue;
        count++;
        const row = rowNo(i);
        const keyText = blank(cells[ki]) ? '' : String(cells[ki]);
        const value = cells[vi];
        const key = KEYS.find((k) => k === canonicalName(keyText));
        if (!key) {
          problems.warning('settings', row, 'key', keyText ? `unknown setting "${keyText.trim()}" is ignored (known: ${KEYS.join(', ')})` : 'a row without a key is ignored');
          continue;
        }
        if (given.has(key)) {
          problems.error('settings', row, 'key', `setting ${key} is given twice`);
          continue;
        }
        if (blank(value)) continue; // blank value = default
        given.add(key);
        rows[key] = row;
        const text = String(value).trim();
        const bad = (allowed: readonly string[]) => problems.error('settings', row, 'value', `${key}: "${text}" is not one of ${allowed.join(', ')}`);
        switch (key) {
          case 'title':
            s.title = text;
            break;
          case 'units': {
            const m = matchEnum<UnitSystem>(text, ['metric', 'us']);
            if (m) s.units = m; else bad(['metric', 'us']);
            break;
          }
          case 'vertical_axis': {
            const m = matchEnum<VerticalAxis>(text, ['Y', 'Z']);
            if (m) s.verticalAxis = m; else bad(['Y', 'Z']);
            break;
          }
          case 'design_code': {
            const m = matchEnum<DesignCode>(text, DESIGN_CODES);
            if (m) s.designCode = m; else bad(DESIGN_CODES);
            break;
          }
          case 'combination_rule': {
            const m = matchEnum<CombinationRule>(text, COMBINATION_RULES);
            if (m) s.combinationRule = m; else bad(COMBINATION_RULES);
            break;
          }
          case 'analysis': {
            const m = matchEnum<AnalysisOrder>(text, ANALYSIS_ORDERS);
            if (m) s.analysis = m; else bad(ANALYSIS_ORDERS);
            break;
          }
          case 'stability_warning': {
            const m = matchEnum(text, ['on', 'off']);
            if (m) s.stabilityWarning = m === 'on'; else bad(['on', 'off']);
            break;
          }
          case 'stations':
          case 'buckling_modes':
          case 'modes': {
            const [lo, hi] = INTEGER_RANGES[key]!;
            const n = parseNumber(value as string | number, raw.decimalComma === true);
            if (typeof n !== 'number' || !Number.isInteger(n) || n < lo || n > hi) {
              problems.error('settings', row, 'value', `${key} must be a whole number from ${lo} to ${hi} (got "${text}")`);
              break;
            }
            if (key === 'stations') s.stations = n;
            else if (key === 'buckling_modes') s.bucklingModes = n;
            else s.modes = n;
            break;
          }
          default: {
            const n = parseNumber(value as string | number, raw.decimalComma === true);
            if (typeof n !== 'number' || !(n > 0)) {
              const why = typeof n === 'object' ? `: ${n.error}` : ` (got "${text}")`;
              problems.error('settings', row, 'value', `${key} must be a number greater than zero${why}`);
              break;
            }
            if (key === 'deflection_limit') s.deflectionLimit = n;
            else if (key === 'gamma_m0') s.gammaM0 = n;
            else if (key === 'gamma_m1') s.gammaM1 = n;
            else s.gammaM2 = n;
          }
        }
      }
    }
  }
  return {
    settings: s,
    defaulted: KEYS.filter((k) => !given.has(k)),
    verticalAxisGiven: given.has('vertical_axis'),
    rows,
    count,
  };
}
