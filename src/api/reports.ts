/** Calculation package (PDF) of a run: start, poll, and the address of the file. */
import type { ReportJob, StartReportInput } from '../../shared/schemas/reports.js';
import { http } from './http.js';

/** POST /api/runs/:id/reports — starts writing the package. */
export function startReport(runId: number, input: StartReportInput): Promise<ReportJob> {
  return http.post<ReportJob>(`/api/runs/${runId}/reports`, input);
}

/** GET /api/runs/:id/reports/:reportId — progress. */
export function getReport(runId: number, reportId: string): Promise<ReportJob> {
  return http.get<ReportJob>(`/api/runs/${runId}/reports/${encodeURIComponent(reportId)}`);
}

/** GET /api/runs/:id/reports/:reportId/file — a download the browser fetches itself. */
export function reportFileUrl(runId: number, reportId: string): string {
  return `/api/runs/${runId}/reports/${encodeURIComponent(reportId)}/file`;
}
