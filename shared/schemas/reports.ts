/**
 * Calculation package (PDF) of a run.
 *   POST /api/runs/:id/reports               { members } → 202 ReportJob (generation starts)
 *   GET  /api/runs/:id/reports/:reportId      → ReportJob (poll for progress)
 *   GET  /api/runs/:id/reports/:reportId/file → application/pdf, streamed as it is written
 */
import { z } from 'zod';

export const REPORT_SELECTIONS = ['failing', 'all'] as const;

export const startReportSchema = z.object({
  /** 'failing', 'all', or the member ids chosen in the grid */
  members: z.union([z.enum(REPORT_SELECTIONS), z.array(z.string().min(1).max(100)).min(1).max(5000)]),
});
export type StartReportInput = z.infer<typeof startReportSchema>;

export const REPORT_PHASES = ['gathering', 'writing', 'done', 'failed'] as const;

export const reportJobSchema = z.object({
  id: z.string(),
  runId: z.number().int(),
  /** gathering: member forces from the analysis; writing: laying out pages */
  phase: z.enum(REPORT_PHASES),
  /** members gathered or written so far, of `total` */
  done: z.number().int(),
  total: z.number().int(),
  pages: z.number().int().nullable(),
  message: z.string(),
  fileName: z.string(),
});
export type ReportJob = z.infer<typeof reportJobSchema>;
