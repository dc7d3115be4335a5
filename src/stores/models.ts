/** Models: a project's list, the model being shown, its editable members and pending grid edits. */
import { defineStore } from 'pinia';
import { computed, ref, shallowRef } from 'vue';
import * as modelsApi from '../api/models.js';
import { ApiError } from '../api/http.js';
import type {
  EditableMemberField, EditableMembers, ModelDetail, ModelSummary, ModelVersionSummary,
} from '../../shared/schemas/models.js';
import { errorMessage } from '../utils/format.js';
import { editKey, type EditValue } from '../utils/memberEdits.js';

export interface PendingEdit {
  member: string;
  field: EditableMemberField;
  value: EditValue;
}

/** The message for a refused save: a stale base version says so plainly. */
export function saveErrorMessage(err: unknown): string {
  if (err instanceof ApiError && err.status === 409) {
    return `Someone saved a newer version of this model while you were editing (${err.message}). ` +
      'Your edits were not saved. Reload the model to see the newest version, then make your edits again.';
  }
  if (err instanceof ApiError && err.status === 400 && err.details && typeof err.details === 'object' && 'problems' in err.details) {
    const problems = (err.details as { problems: { member: string; field: string; message: string }[] }).problems;
    if (Array.isArray(problems) && problems.length) return problems.slice(0, 5).map((p) => p.message).join('; ');
  }
  return errorMessage(err);
}

export const useModelsStore = defineStore('models', () => {
  const byProject = ref<Record<number, ModelSummary[]>>({});
  const current = ref<ModelDetail | null>(null);
  /** big (one row per member): shallow, replaced whole on every load, never mutated */
  const members = shallowRef<EditableMembers | null>(null);
  const versions = ref<ModelVersionSummary[]>([]);
  const pending = ref<Map<string, PendingEdit>>(new Map());
  const loading = ref(false);
  const saving = ref(false);
  const error = ref<string | null>(null);
  /** set when the last save was refused because the model moved on */
  const stale = ref(false);

  const pendingCount = computed(() => pending.value.size);
  const memberIndex = computed(() => new Map((members.value?.members ?? []).map((m) => [m.member, m])));

  async function loadForProject(projectId: number): Promise<void> {
    loading.value = true;
    error.value = null;
    try {
      byProject.value = { ...byProject.value, [projectId]: await modelsApi.listModels(projectId) };
    } catch (err) {
      error.value = errorMessage(err);
    } finally {
      loading.value = false;
    }
  }

  /** Loads the model, its editable members and versions; clears pending edits of another model. */
  async function open(id: number): Promise<ModelDetail | null> {
    loading.value = true;
    error.value = null;
    if (current.value?.id !== id) {
      current.value = null;
      members.value = null;
      versions.value = [];
      pending.value = new Map();
    }
    try {
      const [detail, editable, list] = await Promise.all([modelsApi.getModel(id), modelsApi.getEditableMembers(id), modelsApi.listVersions(id)]);
      current.value = detail;
      members.value = editable;
      versions.value = list;
      stale.value = false;
      return detail;
    } catch (err) {
      error.value = errorMessage(err);
      return null;
    } finally {
      loading.value = false;
    }
  }

  function setEdit(member: string, field: EditableMemberField, value: EditValue): void {
    const next = new Map(pending.value);
    const original = memberIndex.value.get(member);
    const before = original ? (original[field] as EditValue) : undefined;
    if (original && (before === value || (before === null && value === '') || String(before ?? '') === String(value ?? ''))) {
      next.delete(editKey(member, field));
    } else next.set(editKey(member, field), { member, field, value });
    pending.value = next;
  }

  function pendingValue(member: string, field: EditableMemberField): PendingEdit | undefined {
    return pending.value.get(editKey(member, field));
  }

  function discardEdits(): void {
    pending.value = new Map();
  }

  /** Saves every pending edit as one new version; returns it, or null with `error` set. */
  async function saveEdits(message?: string): Promise<ModelSummary | null> {
    const model = current.value;
    const base = members.value;
    if (!model || !base || pending.value.size === 0) return null;
    saving.value = true;
    error.value = null;
    stale.value = false;
    try {
      const edits = [...pending.value.values()].map((e) => ({ member: e.member, field: e.field, value: e.value }));
      const summary = await modelsApi.saveMemberEdits(model.id, { baseVersion: base.version, edits, message });
      pending.value = new Map();
      await open(model.id);
      return summary;
    } catch (err) {
      stale.value = err instanceof ApiError && err.status === 409;
      error.value = saveErrorMessage(err);
      return null;
    } finally {
      saving.value = false;
    }
  }

  return {
    byProject, current, members, versions, pending, loading, saving, error, stale, pendingCount,
    loadForProject, open, setEdit, pendingValue, discardEdits, saveEdits,
  };
});
