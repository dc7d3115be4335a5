import { describe, expect, it } from 'vitest';
import { workbookUrl } from '../../src/api/models.js';
import { versionSubtitle, versionTitle } from '../../src/utils/modelVersions.js';
import type { ModelVersionSummary } from '../../shared/schemas/models.js';

const v: ModelVersionSummary = {
  version: 3, message: ' 2 member edits ', contentHash: 'x', origin: 'edit', createdBy: 2, createdByName: 'Erin Engineer', createdAt: '2026-12-05T09:30:00.000Z',
};

describe('model version labels', () => {
  it('says which version and how it was made', () => {
    expect(versionTitle(v)).toBe('Version 3 · grid edits');
    expect(versionTitle({ ...v, version: 1, origin: 'import' })).toBe('Version 1 · import');
  });

  it('gives date, author and message, leaving out what is missing', () => {
    expect(versionSubtitle(v, 0)).toBe('2026-12-05 09:30 · Erin Engineer · 2 member edits');
    expect(versionSubtitle({ ...v, createdByName: null, message: '' }, 60)).toBe('2026-12-05 10:30');
  });

  it('builds the workbook address of a version', () => {
    expect(workbookUrl(12, 3)).toBe('/api/models/12/versions/3/workbook.xlsx');
    expect(workbookUrl(12, 3, 'zip')).toBe('/api/models/12/versions/3/workbook.zip');
  });
});
