/**
 * Imports: upload → preview → commit.
 *
 *   POST /api/projects/:projectId/imports   multipart: `files` (one .xlsx or several .csv),
 *                                          optional text fields `modelId` (import as a new
 *                                          version of that model) and `name`
 *                                          → 201 ImportPreview (kept as a pending import)
 *   GET  /api/projects/:projectId/imports/:importId          → ImportPreview
 *   POST /api/projects/:projectId/imports/:importId/commit   CommitImportInput
 *                                          → 201 CommitResult; 400 while errors remain,
 *                                            409 when the target model moved on
 *   GET  /api/templates/model.xlsx?units=metric|us           → blank workbook
 *   GET  /api/samples                                        → SampleInfo[]
 *   GET  /api/samples/:name.xlsx                             → the sample workbook
 *
 * Limits (env): IMPORT_MAX_MB (20) per upload, IMPORT_MAX_ROWS (200 000) over all tables,
 * 413 with a message naming the limit when exceeded. Pending imports expire after an hour.
 */
import { z } from 'zod';
import { modelSummarySchema } from './models.js';

export const problemSchema = z.object({
  severity: z.enum(['error', 'warning']),
  table: z.string(),
  row: z.number().int().optional(),
  column: z.string().optional(),
  message: z.string(),
});
export type ImportProblem = z.infer<typeof problemSchema>;

export const importPreviewSchema = z.object({
  id: z.string(),
  projectId: z.number().int(),
  /** import into this model as a new version; null = a new model */
  modelId: z.number().int().nullable(),
  /** the version of `modelId` the import was made against */
  baseVersion: z.number().int().nullable(),
  name: z.string(),
  fileNames: z.array(z.string()),
  /** rows per table */
  counts: z.record(z.string(), z.number()),
  /** settings as read (null when errors stopped the reader before settings were known) */
  settings: z
    .object({
      title: z.string(),
      units: z.string(),
      verticalAxis: z.string(),
      designCode: z.string(),
      combinationRule: z.string(),
      deflectionLimit: z.number(),
      /** partial factors (tables.md; shown only under en1993-1-1, shared/reader/settings-summary.ts) */
      gammaM0: z.number().optional(),
      gammaM1: z.number().optional(),
      gammaM2: z.number().optional(),
      /** result stations per member (settings `stations`) */
      stations: z.number().int().optional(),
      analysis: z.enum(['first_order', 'second_order']).optional(),
      bucklingModes: z.number().int().optional(),
      modes: z.number().int().optional(),
      stabilityWarning: z.boolean().optional(),
    })
    .nullable(),
  inferences: z.object({
    verticalAxisInferred: z.boolean(),
    planeFrame: z.object({ plane: z.string(), normal: z.string() }).nullable(),
    defaulted: z.array(z.string()),
    /** generated combinations (rule other than `table`) */
    generatedCombinations: z.number().int(),
  }),
  /** the first 1,000 problems (errors first); `problemCounts` counts them all */
  problems: z.array(problemSchema),
  /** every problem counted by table and column (column null: the table or file as a whole) */
  problemCounts: z
    .array(z.object({ table: z.string(), column: z.string().nullable(), errors: z.number().int(), warnings: z.number().int() }))
    .optional(),
  /** true when `problems` lists only the first 1,000 */
  problemsTruncated: z.boolean().optional(),
  errorCount: z.number().int(),
  warningCount: z.number().int(),
  canCommit: z.boolean(),
  createdAt: z.string(),
  expiresAt: z.string(),
});
export type ImportPreview = z.infer<typeof importPreviewSchema>;

export const commitImportSchema = z
  .object({
    /** name of the new model (default: the import's name) */
    name: z.string().trim().min(1).max(200).optional(),
    message: z.string().trim().max(500).optional(),
  })
  .strict();
export type CommitImportInput = z.input<typeof commitImportSchema>;

export const commitResultSchema = z.object({
  model: modelSummarySchema,
  version: z.number().int(),
});
export type CommitResult = z.infer<typeof commitResultSchema>;

export const sampleInfoSchema = z.object({
  name: z.string(),
  title: z.string(),
  /** download path */
  xlsx: z.string(),
});
export type SampleInfo = z.infer<typeof sampleInfoSchema>;
