/** The built-in catalogue (filled in by the series files). */
import type { Section } from '../../model/types.js';

/** Upper case, spaces removed: the lookup key of a designation. */
export function normaliseDesignation(s: string): string {
  return s.replace(/\s+/g, '').toUpperCase();
}

/** A catalogue section by designation (case-insensitive, spaces ignored), or undefined. */
export function catalogueSection(designation: string): Section | undefined {
  void designation;
  return undefined;
}

/** All catalogue designations. */
export function catalogueDesignations(): string[] {
  return [];
}
