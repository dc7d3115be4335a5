/**
 * CSV row source: one file per table (`<table>.csv`), UTF-8 (a byte-order mark is dropped),
 * comma or semicolon separated, first row the header. Pure: takes text, not files.
 */
import Papa from 'papaparse';
import type { ReadResult } from '../model/types.js';
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

/** One CSV text → a raw table; row numbers are the file's line numbers. */
export function csvTable(file: CsvFile): RawTable {
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
  return { name: tableNameOfFile(file.name), rows, rowNumbers, source: 'csv', decimalComma: delimiter === ';' };
}

/** Read a model from CSV files, one per table. */
export function readCsvFiles(files: CsvFile[], options: ReadOptions = {}): ReadResult {
  try {
    return readTables(files.map(csvTable), options);
  } catch (e) {
    return { ok: false, problems: [{ severity: 'error', table: '', message: `the CSV files could not be read: ${(e as Error).message}` }], counts: {} };
  }
}
