/**
 * XLSX row source: one sheet per table (the sheet name is the table name), row numbers as
 * the sheet shows them. Cells give numbers, text, saved formula results and rich text.
 * Pure: takes the workbook's bytes, never a path; runs in Node, a worker and a browser.
 *
 * Bounded by construction (issue 12): the zip's central directory is checked first (sheet
 * count, declared uncompressed size) without inflating anything; each part is then inflated
 * as a stream (fflate, 16 kB of compressed bytes at a time) straight into the XML parser
 * (saxes), never held whole. Rows, columns and cells are counted as they come and each
 * part's inflated bytes are counted against the size its directory entry declared (a part
 * that lies is refused), so a workbook over a limit is refused at the first row that
 * crosses it, in milliseconds and in the memory of one chunk.
 */
import { Inflate } from 'fflate';
import { SaxesParser, type SaxesTagPlain } from 'saxes';
import type { Problem, ReadResult } from '../model/types.js';
import { canonicalName } from './names.js';
import { readTables, type ReadOptions } from './read.js';
import type { Cell, RawTable } from './table.js';

export interface XlsxLimits {
  /** worksheets in the workbook */
  maxSheets: number;
  /** rows with a value, all sheets together */
  maxRows: number;
  /** highest column a cell may sit in (A = 1) */
  maxColumns: number;
  /** cell elements, all sheets together (empty styled cells count too) */
  maxCells: number;
  /** sum of the declared uncompressed sizes of the zip's parts */
  maxUncompressedBytes: number;
}

export const DEFAULT_XLSX_LIMITS: XlsxLimits = {
  maxSheets: 50,
  maxRows: 200_000,
  maxColumns: 200,
  maxCells: 4_000_000,
  maxUncompressedBytes: 200 * 1024 * 1024,
};

const LIMIT_WORDS: Record<keyof XlsxLimits, string> = {
  maxSheets: 'sheet',
  maxRows: 'row',
  maxColumns: 'column',
  maxCells: 'cell',
  maxUncompressedBytes: 'size',
};

/** A workbook over one of the limits; `limit` names which (also in the message: it crosses worker threads as text). */
export class XlsxLimitError extends Error {
  override name = 'XlsxLimitError';
  constructor(
    readonly limit: keyof XlsxLimits,
    detail: string,
  ) {
    super(`the workbook is over the ${LIMIT_WORDS[limit]} limit: ${detail}`);
  }
}

/** The limit a refusal message names (from XlsxLimitError's message), or null. */
export function limitOfMessage(message: string): keyof XlsxLimits | null {
  const m = /^the workbook is over the (\w+) limit: /.exec(message);
  if (!m) return null;
  return (Object.keys(LIMIT_WORDS) as (keyof XlsxLimits)[]).find((k) => LIMIT_WORDS[k] === m[1]) ?? null;
}

/** A formula cell the workbook saved without its value (written by a program that does not calculate). */
export interface UnsavedFormula {
  sheet: string;
  row: number;
  /** 1-based column */
  column: number;
  formula: string;
}

export interface WorkbookContent {
  tables: RawTable[];
  unsavedFormulas: UnsavedFormula[];
}

const WORKBOOK = 'xl/workbook.xml';
const WORKBOOK_RELS = 'xl/_rels/workbook.xml.rels';
const SHARED_STRINGS = 'xl/sharedStrings.xml';
const SHEET_PART = /^xl\/worksheets\/[^/]+\.xml$/i;
const TEXT_CHUNK = 1 << 20;

function fmt(n: number): string {
  return n.toLocaleString('en');
}

function mb(bytes: number): string {
  return `${+(bytes / 1024 / 1024).toFixed(1)} MB`;
}

/** Column letters → 1-based index (`A` → 1, `XFD` → 16384); 0 when none. */
export function columnIndex(ref: string): number {
  let n = 0;
  for (let i = 0; i < ref.length; i++) {
    const c = ref.charCodeAt(i) | 0x20;
    if (c < 97 || c > 122) break;
    n = n * 26 + (c - 96);
  }
  return n;
}

/** 1-based index → column letters. */
export function columnLetters(index: number): string {
  let s = '';
  for (let n = index; n > 0; n = Math.floor((n - 1) / 26)) s = String.fromCharCode(65 + ((n - 1) % 26)) + s;
  return s;
}

function localName(name: string): string {
  const i = name.indexOf(':');
  return i === -1 ? name : name.slice(i + 1);
}

/** One part of the zip, as its central directory describes it. */
interface ZipPart {
  /** declared uncompressed size */
  size: number;
  compressedSize: number;
  method: number;
  /** offset of its local header */
  offset: number;
}

