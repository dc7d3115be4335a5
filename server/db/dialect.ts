/**
 * One set of entities for both databases. The entities name SQLite column types (`blob`,
 * `datetime`, `real`); on PostgreSQL each EntitySchema is copied with the types that hold the
 * same values there: `bytea`, `timestamptz` (instants, read back as the same Date), and
 * `double precision` (SQLite's REAL is 8 bytes; PostgreSQL's `real` would be 4).
 */
import { EntitySchema, type EntitySchemaColumnOptions } from 'typeorm';

export type Dialect = 'sqlite' | 'postgres';

const POSTGRES_TYPES: Record<string, string> = {
  blob: 'bytea',
  datetime: 'timestamptz',
  real: 'double precision',
};

/** The entities as the dialect needs them (SQLite: unchanged). */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export function entitiesFor(dialect: Dialect, entities: (EntitySchema<any> | Function)[]): (EntitySchema<any> | Function)[] {
  if (dialect === 'sqlite') return entities;
  return entities.map((e) => {
    if (!(e instanceof EntitySchema)) return e;
    const columns: Record<string, EntitySchemaColumnOptions> = {};
    for (const [name, column] of Object.entries(e.options.columns as Record<string, EntitySchemaColumnOptions>)) {
      const type = typeof column.type === 'string' ? POSTGRES_TYPES[column.type] : undefined;
      columns[name] = type ? { ...column, type: type as EntitySchemaColumnOptions['type'] } : column;
    }
    return new EntitySchema({ ...e.options, columns });
  });
}
