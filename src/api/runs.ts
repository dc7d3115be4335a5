/** Run endpoints: one function per route (shared/schemas/runs.ts). Numbers are SI. */
import type {
  MemberDetail, Run, RunComparison, RunGeometry, RunMembers, RunMembersTable, RunShape, RunSummary, ShapeKind, StartRunInput,
} from '../../shared/schemas/runs.js';
import { membersFromTable } from '../utils/resultsRows.js';
import { http } from './http.js';

const loadingQuery = (loading?: string | null) => (loading ? `?loading=${encodeURIComponent(loading)}` : '');

/** POST /api/models/:id/runs → the queued run. */
export function startRun(modelId: number, input: StartRunInput = {}): Promise<Run> {
  return http.post<Run>(`/api/models/${modelId}/runs`, input);
}

/** GET /api/models/:id/runs (newest first). */
export function listRuns(modelId: number): Promise<RunSummary[]> {
  return http.get<RunSummary[]>(`/api/models/${modelId}/runs`);
}

/** GET /api/runs/:id. */
export function getRun(id: number): Promise<Run> {
  return http.get<Run>(`/api/runs/${id}`);
}

/**
 * GET /api/runs/:id/members?layout=table — the grid's rows sent column by column (a few MB
 * gzip for 100k members instead of one JSON object per row), turned back into rows here.
 */
export async function getRunMembers(id: number): Promise<RunMembers> {
  return membersFromTable(await http.get<RunMembersTable>(`/api/runs/${id}/members?layout=table`));
}

/** GET /api/runs/:id/members/:member[?loading=]. */
export function getMemberDetail(id: number, member: string, loading?: string | null): Promise<MemberDetail> {
  return http.get<MemberDetail>(`/api/runs/${id}/members/${encodeURIComponent(member)}${loadingQuery(loading)}`);
}

/** GET /api/runs/:id/model[?loading=]. */
export function getRunGeometry(id: number, loading?: string | null): Promise<RunGeometry> {
  return http.get<RunGeometry>(`/api/runs/${id}/model${loadingQuery(loading)}`);
}

/** GET /api/runs/compare?a=&b=. */
export function compareRuns(a: number, b: number): Promise<RunComparison> {
  return http.get<RunComparison>(`/api/runs/compare?a=${a}&b=${b}`);
}

/** GET /api/runs/:id/shapes?kind=&index=[&loading=] — a natural mode shape or a buckled shape. */
export function getRunShape(id: number, kind: ShapeKind, index: number, loading?: string | null): Promise<RunShape> {
  const q = `kind=${kind}&index=${index}${loading ? `&loading=${encodeURIComponent(loading)}` : ''}`;
  return http.get<RunShape>(`/api/runs/${id}/shapes?${q}`);
}
