/** Labels of grid columns and check families (our own wording). */
import type { EditableMemberField } from '../../shared/schemas/models.js';

const FAMILY_LABELS: Record<string, string> = {
  tension: 'Tension',
  compression: 'Compression',
  bending_major: 'Bending (major)',
  bending_minor: 'Bending (minor)',
  shear_major: 'Shear (major)',
  shear_minor: 'Shear (minor)',
  combined: 'Combined',
  torsion: 'Torsion',
  deflection: 'Deflection',
  slenderness: 'Slenderness',
};

export function familyLabel(family: string): string {
  return FAMILY_LABELS[family] ?? family.replace(/_/g, ' ');
}

export const FIELD_LABELS: Record<EditableMemberField, string> = {
  section: 'Section',
  material: 'Material',
  group: 'Group',
  k_major: 'K major',
  k_minor: 'K minor',
  l_major: 'L major',
  l_minor: 'L minor',
  lb: 'Lb',
  cb: 'Cb',
  deflection_limit: 'Deflection limit (L/…)',
};

export const STATUS_LABELS: Record<string, string> = {
  pass: 'pass',
  fail: 'fail',
  'not checked': 'not checked',
  'not run': 'not run',
};
