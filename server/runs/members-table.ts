/**
 * The grid payload of GET /api/runs/:id/members, built in a worker from the stored blobs:
 * rows (RunMembers) or column by column (RunMembersTable, `?layout=table`), as JSON bytes,
 * gzip-compressed when the client accepts it. The HTTP thread sends the bytes as they are.
 */
import { gunzipSync, gzipSync } from 'node:zlib';
import type { MemberUtilisation } from '../../shared/design/types.js';
import { familiesPresent, memberRows, statusCounts, type PreviousMember } from '../../shared/results/member-rows.js';
import type { MembersLayout, RunMembers, RunMembersTable } from '../../shared/schemas/runs.js';

export type MembersMeta = Pick<RunMembers, 'runId' | 'previousRunId' | 'units' | 'designCode'>;

export interface MembersTask {
  kind: 'members';
  /** the run (workers prefer the one that holds it; nothing is analysed) */
  runId: number;
  meta: MembersMeta;
  layout: MembersLayout;
  gzip: boolean;
  /** run_results.membersData of the run and of the previous done run (gzip JSON) */
  membersData: Uint8Array;
  previousData?: Uint8Array;
}

/** The rows' columns (RunMembersTable) from the run's utilisation and the previous run's. */
export function membersTable(meta: MembersMeta, members: MemberUtilisation[], previous?: Map<string, PreviousMember>): RunMembersTable {
  const strings: string[] = [];
  const index = new Map<string, number>();
  const text = (s: string) => {
    let i = index.get(s);
    if (i === undefined) {
      i = strings.length;
      strings.push(s);
      index.set(s, i);
    }
    return i;
  };
  const n = members.length;
  const keys = new Set<string>();
  for (const m of members) {
    for (const f of Object.keys(m.families)) keys.add(f);
    for (const f of Object.keys(m.familyStatus)) keys.add(f);
  }
  const column = <T>() => new Array<T>(n);
  const t: RunMembersTable = {
    ...meta,
    families: familiesPresent(members),
    counts: statusCounts(members),
    count: n,
    strings,
    member: column(), group: column(), section: column(), material: column(), check: column(),
    clause: column(), combination: column(), status: column(),
    length: column(), ratio: column(), previousRatio: column(),
    familyRatios: Object.fromEntries([...keys].map((f) => [f, column()])),
    familyStatus: Object.fromEntries([...keys].map((f) => [f, column()])),
    extras: {},
  };
  members.forEach((m, i) => {
    const before = previous?.get(m.member);
    t.member[i] = m.member;
    t.group[i] = text(m.group);
    t.section[i] = text(m.section);
    t.material[i] = text(m.material);
    t.check[i] = text(m.check);
    t.clause[i] = text(m.clause);
    t.combination[i] = text(m.combination);
    t.status[i] = text(m.status);
    t.length[i] = m.length;
    t.ratio[i] = m.ratio;
    t.previousRatio[i] = before ? before.ratio : null;
    const ratios = m.families as Record<string, number | null | undefined>;
    const statuses = m.familyStatus as Record<string, string | undefined>;
    for (const f of keys) {
      t.familyRatios[f][i] = f in ratios ? (ratios[f] ?? null) : false;
      t.familyStatus[f][i] = statuses[f] === undefined ? -1 : text(statuses[f]);
    }
    const extra: RunMembersTable['extras'][string] = {};
    if (m.warnings.length > 0) extra.warnings = m.warnings;
    if (m.vehiclePosition !== undefined) extra.vehiclePosition = m.vehiclePosition;
    if (before && before.section !== m.section) extra.previousSection = before.section;
    if (Object.keys(extra).length > 0) t.extras[i] = extra;
  });
  return t;
}

const decode = <T>(b: Uint8Array): T => JSON.parse(gunzipSync(b).toString('utf8')) as T;

/** The previous run's ratio and section by member, from its stored blob. */
export function previousMembers(previousData: Uint8Array | undefined): Map<string, PreviousMember> | undefined {
  return previousData
    ? new Map(decode<MemberUtilisation[]>(previousData).map((m): [string, PreviousMember] => [m.member, { ratio: m.ratio, section: m.section }]))
    : undefined;
}

/** The payload as JSON bytes (gzip when asked): what the worker hands back. */
export function membersPayload(task: MembersTask): Uint8Array {
  return payloadOf(task.meta, decode<MemberUtilisation[]>(task.membersData), previousMembers(task.previousData), task.layout, task.gzip);
}

/** The payload of members in hand (a run builds its grid's with its results). */
export function payloadOf(meta: MembersMeta, members: MemberUtilisation[], previous: Map<string, PreviousMember> | undefined, layout: MembersLayout, gzip: boolean): Uint8Array {
  const body: RunMembers | RunMembersTable = layout === 'table'
    ? membersTable(meta, members, previous)
    : { ...meta, families: familiesPresent(members), counts: statusCounts(members), members: memberRows(members, previous) };
  const json = Buffer.from(JSON.stringify(body), 'utf8');
  const out = gzip ? gzipSync(json, { level: 4 }) : json;
  // a buffer of its own, so it moves to the HTTP thread without a copy
  return new Uint8Array(out.buffer.slice(out.byteOffset, out.byteOffset + out.byteLength));
}
