/** Labels of a model's versions (the workbook download menu). */
import type { ModelVersionSummary } from '../../shared/schemas/models.js';
import { formatDateTime } from './format.js';

/** `Version 3 · grid edits · <date> · <who>`; the message follows when there is one. */
export function versionTitle(v: ModelVersionSummary): string {
  return `Version ${v.version} · ${v.origin === 'edit' ? 'grid edits' : 'import'}`;
}

export function versionSubtitle(v: ModelVersionSummary, offsetMinutes?: number): string {
  const parts = [formatDateTime(v.createdAt, offsetMinutes), v.createdByName ?? '', v.message.trim()].filter((p) => p !== '');
  return parts.join(' · ');
}
