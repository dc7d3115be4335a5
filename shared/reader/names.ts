/**
 * Name matching for tables, columns and enum values (tables.md): case-insensitive,
 * surrounding spaces ignored, `_`, `-` and a space equivalent.
 */

/** Canonical form of a table or column name: `Node Loads` → `node_loads`. */
export function canonicalName(name: string): string {
  return name.trim().toLowerCase().replace(/[\s_-]+/g, '_');
}

/** Key used to match an enum value the user typed against the allowed ones. */
function enumKey(value: string): string {
  return value.trim().toLowerCase().replace(/[\s_-]+/g, '');
}

/** The allowed value that `text` names, or undefined. */
export function matchEnum<T extends string>(text: string, allowed: readonly T[]): T | undefined {
  const k = enumKey(text);
  return allowed.find((a) => enumKey(a) === k);
}

/**
 * An identifier as text. Numbers written in number-typed cells (or plain `12.0` text) name
 * the same id as `12`.
 */
export function idText(value: string | number): string {
  if (typeof value === 'number') return Number.isInteger(value) ? String(value) : String(value);
  const s = value.trim();
  const m = /^([+-]?\d+)\.0*$/.exec(s);
  return m ? m[1] : s;
}
