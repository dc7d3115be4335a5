/**
 * CSV row source: one file per table (`<table>.csv`), UTF-8 (a byte-order mark is dropped;
 * UTF-16 with its byte-order mark is read too), comma or semicolon separated, first row the
 * header. Pure: takes text or bytes, not files.
 */
import Papa from 'papaparse';
import type { Problem, ReadResult } from '../model/types.js';
import { readTables, type ReadOptions } from './read.js';
import type { RawTable } from './table.js';

export interface CsvFile {
  /** file name (a path is fine): `members.csv` → table `members` */
  name: string;
  text: string;
}

/** Table name from a file name: the base name without its extension. */
export function tableNameOfFile(fileName: string): string {
  const base = fileName.split(/[\\/]/).pop() ?? fileName;
  return base.replace(/\.csv$/i, '').replace(/\.txt$/i, '');
}

/** `;` when the header line holds more semicolons than commas (outside quotes), else `,`. */
export function detectDelimiter(text: string): ',' | ';' {
  const header = text.split(/\r\n|\n|\r/).find((l) => l.trim() !== '') ?? '';
  let commas = 0;
  let semis = 0;
  let quoted = false;
  for (const ch of header) {
    if (ch === '"') quoted = !quoted;
    else if (!quoted && ch === ',') commas++;
    else if (!quoted && ch === ';') semis++;
  }
  return semis > commas ? ';' : ',';
}

/** A CSV file as it was uploaded. */
export interface CsvBytes {
  name: string;
  data: Uint8Array;
}

/**
 * The text of a CSV file: UTF-8 (with or without its byte-order mark) or UTF-16 with its
 * byte-order mark. UTF-16 without one (NUL bytes between the characters) is refused by name.
 */
export function decodeCsv(file: CsvBytes): { text: string } | { problem: Problem } {
  const d = file.data;
  if (d.length >= 2 && d[0] === 0xff && d[1] === 0xfe) return { text: new TextDecoder('utf-16le').decode(d.subarray(2)) };
  if (d.length >= 2 && d[0] === 0xfe && d[1] === 0xff) return { text: new TextDecoder('utf-16be').decode(d.subarray(2)) };
  const head = d.subarray(0, 4096);
  if (head.includes(0)) {
    return {
      problem: {
        severity: 'error',
        table: tableNameOfFile(file.name),
        message: `${file.name} is not UTF-8 text (it holds NUL bytes, as UTF-16 without a byte-order mark does): save it as "CSV UTF-8"`,
      },
    };
  }
  return { text: new TextDecoder('utf-8').decode(d) };
}

/** One CSV text → a raw table, and the problem that stops reading it (an unclosed quote). */
export function csvTableChecked(file: CsvFile): { table: RawTable; problem?: Problem } {
  const text = file.text.replace(/^\uFEFF/, '');
  const delimiter = detectDelimiter(text);
  const parsed = Papa.parse<string[]>(text, { delimiter, skipEmptyLines: false });
  const rows: string[][] = parsed.data;
  const rowNumbers: number[] = [];
  let line = 1;
  for (const r of rows) {
    rowNumbers.push(line);
    // a quoted field may span lines
    line += 1 + r.reduce((n, f) => n + (f.match(/\r\n|\n|\r/g)?.length ?? 0), 0);
  }
  const name = tableNameOfFile(file.name);
  const table: RawTable = { name, rows, rowNumbers, source: 'csv', decimalComma: delimiter === ';' };
  const open = parsed.errors.find((e) => e.code === 'MissingQuotes');
  if (!open || open.row === undefined) return { table };
  // the unclosed field swallowed the rest of the file: it is the last field of its row
  const at = Math.min(open.row, rows.length - 1);
  const field = Math.max(0, (rows[at]?.length ?? 1) - 1);
  const header = at > 0 ? rows[0]?.[field]?.trim() : undefined;
  return {
    table: { ...table, rows: rows.slice(0, at), rowNumbers: rowNumbers.slice(0, at) },
    problem: {
      severity: 'error',
      table: name,
      row: rowNumbers[at],
      column: header || undefined,
      message: `a quote (") opens here and is never closed, so the rest of ${file.name} cannot be read: close the quote or remove it`,
    },
  };
}

/** One CSV text → a raw table; row numbers are the file's line numbers. */
export function csvTable(file: CsvFile): RawTable {
  return csvTableChecked(file).table;
}

/** Read a model from CSV files, one per table. A file that cannot be read as a table stops the reading with its one error. */
export function readCsvFiles(files: CsvFile[], options: ReadOptions = {}): ReadResult {
  try {
    const checked = files.map(csvTableChecked);
    const fatal = checked.flatMap((c) => (c.problem ? [c.problem] : []));
    if (fatal.length > 0) return { ok: false, problems: fatal, counts: {} };
    return readTables(
      checked.map((c) => c.table),
      options,
    );
  } catch (e) {
    return { ok: false, problems: [{ severity: 'error', table: '', message: `the CSV files could not be read: ${(e as Error).message}` }], counts: {} };
  }
}

/** Read a model from uploaded CSV files (bytes): decoded by their byte-order mark, then read. */
export function readCsvBytes(files: CsvBytes[], options: ReadOptions = {}): ReadResult {
  const texts: CsvFile[] = [];
  const refused: Problem[] = [];
  for (const f of files) {
    const d = decodeCsv(f);
    if ('problem' in d) refused.push(d.problem);
    else texts.push({ name: f.name, text: d.text });
  }
  if (refused.length > 0) return { ok: false, problems: refused, counts: {} };
  return readCsvFiles(texts, options);
}