function u16(b: Uint8Array, i: number): number {
  return b[i] | (b[i + 1] << 8);
}

function u32(b: Uint8Array, i: number): number {
  return (b[i] | (b[i + 1] << 8) | (b[i + 2] << 16)) + b[i + 3] * 0x1000000;
}

/** The central directory: part name → sizes and offset (zip64 is refused: no workbook we read needs it). */
function centralDirectory(bytes: Uint8Array): Map<string, ZipPart> {
  let end = -1;
  for (let i = bytes.length - 22; i >= Math.max(0, bytes.length - 22 - 0xffff); i--) {
    if (u32(bytes, i) === 0x06054b50) {
      end = i;
      break;
    }
  }
  if (end < 0) throw new Error('it is not a zip archive (no central directory)');
  const count = u16(bytes, end + 10);
  let at = u32(bytes, end + 16);
  if (count === 0xffff || at === 0xffffffff) throw new Error('it is a zip64 archive, which no workbook of this size needs');
  const names = new TextDecoder('utf-8');
  const parts = new Map<string, ZipPart>();
  for (let n = 0; n < count; n++) {
    if (at + 46 > bytes.length || u32(bytes, at) !== 0x02014b50) throw new Error('its zip directory is damaged');
    const nameLength = u16(bytes, at + 28);
    const name = names.decode(bytes.subarray(at + 46, at + 46 + nameLength));
    parts.set(name, { method: u16(bytes, at + 10), compressedSize: u32(bytes, at + 20), size: u32(bytes, at + 24), offset: u32(bytes, at + 42) });
    at += 46 + nameLength + u16(bytes, at + 30) + u16(bytes, at + 32);
  }
  return parts;
}

/**
 * The zip's parts with their declared sizes, read from the central directory only (nothing
 * is inflated). Refuses a workbook over the sheet-count or uncompressed-size limit.
 */
export function inspectWorkbook(bytes: Uint8Array, limits: XlsxLimits = DEFAULT_XLSX_LIMITS): Map<string, ZipPart> {
  const parts = centralDirectory(bytes);
  let total = 0;
  for (const p of parts.values()) total += p.size;
  if (total > limits.maxUncompressedBytes) {
    throw new XlsxLimitError('maxUncompressedBytes', `it unpacks to ${mb(total)}; at most ${mb(limits.maxUncompressedBytes)} are read`);
  }
  const sheets = [...parts.keys()].filter((n) => SHEET_PART.test(n)).length;
  if (sheets > limits.maxSheets) throw new XlsxLimitError('maxSheets', `it has ${fmt(sheets)} sheets; at most ${fmt(limits.maxSheets)} are read`);
  if (!parts.has(WORKBOOK)) throw new Error(`it has no ${WORKBOOK}`);
  return parts;
}

interface XmlHandlers {
  open?: (tag: SaxesTagPlain, name: string) => void;
  text?: (text: string) => void;
  close?: (name: string) => void;
}

const COMPRESSED_CHUNK = 16 * 1024;

/**
 * Streams one part through the inflater into saxes; a handler may throw to stop. The part's
 * inflated bytes may not exceed the size its directory entry declares.
 */
function parsePart(bytes: Uint8Array, parts: Map<string, ZipPart>, name: string, h: XmlHandlers): boolean {
  const p = parts.get(name);
  if (!p) return false;
  if (u32(bytes, p.offset) !== 0x04034b50) throw new Error(`its part ${name} is damaged`);
  const start = p.offset + 30 + u16(bytes, p.offset + 26) + u16(bytes, p.offset + 28);
  const data = bytes.subarray(start, start + p.compressedSize);
  const parser = new SaxesParser();
  if (h.open) parser.on('opentag', (t) => h.open!(t, localName(t.name)));
  if (h.text) {
    parser.on('text', h.text);
    parser.on('cdata', h.text);
  }
  if (h.close) parser.on('closetag', (t) => h.close!(localName(t.name)));
  parser.on('error', (e) => {
    throw e;
  });
  const decoder = new TextDecoder('utf-8');
  let inflated = 0;
  const take = (chunk: Uint8Array) => {
    inflated += chunk.length;
    if (inflated > p.size) throw new XlsxLimitError('maxUncompressedBytes', `its part ${name} unpacks to more than the ${fmt(p.size)} bytes its zip directory declares`);
    for (let i = 0; i < chunk.length; i += TEXT_CHUNK) parser.write(decoder.decode(chunk.subarray(i, i + TEXT_CHUNK), { stream: true }));
  };
  if (p.method === 0) {
    take(data);
  } else if (p.method === 8) {
    const inflater = new Inflate((chunk) => take(chunk));
    for (let i = 0; i < data.length; i += COMPRESSED_CHUNK) inflater.push(data.subarray(i, i + COMPRESSED_CHUNK), i + COMPRESSED_CHUNK >= data.length);
    if (data.length === 0) inflater.push(new Uint8Array(0), true);
  } else {
    throw new Error(`its part ${name} uses compression method ${p.method}, which XLSX files do not use`);
  }
  parser.write(decoder.decode());
  parser.close();
  return true;
}

