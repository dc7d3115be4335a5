/**
 * Projects. A project holds models; its design code and units are the defaults its new
 * models start from. Text fields are never null: absent means ''.
 */
import { z } from 'zod';
import { DESIGN_CODES, type DesignCode, type UnitSystem } from '../model/types.js';

export const UNIT_SYSTEMS: readonly UnitSystem[] = ['metric', 'us'];
export const DEFAULT_DESIGN_CODE: DesignCode = 'en1993-1-1';
export const DEFAULT_UNITS: UnitSystem = 'metric';

const designCodeSchema = z.enum(DESIGN_CODES as [DesignCode, ...DesignCode[]]);
const unitsSchema = z.enum(UNIT_SYSTEMS as [UnitSystem, ...UnitSystem[]]);

const fields = {
  name: z.string().trim().min(1, 'Name is required').max(200),
  jobNumber: z.string().trim().max(50),
  client: z.string().trim().max(200),
  description: z.string().trim().max(4000),
  designCode: designCodeSchema,
  units: unitsSchema,
};

/** POST /api/projects: only `name` is required. */
export const createProjectSchema = z
  .object({
    name: fields.name,
    jobNumber: fields.jobNumber.default(''),
    client: fields.client.default(''),
    description: fields.description.default(''),
    designCode: fields.designCode.default(DEFAULT_DESIGN_CODE),
    units: fields.units.default(DEFAULT_UNITS),
  })
  .strict();
export type CreateProjectInput = z.input<typeof createProjectSchema>;
export type CreateProject = z.output<typeof createProjectSchema>;

/** PATCH /api/projects/:id: any subset of the fields. */
export const updateProjectSchema = z
  .object({
    name: fields.name.optional(),
    jobNumber: fields.jobNumber.optional(),
    client: fields.client.optional(),
    description: fields.description.optional(),
    designCode: fields.designCode.optional(),
    units: fields.units.optional(),
  })
  .strict();
export type UpdateProjectInput = z.input<typeof updateProjectSchema>;

/** A project as the API returns it (dates as ISO 8601 strings). */
export const projectSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  jobNumber: z.string(),
  client: z.string(),
  description: z.string(),
  designCode: designCodeSchema,
  units: unitsSchema,
  createdBy: z.number().int().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Project = z.infer<typeof projectSchema>;
