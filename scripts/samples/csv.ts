/** CSV text of a sample table (comma separated, fields with a comma or quote quoted). */
import type { Value } from './models.js';

function csvField(v: Value): string {
  if (v === null) return '';
  const s = typeof v === 'number' ? String(v) : v;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function tableCsv(rows: Value[][]): string {
  return rows.map((r) => r.map(csvField).join(',')).join('\n') + '\n';
}
