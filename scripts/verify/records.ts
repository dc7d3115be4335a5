/**
 * What a verification test registers beside its pass/fail: one record per numerical
 * comparison, carried to the report in the test's `meta.verification` (vitest task meta,
 * written out by the JSON reporter).
 */
export interface WithinRecord {
  kind: 'within';
  /** what is compared, when the test names it */
  quantity?: string;
  expected: number;
  computed: number;
  difference: number;
  /** the tolerance as the test states it, e.g. "rtol 0.005" or "±5e-3" */
  tolerance: string;
  source?: string;
}

/** A bound the test asserts on one value (often |computed − expected| ≤ tolerance). */
export interface BoundRecord {
  kind: 'bound';
  value: number;
  bound: number;
  relation: '<' | '≤';
}

export type VerificationRecord = WithinRecord | BoundRecord;

/** Key under which records travel in the task meta. */
export const META_KEY = 'verification';

/** at most this many records are kept per test (loops over many stations) */
export const MAX_RECORDS = 40;

interface HasMeta {
  meta: object;
}

let current: HasMeta | undefined;

/** The test being run (set by ./setup.ts before each test of a verification run). */
export function setCurrentTask(task: HasMeta | undefined): void {
  current = task;
}

/** Adds a record to the current test's meta; a no-op outside a verification run. */
export function register(record: VerificationRecord): void {
  if (!current) return;
  const meta = current.meta as Record<string, unknown>;
  const list = (meta[META_KEY] ??= []) as VerificationRecord[];
  const omitted = (meta[`${META_KEY}Omitted`] as number | undefined) ?? 0;
  if (list.length < MAX_RECORDS) list.push(record);
  else meta[`${META_KEY}Omitted`] = omitted + 1;
}
