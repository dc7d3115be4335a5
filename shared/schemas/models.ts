/**
 * Models and model versions. A model belongs to a project and holds a sequence of
 * versions; every change (an import, a set of member edits) makes a new version.
 * Edits carry the version they were made against (`baseVersion`); a stale one gets 409.
 *
 * Routes (all behind sign-in; writes need engineer or above):
 *   GET    /api/projects/:projectId/models          → ModelSummary[]
 *   GET    /api/models/:id                          → ModelDetail
 *   PATCH  /api/models/:id                          { name } → ModelSummary
 *   GET    /api/models/:id/versions                 → ModelVersionSummary[]
 *   GET    /api/models/:id/members[?version=]       → EditableMembers (values in the model's unit system)
 *   PATCH  /api/models/:id/members                  MemberEditsInput → ModelSummary (one new version)
 */
import { z } from 'zod';
import { DESIGN_CODES, type DesignCode, type UnitSystem } from '../model/types.js';

const designCodeSchema = z.enum(DESIGN_CODES as [DesignCode, ...DesignCode[]]);
const unitsSchema = z.enum(['metric', 'us'] as [UnitSystem, ...UnitSystem[]]);

/** A model as lists show it (dates ISO 8601). */
export const modelSummarySchema = z.object({
  id: z.number().int(),
  projectId: z.number().int(),
  name: z.string(),
  currentVersion: z.number().int(),
  designCode: designCodeSchema,
  units: unitsSchema,
  counts: z.record(z.string(), z.number()),
  createdBy: z.number().int().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
  /** the latest run of the model, if any */
  lastRun: z
    .object({ id: z.number().int(), status: z.string(), version: z.number().int(), maxRatio: z.number().nullable() })
    .nullable(),
});
export type ModelSummary = z.infer<typeof modelSummarySchema>;

export const modelVersionSummarySchema = z.object({
  version: z.number().int(),
  message: z.string(),
  contentHash: z.string(),
  /** how the version was made */
  origin: z.enum(['import', 'edit']),
  createdBy: z.number().int().nullable(),
  createdByName: z.string().nullable(),
  createdAt: z.string(),
});
export type ModelVersionSummary = z.infer<typeof modelVersionSummarySchema>;

/** GET /api/models/:id — summary plus the current version's settings and choice lists. */
export const modelDetailSchema = modelSummarySchema.extend({
  settings: z.object({
    title: z.string(),
    units: unitsSchema,
    verticalAxis: z.enum(['Y', 'Z']),
    designCode: designCodeSchema,
    combinationRule: z.string(),
    deflectionLimit: z.number(),
    gammaM0: z.number(),
    gammaM1: z.number(),
    gammaM2: z.number(),
    /** issues 10–11 (tables.md settings); always present for models read today */
    stations: z.number().int().optional(),
    analysis: z.enum(['first_order', 'second_order']).optional(),
    bucklingModes: z.number().int().optional(),
    modes: z.number().int().optional(),
    stabilityWarning: z.boolean().optional(),
  }),
  /** 2D models open face-on in the picture */
  planeFrame: z.object({ plane: z.enum(['XY', 'XZ', 'YZ']), normal: z.enum(['X', 'Y', 'Z']) }).nullable(),
  sections: z.array(z.string()),
  materials: z.array(z.string()),
  groups: z.array(z.string()),
  loadings: z.array(z.object({
    id: z.string(),
    kind: z.enum(['case', 'combination']),
    limitState: z.string().nullable(),
    /** combinations: their cases and factors (the results grid shows them on hover) */
    terms: z.array(z.object({ case: z.string(), factor: z.number() })).optional(),
  })),
});
export type ModelDetail = z.infer<typeof modelDetailSchema>;

export const renameModelSchema = z.object({ name: z.string().trim().min(1, 'Name is required').max(200) }).strict();
export type RenameModelInput = z.input<typeof renameModelSchema>;

/** Member fields that can be edited in the grid (names as in the members table). */
export const EDITABLE_MEMBER_FIELDS = [
  'section', 'material', 'k_major', 'k_minor', 'l_major', 'l_minor', 'lb', 'cb', 'deflection_limit', 'group',
] as const;
export type EditableMemberField = (typeof EDITABLE_MEMBER_FIELDS)[number];

/** Fields measured in the model's length unit (m or ft). */
export const LENGTH_MEMBER_FIELDS: readonly EditableMemberField[] = ['l_major', 'l_minor', 'lb'];
/** Fields that may be cleared (blank = the default: member length, computed cb, the setting). */
export const CLEARABLE_MEMBER_FIELDS: readonly EditableMemberField[] = ['l_major', 'l_minor', 'lb', 'cb', 'deflection_limit', 'group'];

/**
 * One cell edit. `value` is what the user typed: text for section/material/group, a number
 * (or numeric text) for the rest, in the model's unit system; null or '' clears a
 * clearable field.
 */
export const memberEditSchema = z.object({
  member: z.string().trim().min(1, 'member is required').max(200),
  field: z.enum(EDITABLE_MEMBER_FIELDS),
  // any JSON number passes here (also one that overflowed to Infinity on parsing, `1e400`), so
  // that the edit's own check can refuse it naming the member and the field
  value: z.union([z.string().max(200), z.custom<number>((v) => typeof v === 'number', 'expected a number, text or null'), z.null()]),
});
export type MemberEdit = z.infer<typeof memberEditSchema>;

