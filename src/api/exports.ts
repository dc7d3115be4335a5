/**
 * Export files of a run. They are downloads the browser fetches itself (same-origin cookie),
 * so this module only builds their addresses.
 */
import type { ExportFormat, ExportKind, StabilityExportKind } from '../../shared/schemas/runs.js';

/** GET /api/runs/:id/exports/:kind.:format[?loading=]. */
export function exportUrl(runId: number, kind: ExportKind | StabilityExportKind, format: ExportFormat, loading?: string | null): string {
  const q = loading ? `?loading=${encodeURIComponent(loading)}` : '';
  return `/api/runs/${runId}/exports/${kind}.${format}${q}`;
}
