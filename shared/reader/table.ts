/**
 * One raw table → typed rows in SI. Header names are matched case-insensitively, a bracketed
 * unit is converted (or refused with an error naming the column), and every cell is parsed
 * by a zod schema built from the table's column list; all problems are collected.
 */
import { z } from 'zod';
import type { UnitSystem } from '../model/types.js';
import { QUANTITY_DIMENSION, factorToSI, findUnit, splitHeader, unitOf, type Quantity } from '../units/index.js';
import { canonicalName, idText, matchEnum } from './names.js';
import type { Problems } from './problems.js';

export type Cell = string | number | boolean | null | undefined;

/** A table as it comes from a file: header row first. */
export interface RawTable {
  name: string;
  rows: Cell[][];
  /** row numbers as the user sees them (sheet row or CSV line), parallel to `rows` */
  rowNumbers?: number[];
  source: 'csv' | 'xlsx';
  /** text cells may use a decimal comma (`1,5`): set for semicolon-separated CSV */
  decimalComma?: boolean;
}

export type ColumnKind = 'id' | 'text' | 'number' | 'enum';

export interface ColumnSpec {
  /** canonical name (`i_major`) */
  name: string;
  kind: ColumnKind;
  /** numbers: what the value means (picks the default unit); default 'ratio' (no unit) */
  quantity?: Quantity;
  /** numbers: default unit regardless of the unit system (e.g. `roll` in degrees) */
  defaultUnit?: string;
  /** the column must exist and every row must give a value */
  required?: boolean;
  /** enum values */
  values?: readonly string[];
  /** numbers: lower bound */
  min?: number;
  /** numbers: the bound itself is not allowed (value must be greater) */
  exclusiveMin?: boolean;
  /** numbers: upper bound (exclusive) */
  maxExclusive?: number;
  /** numbers: upper bound (inclusive) */
  max?: number;
  integer?: boolean;
  /** the header may not carry a unit (member_loads w1/w2) */
  noUnit?: boolean;
}

export interface TableSpec {
  name: string;
  columns: ColumnSpec[];
  /** unknown columns are handed back instead of warned about (wide combinations) */
  keepExtra?: boolean;
}

export interface ParsedRow {
  /** row as the user sees it */
  row: number;
  /** parsed values by canonical column name; absent = blank */
  v: Record<string, unknown>;
  /** raw cells of extra columns by header text (keepExtra only) */
  extra: Record<string, Cell>;
  /** some cell of this row had an error (already reported) */
  invalid?: boolean;
}

export interface ParsedTable {
  name: string;
  rows: ParsedRow[];
  /** canonical names of the columns present */
  present: Set<string>;
  /** how the user wrote each present column's name (for messages) */
  label: Record<string, string>;
  /** header texts of extra columns (keepExtra only), in order */
  extraHeaders: string[];
  headerRow: number;
  /** canonical names of columns whose header was reported as unusable (their values are not read) */
  unusable: Set<string>;
}

function isBlank(c: Cell): boolean {
  return c === null || c === undefined || (typeof c === 'string' && c.trim() === '');
}

/** Parse a number cell; with `decimalComma` text may be written `1,5`. */
export function parseNumber(c: Cell, decimalComma = false): number | undefined | { error: string } {
  if (isBlank(c)) return undefined;
  if (typeof c === 'number') return Number.isFinite(c) ? c : { error: `${c} is not a finite number` };
  if (typeof c === 'boolean') return { error: `"${c}" is not a number` };
  let s = String(c).trim();
  if (decimalComma && /^[+-]?\d*,\d+([eE][+-]?\d+)?$/.test(s)) s = s.replace(',', '.');
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(s)) return { error: `"${String(c).trim()}" is not a number` };
  const n = Number(s);
  // `1e309` matches the pattern but overflows to Infinity: refused, never stored as empty
  if (!Number.isFinite(n)) return { error: `"${String(c).trim()}" is too large to be a number (overflows)` };
  return n;
}

function describeBound(spec: ColumnSpec): string {
  if (spec.min === 0) return spec.exclusiveMin ? 'greater than zero' : 'zero or more';
  return spec.exclusiveMin ? `greater than ${spec.min}` : `at least ${spec.min}`;
}

type CellResult = { value: unknown } | { error: string };

/** Longest id (nodes, members, sections, cases…) the reader accepts. */
export const MAX_ID_LENGTH = 64;
/** Control characters and the bidirectional marks, embeddings, overrides and isolates. */
const UNSAFE_ID_CHAR = /[\p{Cc}\u061C\u200E\u200F\u202A-\u202E\u2066-\u2069]/u;

