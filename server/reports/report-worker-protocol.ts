/** Messages between the HTTP thread and a report worker (one worker per package). */
import type { ReportData } from './report-data.js';

export interface ReportRequest {
  data: ReportData;
  compress: boolean;
}

export type ReportReply =
  | { type: 'chunk'; chunk: Uint8Array }
  | { type: 'progress'; done: number; total: number }
  | { type: 'done'; pages: number }
  | { type: 'error'; message: string };