/** Sheet names in workbook order with their part names. */
function sheetList(bytes: Uint8Array, parts: Map<string, ZipPart>): { name: string; part: string }[] {
  const targets = new Map<string, string>();
  parsePart(bytes, parts, WORKBOOK_RELS, {
    open: (t, name) => {
      if (name !== 'Relationship') return;
      const target = String(t.attributes.Target ?? '');
      targets.set(String(t.attributes.Id ?? ''), target.startsWith('/') ? target.slice(1) : `xl/${target.replace(/^\.\//, '')}`);
    },
  });
  const sheets: { name: string; part: string }[] = [];
  parsePart(bytes, parts, WORKBOOK, {
    open: (t, name) => {
      if (name !== 'sheet') return;
      const rid = Object.entries(t.attributes).find(([k]) => localName(k) === 'id' && k !== 'sheetId')?.[1];
      const index = sheets.length + 1;
      sheets.push({ name: String(t.attributes.name ?? `Sheet${index}`), part: targets.get(String(rid ?? '')) ?? `xl/worksheets/sheet${index}.xml` });
    },
  });
  return sheets;
}

function sharedStrings(bytes: Uint8Array, parts: Map<string, ZipPart>, limits: XlsxLimits): string[] {
  const list: string[] = [];
  let text = '';
  let inT = false;
  let depthRph = 0;
  parsePart(bytes, parts, SHARED_STRINGS, {
    open: (_t, name) => {
      if (name === 'si') text = '';
      else if (name === 't') inT = true;
      else if (name === 'rPh') depthRph++;
    },
    text: (s) => {
      if (inT && depthRph === 0) text += s;
    },
    close: (name) => {
      if (name === 't') inT = false;
      else if (name === 'rPh') depthRph--;
      else if (name === 'si') {
        list.push(text);
        if (list.length > limits.maxCells) throw new XlsxLimitError('maxCells', `it holds more than ${fmt(limits.maxCells)} shared strings`);
      }
    },
  });
  return list;
}

/** Running totals across sheets, checked as each row and cell arrives. */
interface Budget {
  rows: number;
  cells: number;
}

function sheetTable(bytes: Uint8Array, parts: Map<string, ZipPart>, part: string, sheet: string, strings: string[], limits: XlsxLimits, budget: Budget, unsaved: UnsavedFormula[]): RawTable {
  const rows: Cell[][] = [];
  const rowNumbers: number[] = [];
  let rowNumber = 0;
  let cells: Cell[] = [];
  let column = 0;
  let type = '';
  let value: string | null = null;
  let formula: string | null = null;
  let inline = '';
  let capture: 'v' | 'f' | 't' | null = null;
  let depthRph = 0;

  const finishCell = () => {
    let cell: Cell = null;
    if (formula !== null && value === null) {
      unsaved.push({ sheet, row: rowNumber, column, formula });
    } else if (type === 'inlineStr') {
      cell = inline !== '' ? inline : value;
    } else if (value !== null) {
      if (type === 's') cell = strings[Number(value)] ?? null;
      else if (type === 'b') cell = value === '1' || value === 'true' ? 'true' : 'false';
      else if (type === 'str' || type === 'e' || type === 'd') cell = value;
      else cell = value.trim() === '' ? null : Number(value);
    }
    if (cell !== null) cells[column - 1] = cell;
  };

  const found = parsePart(bytes, parts, part, {
    open: (t, name) => {
      switch (name) {
        case 'row': {
          const r = Number(t.attributes.r);
          rowNumber = Number.isInteger(r) && r > 0 ? r : rowNumber + 1;
          cells = [];
          column = 0;
          break;
        }
        case 'c': {
          const ref = t.attributes.r;
          column = ref ? columnIndex(String(ref)) : column + 1;
          if (column > limits.maxColumns) {
            throw new XlsxLimitError('maxColumns', `sheet ${sheet} has a cell in column ${columnLetters(column)} (row ${rowNumber}); at most ${fmt(limits.maxColumns)} columns are read`);
          }
          if (++budget.cells > limits.maxCells) {
            throw new XlsxLimitError('maxCells', `it has more than ${fmt(limits.maxCells)} cells (sheet ${sheet}, row ${rowNumber})`);
          }
          type = String(t.attributes.t ?? 'n');
          value = null;
          formula = null;
          inline = '';
          break;
        }
        case 'v':
          capture = 'v';
          value = '';
          break;
        case 'f':
          capture = 'f';
          formula = '';
          break;
        case 't':
          capture = 't';
          break;
        case 'rPh':
          depthRph++;
          break;
      }
    },
    text: (s) => {
      if (capture === 'v') value += s;
      else if (capture === 'f') formula += s;
      else if (capture === 't' && depthRph === 0) inline += s;
    },
    close: (name) => {
      switch (name) {
        case 'v':
        case 'f':
        case 't':
          capture = null;
          break;
        case 'rPh':
          depthRph--;
          break;
        case 'c':
          finishCell();
          break;
        case 'row': {
          if (cells.length === 0) break;
          if (++budget.rows > limits.maxRows) {
            throw new XlsxLimitError('maxRows', `it has more than ${fmt(limits.maxRows)} rows (sheet ${sheet}, row ${rowNumber})`);
          }
          for (let i = 0; i < cells.length; i++) if (cells[i] === undefined) cells[i] = null;
          rows.push(cells);
          rowNumbers.push(rowNumber);
          break;
        }
      }
    },
  });
  if (!found) throw new Error(`sheet ${sheet} has no part ${part}`);
  return { name: sheet, rows, rowNumbers, source: 'xlsx' };
}

