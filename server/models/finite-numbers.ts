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
  // walk without building names (a 50k-member model has millions of values); on a hit the
  // keys on the way down say where it was
  const keys: (string | number)[] = [];
  const rows: (number | undefined)[] = [];
  const walk = (value: unknown): boolean => {
    if (typeof value === 'number') return !Number.isFinite(value);
    if (value === null || typeof value !== 'object') return false;
    if (Array.isArray(value)) {
      for (let i = 0; i < value.length; i++) {
        const v = value[i];
        if (typeof v === 'number' ? !Number.isFinite(v) : v !== null && typeof v === 'object' && walk(v)) { keys.push(i); return true; }
      }
      return false;
    }
    for (const k in value) {
      const v = (value as Record<string, unknown>)[k];
      if (typeof v === 'number' ? !Number.isFinite(v) : v !== null && typeof v === 'object' && walk(v)) {
        keys.push(k);
        const r = (value as { row?: unknown }).row;
        rows.push(typeof r === 'number' ? r : undefined);
        return true;
      }
    }
    return false;
  };
  if (!walk(model)) return null;
  const row = rows.find((r) => r !== undefined); // pushed innermost first
  keys.reverse();
  const top = String(keys[0]);
  const table = TABLE_OF[top] ?? top;
  const last = keys.length - 1;
  let column = columnName(String(keys.findLast((k) => typeof k === 'string') ?? top));
  if (typeof keys[last] === 'number' && (keys[last - 1] === 'values' || keys[last - 1] === 'springs') && SIX[table]) column = SIX[table][keys[last] as number];
  const path = keys.map((k) => (typeof k === 'number' ? `[${k}]` : `.${k}`)).join('').slice(1);
  return {
    table, row, column, path,
    message: `${table}${row !== undefined ? ` row ${row}` : ''}, ${column}: the value is not a finite number (it overflowed); nothing was saved`,
  };
}
