/**
 * An export table (header with bracketed units, rows in display units) and its CSV text.
 * Text cells that came from users and begin with =, +, - or @ are neutralised with a
 * leading apostrophe so a spreadsheet never runs them as a formula.
 */
export type ExportCell = string | number | null;

export interface ExportColumn {
  header: string;
  /** xlsx number format */
  numFmt?: string;
  width?: number;
  /** the column holding governing ratios (fills by band) */
  ratio?: boolean;
}

export interface ExportTable {
  title: string;
  columns: ExportColumn[];
  rows: ExportCell[][];
  /** row index → status of that row, for band fills (utilisation and checks) */
  statuses?: string[];
}

const FORMULA_START = /^[=+\-@\t\r]/;

export function neutralise(text: string): string {
  return FORMULA_START.test(text) ? `'${text}` : text;
}

function csvField(cell: ExportCell): string {
  if (cell === null) return '';
  if (typeof cell === 'number') return Number.isFinite(cell) ? String(Number(cell.toPrecision(12))) : '';
  const safe = neutralise(cell);
  return /[",\n\r;]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

export function toCsv(table: ExportTable): string {
  const lines = [table.columns.map((c) => csvField(c.header)).join(',')];
  for (const row of table.rows) lines.push(row.map(csvField).join(','));
  return lines.join('\r\n') + '\r\n';
}
