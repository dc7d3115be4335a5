/** The grid payload column by column: the same rows as the row layout, and compact. */
import { gunzipSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import type { MemberUtilisation } from '../../../shared/design/types.js';
import { memberRows } from '../../../shared/results/member-rows.js';
import { runMembersTableSchema } from '../../../shared/schemas/runs.js';
import { membersPayload, membersTable, type MembersMeta } from '../../../server/runs/members-table.js';
import { encodeJson } from '../../../server/models/model-codec.js';
import { membersFromTable } from '../../../src/utils/resultsRows.js';

const meta: MembersMeta = { runId: 7, previousRunId: 6, units: 'metric', designCode: 'en1993-1-1' };

function util(i: number): MemberUtilisation {
  const checked = i % 5 !== 0;
  return {
    member: `M${i}`, group: i % 2 ? 'beams' : 'columns', section: i % 3 ? 'IPE400' : 'HEB300', material: 'S355',
    length: 6 + i / 7, ratio: checked ? (i % 13) / 10 + 1 / 3 : null, check: 'bending', clause: '6.2.5', combination: `ULS${i % 3}`,
    status: !checked ? 'not checked' : (i % 13) / 10 + 1 / 3 > 1 ? 'fail' : 'pass',
    families: checked ? { bending_major: (i % 13) / 10 + 1 / 3, ...(i % 4 ? { shear_major: null } : {}) } : {},
    familyStatus: checked ? { bending_major: 'pass', ...(i % 4 ? { shear_major: 'not checked' } : {}) } : {},
    warnings: i % 11 === 0 ? ['lateral restraint assumed'] : [],
    ...(i === 3 ? { vehiclePosition: 12.5 } : {}),
  };
}

describe('members payload, column by column', () => {
  const members = Array.from({ length: 200 }, (_, i) => util(i));
  const previous = new Map(members.slice(0, 150).map((m, i) => [m.member, { ratio: i % 7 ? m.ratio : 0.1, section: i % 9 ? m.section : 'IPE360' }]));

  it('gives back exactly the rows of the row layout (numbers, nulls, absent families, extras)', () => {
    const table = membersTable(meta, members, previous);
    expect(runMembersTableSchema.safeParse(JSON.parse(JSON.stringify(table))).success).toBe(true);
    const back = membersFromTable(JSON.parse(JSON.stringify(table)));
    expect(back.members).toEqual(memberRows(members, previous));
    expect(back).toMatchObject({ ...meta, counts: { pass: expect.any(Number), fail: expect.any(Number), notChecked: 40 } });
  });

  it('is built from the stored blobs, gzip when asked, and is far smaller than the rows', () => {
    const many = Array.from({ length: 20_000 }, (_, i) => util(i));
    const task = { kind: 'members' as const, runId: 7, meta, gzip: false, membersData: encodeJson(many) };
    const rows = membersPayload({ ...task, layout: 'rows' });
    const table = membersPayload({ ...task, layout: 'table' });
    const zipped = membersPayload({ ...task, layout: 'table', gzip: true });
    expect(JSON.parse(gunzipSync(zipped).toString('utf8'))).toEqual(JSON.parse(Buffer.from(table).toString('utf8')));
    expect(table.byteLength).toBeLessThan(rows.byteLength / 2);
    expect(zipped.byteLength).toBeLessThan(table.byteLength / 3);
  });
});