/** The sheets of a workbook as raw tables, and the formulas saved without a value. */
export function workbookContent(buffer: ArrayBuffer | Uint8Array, limits: Partial<XlsxLimits> = {}): WorkbookContent {
  const bytes = buffer instanceof Uint8Array ? buffer : new Uint8Array(buffer);
  const lim: XlsxLimits = { ...DEFAULT_XLSX_LIMITS, ...limits };
  const parts = inspectWorkbook(bytes, lim);
  const sheets = sheetList(bytes, parts);
  if (sheets.length > lim.maxSheets) throw new XlsxLimitError('maxSheets', `it has ${fmt(sheets.length)} sheets; at most ${fmt(lim.maxSheets)} are read`);
  const strings = sharedStrings(bytes, parts, lim);
  const budget: Budget = { rows: 0, cells: 0 };
  const unsavedFormulas: UnsavedFormula[] = [];
  const tables: RawTable[] = [];
  for (const s of sheets) tables.push(sheetTable(bytes, parts, s.part, s.name, strings, lim, budget, unsavedFormulas));
  return { tables, unsavedFormulas };
}

/** The sheets of a workbook as raw tables. */
export async function workbookTables(buffer: ArrayBuffer | Uint8Array, limits: Partial<XlsxLimits> = {}): Promise<RawTable[]> {
  return workbookContent(buffer, limits).tables;
}

/** An error per formula cell without a saved value, named by table, row and column header. */
function unsavedFormulaProblems(content: WorkbookContent): Problem[] {
  return content.unsavedFormulas.slice(0, 1000).map((u) => {
    const header = content.tables.find((t) => t.name === u.sheet)?.rows[0]?.[u.column - 1];
    const ref = `${columnLetters(u.column)}${u.row}`;
    return {
      severity: 'error',
      table: canonicalName(u.sheet),
      row: u.row,
      column: typeof header === 'string' && header.trim() !== '' ? header.trim() : columnLetters(u.column),
      message: `cell ${ref} holds the formula =${u.formula} with no saved value: open the workbook in a spreadsheet program, let it calculate and save it, or type the value`,
    };
  });
}

export interface XlsxReadOptions extends ReadOptions {
  limits?: Partial<XlsxLimits>;
}

/**
 * Read a model from an XLSX workbook. A broken file is a problem; the only rejection is an
 * XlsxLimitError (a workbook over a limit is refused, not read).
 */
export async function readWorkbook(buffer: ArrayBuffer | Uint8Array, options: XlsxReadOptions = {}): Promise<ReadResult> {
  let content: WorkbookContent;
  try {
    content = workbookContent(buffer, options.limits);
  } catch (e) {
    if (e instanceof XlsxLimitError) throw e;
    return { ok: false, problems: [{ severity: 'error', table: '', message: `the file is not a readable XLSX workbook: ${(e as Error).message}` }], counts: {} };
  }
  const result = readTables(content.tables, options);
  if (content.unsavedFormulas.length === 0) return result;
  const others = result.ok ? result.warnings : result.problems;
  return { ok: false, problems: [...unsavedFormulaProblems(content), ...others], counts: result.counts };
}
