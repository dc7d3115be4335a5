/**
 * The last guard before a model version is stored: every number in it is finite. JSON turns
 * Infinity and NaN into null, which would later read as zero (a failing member shown as
 * passing), so a model holding one is refused with the table, row and column it came from.
 * The reader and the member edits refuse such values themselves; this catches any write path
 * that forgets to.
 */
import type { Model } from '../../shared/model/types.js';

/** Model array → table name of tables.md. */
const TABLE_OF: Record<string, string> = {
  nodes: 'nodes', supports: 'supports', materials: 'materials', sections: 'sections', members: 'members', cases: 'cases',
  nodeLoads: 'node_loads', memberLoads: 'member_loads', settlements: 'settlements', combinations: 'combinations',
  vehicles: 'vehicles', lanes: 'lanes', movingLoads: 'moving_loads', resultPoints: 'result_points',
};

/** Column names of the six-value arrays (`values`, `springs`) by table. */
const SIX: Record<string, readonly string[]> = {
  node_loads: ['fx', 'fy', 'fz', 'mx', 'my', 'mz'],
  settlements: ['ux', 'uy', 'uz', 'rx', 'ry', 'rz'],
  supports: ['k_ux', 'k_uy', 'k_uz', 'k_rx', 'k_ry', 'k_rz'],
};

/** A model field as its table column: `lMajor` → `l_major`, `gammaM0` → `gamma_m0`; `I_major`, `E` stay. */
function columnName(key: string): string {
  return /[a-z][A-Z]/.test(key) ? key.replace(/([a-z])([A-Z])/g, '$1_$2').toLowerCase() : key;
}

export interface NonFinite {
  table: string;
  row?: number;
  column: string;
  /** dotted path in the model (for logs) */
  path: string;
  message: string;
}

/** The first number in the model that is not finite, or null. */
export function findNonFinite(model: Model): NonFinite | null {
  const found = (table: string, row: number | undefined, column: string, path: string): NonFinite => ({
    table, row, column, path,
    message: `${table}${row !== undefined ? ` row ${row}` : ''}, ${column}: the value is not a finite number (it overflowed); nothing was saved`,
  });
  const walk = (value: unknown, table: string, row: number | undefined, column: string, path: string): NonFinite | null => {
    if (typeof value === 'number') return Number.isFinite(value) ? null : found(table, row, column, path);
    if (Array.isArray(value)) {
      for (let i = 0; i < value.length; i++) {
        const col = (column === 'values' || column === 'springs') && SIX[table] ? SIX[table][i] : column;
        const hit = walk(value[i], table, row, col, `${path}[${i}]`);
        if (hit) return hit;
      }
      return null;
    }
    if (value && typeof value === 'object') {
      const r = (value as { row?: unknown }).row;
      const rowHere = typeof r === 'number' ? r : row;
      for (const [k, v] of Object.entries(value)) {
        const hit = walk(v, table, rowHere, columnName(k), `${path}.${k}`);
        if (hit) return hit;
      }
    }
    return null;
  };
  for (const [key, value] of Object.entries(model)) {
    const hit = walk(value, TABLE_OF[key] ?? key, undefined, key, key);
    if (hit) return hit;
  }
  return null;
}
