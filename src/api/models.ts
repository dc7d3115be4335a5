/** Model endpoints: one function per route (shared/schemas/models.ts). */
import type {
  EditableMembers, MemberEditsInput, ModelDetail, ModelSummary, ModelTables, ModelVersionSummary, TableEditsInput,
} from '../../shared/schemas/models.js';
import { http } from './http.js';

/** GET /api/projects/:projectId/models. */
export function listModels(projectId: number): Promise<ModelSummary[]> {
  return http.get<ModelSummary[]>(`/api/projects/${projectId}/models`);
}

/** GET /api/models/:id. */
export function getModel(id: number): Promise<ModelDetail> {
  return http.get<ModelDetail>(`/api/models/${id}`);
}

/** GET /api/models/:id/versions. */
export function listVersions(id: number): Promise<ModelVersionSummary[]> {
  return http.get<ModelVersionSummary[]>(`/api/models/${id}/versions`);
}

/**
 * GET /api/models/:id/versions/:version/workbook.<xlsx|zip>: the version as the importer's
 * workbook, or its tables as CSV files in a ZIP. A download the browser fetches itself
 * (same-origin cookie), so only its address is built here.
 */
export function workbookUrl(id: number, version: number, format: 'xlsx' | 'zip' = 'xlsx'): string {
  return `/api/models/${id}/versions/${version}/workbook.${format}`;
}

/** GET /api/models/:id/members (values in the model's unit system). */
export function getEditableMembers(id: number): Promise<EditableMembers> {
  return http.get<EditableMembers>(`/api/models/${id}/members`);
}

/** PATCH /api/models/:id/members: one new version; 409 when baseVersion is stale. */
export function saveMemberEdits(id: number, input: MemberEditsInput): Promise<ModelSummary> {
  return http.patch<ModelSummary>(`/api/models/${id}/members`, input);
}

/** GET /api/models/:id/tables: every table of the current version, values in the model's unit system. */
export function getModelTables(id: number): Promise<ModelTables> {
  return http.get<ModelTables>(`/api/models/${id}/tables`);
}

/** PATCH /api/models/:id/tables: edits of cases, loads and combinations as one new version; 409 when baseVersion is stale. */
export function saveTableEdits(id: number, input: TableEditsInput): Promise<ModelSummary> {
  return http.patch<ModelSummary>(`/api/models/${id}/tables`, input);
}
