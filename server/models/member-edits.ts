/**
 * Grid edits of member fields applied to a validated model, with the reader's rules:
 * a section must be one of the model's sections or a catalogue designation (added to the
 * model's sections when first used, exactly as the reader does: shared/reader/library.ts),
 * a material one of the model's or a built-in one,
 * numbers finite (also after conversion to SI) and greater than zero (`lb` zero or more: 0 =
 * continuously braced). Values arrive in the model's unit system, as in the tables. Pure:
 * returns a new model or the list of problems, never half an edit.
 */
import type { Material, Member, Model, Section } from '../../shared/model/types.js';
import { resolveMaterial, resolveSection } from '../../shared/reader/library.js';
import { LENGTH_MEMBER_FIELDS, type EditProblem, type EditableMember, type MemberEdit } from '../../shared/schemas/models.js';
import { fromSI, toSI } from '../../shared/units/index.js';

export type EditOutcome = { ok: true; model: Model; changed: number } | { ok: false; problems: EditProblem[] };

function isBlank(value: MemberEdit['value']): boolean {
  return value === null || (typeof value === 'string' && value.trim() === '');
}

/** The number typed, or why it is not one (an overflowing `1e309` is not a number here). */
function numberOf(value: MemberEdit['value']): number | { error: string } {
  const shown = String(value).trim();
  let n: number;
  if (typeof value === 'number') n = value;
  else if (typeof value === 'string' && /^\s*[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?\s*$/.test(value)) n = Number(value);
  else return { error: `"${shown}" is not a number` };
  if (!Number.isFinite(n)) return { error: `"${shown}" is not a finite number (too large or not a number)` };
  return n;
}

export function applyMemberEdits(model: Model, edits: MemberEdit[]): EditOutcome {
  const problems: EditProblem[] = [];
  const units = model.settings.units;
  const memberIndex = new Map<string, number>();
  model.members.forEach((m, i) => memberIndex.set(m.id, i));
  const sections = new Map(model.sections.map((s) => [s.id, s]));
  const used = new Map<string, Section>();
  const materials = new Map(model.materials.map((m) => [m.id, m]));
  const usedMaterials = new Map<string, Material>();
  const newSections = [...model.sections];
  const newMaterials = [...model.materials];
  const members = model.members.slice();
  const touched = new Set<number>();

  for (const edit of edits) {
    const i = memberIndex.get(edit.member.trim());
    const fail = (message: string) => problems.push({ member: edit.member, field: edit.field, message });
    if (i === undefined) {
      fail(`member ${edit.member} does not exist in this model`);
      continue;
    }
    const m: Member = touched.has(i) ? members[i] : { ...members[i] };
    const where = `member ${m.id}, ${edit.field}`;
    switch (edit.field) {
      case 'section': {
        const text = typeof edit.value === 'number' ? String(edit.value) : (edit.value ?? '').trim();
        if (!text) { fail(`${where}: a section is required`); continue; }
        const before = used.size;
        const section = resolveSection(text, sections, used);
        if (!section) {
          fail(`${where}: unknown section "${text}" — not in the sections table nor in the catalogue`);
          continue;
        }
        if (used.size > before) newSections.push(section);
        if (m.sectionEnd) {
          const end = sections.get(m.sectionEnd);
          if (end && end.shape !== section.shape) {
            fail(`${where}: section ${section.id} is a ${section.shape} but the tapered member ends in ${end.id}, a ${end.shape}`);
            continue;
          }
        }
        m.section = section.id;
        break;
      }
      case 'material': {
        const text = typeof edit.value === 'number' ? String(edit.value) : (edit.value ?? '').trim();
        if (!text) { fail(`${where}: a material is required`); continue; }
        const before = usedMaterials.size;
        const material = resolveMaterial(text, materials, usedMaterials);
        if (!material) {
          fail(`${where}: unknown material "${text}" — not in the materials table nor built in`);
          continue;
        }
        if (usedMaterials.size > before) newMaterials.push(material);
        m.material = material.id;
        break;
      }
      case 'group': {
        const text = edit.value === null ? '' : String(edit.value).trim();
        if (text.length > 200) { fail(`${where}: at most 200 characters`); continue; }
        m.group = text || undefined;
        break;
      }
      default: {
        const field = edit.field;
        if (isBlank(edit.value)) {
          if (field === 'k_major') m.kMajor = 1;
          else if (field === 'k_minor') m.kMinor = 1;
          else if (field === 'l_major') m.lMajor = undefined;
          else if (field === 'l_minor') m.lMinor = undefined;
          else if (field === 'lb') m.lb = undefined;
          else if (field === 'cb') m.cb = undefined;
          else m.deflectionLimit = undefined;
          break;
        }
        const n = numberOf(edit.value);
        if (typeof n === 'object') { fail(`${where}: ${n.error}`); continue; }
        // lb = 0: continuously braced (tables.md members); everything else must be positive
        if (field === 'lb' ? !(n >= 0) : !(n > 0)) { fail(`${where}: must be ${field === 'lb' ? 'zero or more' : 'greater than zero'}`); continue; }
        const si = LENGTH_MEMBER_FIELDS.includes(field) ? toSI(n, 'length', units) : n;
        if (!Number.isFinite(si)) { fail(`${where}: ${n} overflows when converted to SI units`); continue; }
        if (field === 'k_major') m.kMajor = si;
        else if (field === 'k_minor') m.kMinor = si;
        else if (field === 'l_major') m.lMajor = si;
        else if (field === 'l_minor') m.lMinor = si;
        else if (field === 'lb') m.lb = si;
        else if (field === 'cb') m.cb = si;
        else m.deflectionLimit = si;
      }
    }
    members[i] = m;
    touched.add(i);
  }
  if (problems.length > 0) return { ok: false, problems };
  return {
    ok: true,
    changed: touched.size,
    model: { ...model, members, sections: newSections, materials: newMaterials },
  };
}

/** Member length from node coordinates (m). */
export function memberLengths(model: Model): Float64Array {
  const nodes = new Map(model.nodes.map((n) => [n.id, n]));
  const out = new Float64Array(model.members.length);
  model.members.forEach((m, i) => {
    const a = nodes.get(m.start);
    const b = nodes.get(m.end);
    out[i] = a && b ? Math.hypot(b.x - a.x, b.y - a.y, b.z - a.z) : 0;
  });
  return out;
}

/** The members as the edit grid shows them, in the model's unit system. */
export function editableMembers(model: Model): EditableMember[] {
  const units = model.settings.units;
  const L = memberLengths(model);
  const len = (v: number | undefined) => (v === undefined ? null : fromSI(v, 'length', units));
  return model.members.map((m, i) => ({
    member: m.id,
    start: m.start,
    end: m.end,
    type: m.type,
    section: m.section,
    material: m.material,
    group: m.group ?? '',
    k_major: m.kMajor,
    k_minor: m.kMinor,
    l_major: len(m.lMajor),
    l_minor: len(m.lMinor),
    lb: len(m.lb),
    cb: m.cb ?? null,
    deflection_limit: m.deflectionLimit ?? null,
    length: fromSI(L[i], 'length', units),
  }));
}