export const memberEditsSchema = z
  .object({
    baseVersion: z.number().int().min(1),
    edits: z.array(memberEditSchema).min(1, 'No edits given').max(200_000),
    message: z.string().trim().max(500).optional(),
  })
  .strict();
export type MemberEditsInput = z.input<typeof memberEditsSchema>;

/** One row of GET /api/models/:id/members (lengths in the model's unit system; null = default). */
export const editableMemberSchema = z.object({
  member: z.string(),
  start: z.string(),
  end: z.string(),
  type: z.enum(['frame', 'truss']),
  section: z.string(),
  material: z.string(),
  group: z.string(),
  k_major: z.number(),
  k_minor: z.number(),
  l_major: z.number().nullable(),
  l_minor: z.number().nullable(),
  lb: z.number().nullable(),
  cb: z.number().nullable(),
  deflection_limit: z.number().nullable(),
  /** member length in the model's unit system */
  length: z.number(),
});
export type EditableMember = z.infer<typeof editableMemberSchema>;

export const editableMembersSchema = z.object({
  modelId: z.number().int(),
  version: z.number().int(),
  units: unitsSchema,
  /** unit of l_major, l_minor, lb and length */
  lengthUnit: z.string(),
  members: z.array(editableMemberSchema),
  /** the model's own sections; any catalogue designation is accepted too */
  sections: z.array(z.string()),
  catalogue: z.array(z.string()),
  materials: z.array(z.string()),
  builtInMaterials: z.array(z.string()),
});
export type EditableMembers = z.infer<typeof editableMembersSchema>;

/** Problem in one edit: names the member and the field (409/400 details). */
export const editProblemSchema = z.object({ member: z.string(), field: z.string(), message: z.string() });
export type EditProblem = z.infer<typeof editProblemSchema>;

/*
 * The model's tables (issue 13, Model tab):
 *   GET    /api/models/:id/tables[?version=]  → ModelTables (values in the model's unit system, units in headers)
 *   PATCH  /api/models/:id/tables             TableEditsInput → ModelSummary (one new version)
 * Cases, node loads, member loads and combinations can be edited; every edit is read again with
 * the reader's rules together with the rest of the model, so a refusal names table, row, column.
 */

/** Tables that the Model tab edits. */
export const EDITABLE_TABLES = ['cases', 'node_loads', 'member_loads', 'combinations'] as const;
export type EditableTable = (typeof EDITABLE_TABLES)[number];

const cellSchema = z.union([z.string().max(200), z.custom<number>((v) => typeof v === 'number', 'expected a number, text or null'), z.null()]);
export type TableCell = z.infer<typeof cellSchema>;

export const modelTableColumnSchema = z.object({
  /** column name as in tables.md (`w1`, `fx`) */
  name: z.string(),
  /** the header as written, unit in brackets (`fx [kN]`) */
  header: z.string(),
  /** the unit shown, or null for text and plain numbers */
  unit: z.string().nullable(),
  kind: z.enum(['id', 'text', 'number', 'enum']),
  values: z.array(z.string()).optional(),
  /** false for columns shown only (a combination's source) */
  editable: z.boolean(),
});
export type ModelTableColumn = z.infer<typeof modelTableColumnSchema>;

export const modelTableSchema = z.object({
  name: z.string(),
  editable: z.boolean(),
  columns: z.array(modelTableColumnSchema),
  /** `row` numbers the rows from 1 as edits and problems name them */
  rows: z.array(z.object({ row: z.number().int(), cells: z.array(cellSchema) })),
  /** a remark shown above the grid (generated combinations, catalogue sections) */
  note: z.string().optional(),
  /** combinations: generated by the combination rule (or one per case), no table behind them */
  generated: z.boolean().optional(),
});
export type ModelTable = z.infer<typeof modelTableSchema>;

export const modelTablesSchema = z.object({
  modelId: z.number().int(),
  version: z.number().int(),
  units: unitsSchema,
  tables: z.array(modelTableSchema),
});
export type ModelTables = z.infer<typeof modelTablesSchema>;

const editableTableSchema = z.enum(EDITABLE_TABLES);
/** One edit of a table: change a cell, add a row (cells by column name), delete a row. */
export const tableEditSchema = z.discriminatedUnion('action', [
  z.object({ action: z.literal('change'), table: editableTableSchema, row: z.number().int().min(1), column: z.string().trim().min(1).max(100), value: cellSchema }).strict(),
  z.object({ action: z.literal('add'), table: editableTableSchema, values: z.record(z.string().max(100), cellSchema) }).strict(),
  z.object({ action: z.literal('delete'), table: editableTableSchema, row: z.number().int().min(1) }).strict(),
]);
export type TableEdit = z.infer<typeof tableEditSchema>;

export const tableEditsSchema = z
  .object({
    baseVersion: z.number().int().min(1),
    edits: z.array(tableEditSchema).min(1, 'No edits given').max(200_000),
    message: z.string().trim().max(500).optional(),
  })
  .strict();
export type TableEditsInput = z.input<typeof tableEditsSchema>;

/** Problem in a table edit (400 details): the table, the row as the grid numbers it, the column. */
export const tableProblemSchema = z.object({ table: z.string(), row: z.number().int().nullable(), column: z.string().nullable(), message: z.string() });
export type TableProblem = z.infer<typeof tableProblemSchema>;
