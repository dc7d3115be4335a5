/**
 * Cell validation for member edits in the grid, with the same rules the server applies
 * (server/models/member-edits.ts): a section from the model or the catalogue, a material
 * from the model or the built-in list, numbers finite and greater than zero, blank allowed
 * where the field has a default. Values are in the model's unit system.
 */
import { CLEARABLE_MEMBER_FIELDS, EDITABLE_MEMBER_FIELDS, type EditableMemberField } from '../../shared/schemas/models.js';

export type EditValue = string | number | null;
export type CellCheck = { ok: true; value: EditValue } | { ok: false; message: string };

export interface EditChoices {
  /** the model's own sections */
  sections: readonly string[];
  /** catalogue designations */
  catalogue: readonly string[];
  materials: readonly string[];
  builtInMaterials: readonly string[];
}

const NUMBER = /^\s*[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?\s*$/;

export function isEditableField(field: string): field is EditableMemberField {
  return (EDITABLE_MEMBER_FIELDS as readonly string[]).includes(field);
}

/** Identifiers compared as the server does: spaces dropped, case ignored. */
export function normaliseId(id: string): string {
  return id.trim().replace(/\s+/g, '').toLowerCase();
}

function findIn(list: readonly string[], text: string): string | undefined {
  const exact = list.find((s) => s === text);
  if (exact) return exact;
  const n = normaliseId(text);
  return list.find((s) => normaliseId(s) === n);
}

/** Checks one typed value; returns the value to send (canonical name, number or null) or why it is refused. */
export function validateMemberCell(field: EditableMemberField, raw: unknown, choices: EditChoices): CellCheck {
  const text = raw === null || raw === undefined ? '' : String(raw).trim();
  if (field === 'section') {
    if (!text) return { ok: false, message: 'a section is required' };
    const found = findIn(choices.sections, text) ?? findIn(choices.catalogue, text);
    return found ? { ok: true, value: found } : { ok: false, message: `unknown section "${text}" — not in the model nor in the catalogue` };
  }
  if (field === 'material') {
    if (!text) return { ok: false, message: 'a material is required' };
    const found = findIn(choices.materials, text) ?? findIn(choices.builtInMaterials, text);
    return found ? { ok: true, value: found } : { ok: false, message: `unknown material "${text}" — not in the model nor built in` };
  }
  if (field === 'group') {
    return text.length > 200 ? { ok: false, message: 'at most 200 characters' } : { ok: true, value: text };
  }
  if (!text) {
    if ((CLEARABLE_MEMBER_FIELDS as readonly string[]).includes(field)) return { ok: true, value: null };
    return { ok: false, message: 'a number is required' };
  }
  if (typeof raw === 'number' ? !Number.isFinite(raw) : !NUMBER.test(text)) return { ok: false, message: `"${text}" is not a number` };
  const n = Number(text);
  // `1e309` passes the pattern but is Infinity, which JSON would send as null (a cleared cell)
  if (!Number.isFinite(n)) return { ok: false, message: `"${text}" is not a finite number (too large)` };
  // lb = 0: continuously braced (tables.md members)
  if (field === 'lb' ? !(n >= 0) : !(n > 0)) return { ok: false, message: field === 'lb' ? 'must be zero or more' : 'must be greater than zero' };
  return { ok: true, value: n };
}

/** Key of a pending edit. */
export function editKey(member: string, field: EditableMemberField): string {
  return `${member}\u0000${field}`;
}
