/** Pure helpers of the review, audit and membership client code. */
import { describe, expect, it } from 'vitest';
import { auditCsvUrl, auditQuery } from '../../src/api/audit.js';
import { countByMember } from '../../src/stores/reviews.js';
import type { Comment } from '../../shared/schemas/comments.js';

const c = (id: number, member: string | null): Comment => ({ id, runId: 1, member, body: 'x', userId: 1, userName: 'A', createdAt: '2026-01-01T00:00:00Z' });

describe('countByMember', () => {
  it('counts comments per member and leaves out comments on the whole run', () => {
    expect(countByMember([c(1, 'M1'), c(2, 'M1'), c(3, null), c(4, 'M2')])).toEqual({ M1: 2, M2: 1 });
    expect(countByMember([])).toEqual({});
  });
});

describe('audit query', () => {
  it('leaves out empty filters and encodes the rest', () => {
    expect(auditQuery({ userId: 3, action: null, projectId: undefined, from: '', to: '2026-12-31', limit: 200, offset: 0 })).toBe('?userId=3&to=2026-12-31&limit=200&offset=0');
    expect(auditQuery({})).toBe('');
  });

  it('builds the CSV address without paging', () => {
    expect(auditCsvUrl({ action: 'approve', limit: 50, offset: 100 })).toBe('/api/audit/export.csv?action=approve');
  });
});
