import { describe, expect, it } from 'vitest';
import { changedFields, projectFormValues } from '../../src/utils/projectForm.js';
import { DEFAULT_DESIGN_CODE, DEFAULT_UNITS, type Project } from '../../shared/schemas/projects.js';

const project: Project = {
  id: 4,
  name: 'Roof',
  jobNumber: 'J-1',
  client: 'C',
  description: '',
  designCode: 'aisc360-lrfd',
  units: 'us',
  createdBy: 1,
  createdAt: '2026-01-01T00:00:00.000Z',
  updatedAt: '2026-01-01T00:00:00.000Z',
};

describe('project form', () => {
  it('starts a new project from the shared defaults', () => {
    expect(projectFormValues(null)).toEqual({ name: '', jobNumber: '', client: '', description: '', designCode: DEFAULT_DESIGN_CODE, units: DEFAULT_UNITS });
  });

  it('starts an edit from the project and sends only what changed', () => {
    const values = projectFormValues(project);
    expect(changedFields(project, values)).toEqual({});
    expect(changedFields(project, { ...values, name: 'Roof B', units: 'metric' })).toEqual({ name: 'Roof B', units: 'metric' });
  });
});