function parseCell(spec: ColumnSpec, c: Cell, factor: number, decimalComma: boolean, label = spec.name): CellResult {
  if (isBlank(c)) return spec.required ? { error: `${label} is required` } : { value: undefined };
  switch (spec.kind) {
    case 'id': {
      if (typeof c === 'boolean') return { value: String(c) };
      const id = idText(c as string | number);
      if (id.length > MAX_ID_LENGTH) return { error: `${label} is ${id.length} characters long; ids are at most ${MAX_ID_LENGTH}` };
      if (UNSAFE_ID_CHAR.test(id)) return { error: `${label} holds a control or text-direction character (U+${id.codePointAt(id.search(UNSAFE_ID_CHAR))!.toString(16).toUpperCase().padStart(4, '0')}); ids are plain text` };
      return { value: id };
    }
    case 'text':
      return { value: String(c).trim() };
    case 'enum': {
      const m = matchEnum(String(c), spec.values ?? []);
      if (!m) return { error: `"${String(c).trim()}" is not one of ${(spec.values ?? []).join(', ')}` };
      return { value: m };
    }
    case 'number': {
      const n = parseNumber(c, decimalComma);
      if (n === undefined) return { value: undefined };
      if (typeof n === 'object') return n;
      if (spec.integer && !Number.isInteger(n)) return { error: `${n} is not a whole number` };
      if (spec.min !== undefined && (spec.exclusiveMin ? !(n > spec.min) : !(n >= spec.min))) {
        return { error: `${label} must be ${describeBound(spec)} (got ${n})` };
      }
      if (spec.maxExclusive !== undefined && !(n < spec.maxExclusive)) {
        return { error: `${label} must be less than ${spec.maxExclusive} (got ${n})` };
      }
      if (spec.max !== undefined && !(n <= spec.max)) {
        return { error: `${label} must be at most ${spec.max} (got ${n})` };
      }
      const si = n * factor;
      if (!Number.isFinite(si)) return { error: `${label} = ${n} overflows when converted to SI units` };
      return { value: si };
    }
  }
}

/** A zod schema for one cell: the parsed (SI) value or an issue with a readable message. */
function cellSchema(spec: ColumnSpec, factor: number, decimalComma: boolean, label: string) {
  return z.any().transform((raw: Cell, ctx) => {
    const r = parseCell(spec, raw, factor, decimalComma, label);
    if ('error' in r) {
      ctx.addIssue({ code: 'custom', message: r.error });
      return z.NEVER;
    }
    return r.value;
  });
}

/** Said of every header the reader cannot use: its follow-on problems are left out (Problems.markUnusable). */
export const UNUSABLE_NOTE = 'the column is not read, so problems that follow from it are not listed';

/**
 * A header such as `fy (MPa)` that names a known column with its unit in round (or curly)
 * brackets: the name and the unit, else null.
 */
export function roundBracketHeader(text: string): { name: string; unit: string } | null {
  const m = /^(.*?)\s*[({]([^)}]*)[)}]\s*$/.exec(text.trim());
  return m && m[1].trim() ? { name: m[1].trim(), unit: m[2].trim() } : null;
}

/** Factor from the header's unit (or the system default) to SI; null after reporting an error. */
function columnFactor(spec: ColumnSpec, unit: string | null, system: UnitSystem, table: string, headerRow: number, label: string, problems: Problems): number | null {
  if (spec.kind !== 'number' || spec.noUnit) {
    if (unit !== null && unit !== '' && unit !== '-') {
      problems.error(table, headerRow, label, spec.noUnit
        ? `${label} takes no unit in brackets: its unit follows the unit system and the load kind (write the header as ${label}); ${UNUSABLE_NOTE}`
        : `${label} is not a quantity and takes no unit (got [${unit}]; write the header as ${label}); ${UNUSABLE_NOTE}`);
      return null;
    }
    return 1;
  }
  const quantity = spec.quantity ?? 'ratio';
  if (unit === null || unit === '') {
    const def = spec.defaultUnit ?? (quantity === 'ratio' ? '-' : unitOf(quantity, system));
    return factorToSI(def, quantity) ?? 1;
  }
  const f = factorToSI(unit, quantity);
  if (f !== null) return f;
  const known = findUnit(unit);
  const dim = QUANTITY_DIMENSION[quantity].replace(/_/g, ' ');
  const example = spec.defaultUnit ?? unitOf(quantity, system) ?? '-';
  problems.error(table, headerRow, label, `${known
    ? `unit [${unit}] is not a unit of ${dim === 'dimensionless' ? 'a plain number' : dim}`
    : `unknown unit [${unit}]`}: write the header as ${label} [${example}] (a unit of ${dim === 'dimensionless' ? 'a plain number' : dim} in square brackets) or without a unit for the unit system's; ${UNUSABLE_NOTE}`);
  return null;
}

