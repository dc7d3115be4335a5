/**
 * CSV serialiser for result tables (RFC 4180: comma separated, CRLF line ends, fields with
 * a comma, quote or line break quoted, quotes doubled). Text that a spreadsheet would take
 * for a formula (beginning with `=`, `+`, `-`, `@`, tab or carriage return) gets a leading
 * `'`; numbers are written as numbers, never prefixed.
 */
import type { ResultCell, ResultTable } from './results.js';

/** At least `digits` significant digits; no exponent for ordinary magnitudes. */
export function formatExportNumber(value: number, digits = 7): string {
  if (!Number.isFinite(value)) return '';
  if (value === 0 || Object.is(value, -0)) return '0';
  return String(Number(value.toPrecision(digits)));
}

/** Text that a spreadsheet might run as a formula gets a leading apostrophe. */
export function neutraliseText(text: string): string {
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

function quote(field: string): string {
  return /[",\r\n]/.test(field) ? `"${field.replace(/"/g, '""')}"` : field;
}

export function csvCell(cell: ResultCell): string {
  if (cell === null || cell === undefined) return '';
  if (typeof cell === 'number') return formatExportNumber(cell);
  return quote(neutraliseText(cell));
}

/** The whole table as CSV text (header line first). */
export function toCsv(table: ResultTable): string {
  const lines = [table.header.map((h) => quote(h)).join(',')];
  for (const row of table.rows) lines.push(row.map(csvCell).join(','));
  return lines.join('\r\n') + '\r\n';
}

/** The same text as `toCsv`, in pieces of about `rowsPerChunk` lines (for streaming a big table). */
export function* csvChunks(table: ResultTable, rowsPerChunk = 2000): Generator<string> {
  let lines = [table.header.map((h) => quote(h)).join(',')];
  for (const row of table.rows) {
    lines.push(row.map(csvCell).join(','));
    if (lines.length >= rowsPerChunk) {
      yield lines.join('\r\n') + '\r\n';
      lines = [];
    }
  }
  if (lines.length > 0) yield lines.join('\r\n') + '\r\n';
}
