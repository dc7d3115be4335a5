/** Import endpoints: upload → preview → commit; samples (shared/schemas/imports.ts). */
import type { CommitImportInput, CommitResult, ImportPreview, SampleInfo } from '../../shared/schemas/imports.js';
import { http } from './http.js';

export interface UploadFields {
  /** import as the next version of this model */
  modelId?: number | null;
  name?: string;
}

/** POST /api/projects/:projectId/imports (multipart `files`). */
export function uploadImport(projectId: number, files: readonly File[], fields: UploadFields = {}): Promise<ImportPreview> {
  const form = new FormData();
  for (const f of files) form.append('files', f, f.name);
  if (fields.modelId) form.append('modelId', String(fields.modelId));
  if (fields.name) form.append('name', fields.name);
  return http.post<ImportPreview>(`/api/projects/${projectId}/imports`, form);
}

/** GET /api/projects/:projectId/imports/:importId. */
export function getImport(projectId: number, importId: string): Promise<ImportPreview> {
  return http.get<ImportPreview>(`/api/projects/${projectId}/imports/${encodeURIComponent(importId)}`);
}

/** POST /api/projects/:projectId/imports/:importId/commit. */
export function commitImport(projectId: number, importId: string, input: CommitImportInput = {}): Promise<CommitResult> {
  return http.post<CommitResult>(`/api/projects/${projectId}/imports/${encodeURIComponent(importId)}/commit`, input);
}

/** GET /api/samples. */
export function listSamples(): Promise<SampleInfo[]> {
  return http.get<SampleInfo[]>('/api/samples');
}

/** Address of the blank workbook (a download link, not a call). */
export function templateUrl(units: 'metric' | 'us'): string {
  return `/api/templates/model.xlsx?units=${units}`;
}
