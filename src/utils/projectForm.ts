/** The project form's values and how they start, as pure functions. */
import type { DesignCode, UnitSystem } from '../../shared/model/types.js';
import { DEFAULT_DESIGN_CODE, DEFAULT_UNITS, type Project, type UpdateProjectInput } from '../../shared/schemas/projects.js';

export interface ProjectFormValues {
  name: string;
  jobNumber: string;
  client: string;
  description: string;
  designCode: DesignCode;
  units: UnitSystem;
}

/** Starting values: the project's own, or the defaults for a new one. */
export function projectFormValues(project: Project | null | undefined): ProjectFormValues {
  if (!project) return { name: '', jobNumber: '', client: '', description: '', designCode: DEFAULT_DESIGN_CODE, units: DEFAULT_UNITS };
  const { name, jobNumber, client, description, designCode, units } = project;
  return { name, jobNumber, client, description, designCode, units };
}

/** Only the fields that differ from the project, for a PATCH. */
export function changedFields(project: Project, values: ProjectFormValues): UpdateProjectInput {
  const patch: UpdateProjectInput = {};
  const keys = Object.keys(values) as (keyof ProjectFormValues)[];
  for (const key of keys) {
    if (values[key] !== project[key]) (patch as Record<string, unknown>)[key] = values[key];
  }
  return patch;
}