/**
 * Parse one table against its spec. Returns null when the table cannot be read at all
 * (no header row); missing required columns are reported and the table is still read so
 * that other problems surface too.
 */
export function parseTable(raw: RawTable, spec: TableSpec, system: UnitSystem, problems: Problems): ParsedTable {
  const table = spec.name;
  const rowNo = (i: number) => raw.rowNumbers?.[i] ?? i + 1;
  let h = 0;
  while (h < raw.rows.length && raw.rows[h].every(isBlank)) h++;
  const out: ParsedTable = { name: table, rows: [], present: new Set(), label: {}, extraHeaders: [], headerRow: rowNo(h), unusable: new Set() };
  if (h >= raw.rows.length) {
    problems.warning(table, undefined, undefined, 'the table is empty');
    return out;
  }
  const header = raw.rows[h];
  const headerRow = rowNo(h);
  const byName = new Map(spec.columns.map((c) => [c.name, c]));
  const shape: Record<string, z.ZodType> = {};
  const colIndex: Record<string, number> = {};
  const factors: Record<string, number> = {};
  const extraIndex: { header: string; index: number }[] = [];
  header.forEach((cell, index) => {
    if (isBlank(cell)) return;
    const text = String(cell).trim();
    const { name, unit } = splitHeader(text);
    const canon = canonicalName(name);
    const spec1 = byName.get(canon);
    const round = !spec1 && unit === null ? roundBracketHeader(text) : null;
    const meant = round ? byName.get(canonicalName(round.name)) : undefined;
    if (round && meant && !out.present.has(meant.name)) {
      // `fy (MPa)`: reported once with the hint; the column's follow-on problems are left out
      problems.error(table, headerRow, text, `header "${text}": units go in square brackets, as in ${round.name} [${round.unit || 'unit'}]; ${UNUSABLE_NOTE}`);
      out.unusable.add(meant.name);
      problems.markUnusable(table, meant.name);
      problems.markUnusable(table, text);
      return;
    }
    if (!spec1) {
      if (spec.keepExtra) {
        extraIndex.push({ header: text, index });
        out.extraHeaders.push(text);
      } else problems.warning(table, headerRow, name, `unknown column "${name}" is ignored`);
      return;
    }
    if (out.present.has(canon)) {
      problems.error(table, headerRow, name, `column ${name} appears twice`);
      return;
    }
    out.present.add(canon);
    out.label[canon] = name;
    const factor = columnFactor(spec1, unit, system, table, headerRow, name, problems);
    if (factor === null) {
      out.unusable.add(canon);
      problems.markUnusable(table, canon);
      return;
    }
    shape[canon] = cellSchema(spec1, factor, raw.decimalComma === true, name);
    factors[canon] = factor;
    colIndex[canon] = index;
  });
  for (const c of spec.columns) {
    if (c.required && !out.present.has(c.name) && !out.unusable.has(c.name)) problems.error(table, headerRow, c.name, `required column ${c.name} is missing`);
  }
  const schema = z.object(shape);
  for (let i = h + 1; i < raw.rows.length; i++) {
    const cells = raw.rows[i];
    if (!cells || cells.every(isBlank)) continue;
    const obj: Record<string, Cell> = {};
    for (const [k, idx] of Object.entries(colIndex)) obj[k] = cells[idx];
    const parsed = schema.safeParse(obj);
    const row = rowNo(i);
    const extra: Record<string, Cell> = {};
    for (const e of extraIndex) extra[e.header] = cells[e.index];
    if (parsed.success) {
      out.rows.push({ row, v: parsed.data as Record<string, unknown>, extra });
    } else {
      for (const issue of parsed.error.issues) {
        const col = String(issue.path[0] ?? '');
        problems.error(table, row, out.label[col] ?? col, issue.message);
      }
      // keep the row with the good cells so referential checks still run on it
      const v: Record<string, unknown> = {};
      const bad = new Set(parsed.error.issues.map((x) => String(x.path[0])));
      for (const [k, idx] of Object.entries(colIndex)) {
        if (bad.has(k)) continue;
        const r = parseCell(byName.get(k)!, cells[idx], factors[k], raw.decimalComma === true);
        if ('value' in r) v[k] = r.value;
      }
      out.rows.push({ row, v, extra, invalid: true });
    }
  }
  return out;
}
