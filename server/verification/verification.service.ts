/**
 * The verification report written by `npm run verify` (scripts/verify) to docs/verification/:
 * where it is, and whether it has been generated.
 */
import { existsSync } from 'node:fs';
import path from 'node:path';

export const DEFAULT_VERIFICATION_DIR = path.resolve('docs/verification');

export const REPORT_FILES = { html: 'report.html', json: 'report.json', pdf: 'report.pdf' } as const;

/** Absolute path of the generated report file, or undefined when `npm run verify` has not run. */
export function verificationReportFile(dir: string, kind: keyof typeof REPORT_FILES): string | undefined {
  const file = path.join(dir, REPORT_FILES[kind]);
  return existsSync(file) ? file : undefined;
}
