/**
 * The model's tables (Model tab): every table of the current version, pending edits of cases,
 * loads and combinations, their problems by the reader's rules as the user types, and the save
 * as one new version.
 */
import { defineStore } from 'pinia';
import { computed, ref, shallowRef } from 'vue';
import * as modelsApi from '../api/models.js';
import { ApiError } from '../api/http.js';
import type { EditableTable, ModelSummary, ModelTables, TableCell, TableEdit, TableProblem } from '../../shared/schemas/models.js';
import { checkTableEdits, describeTableProblem } from '../../shared/reader/table-edits.js';
import { errorMessage } from '../utils/format.js';
import { withEdit } from '../components/model/tableRows.js';

/** The message for a refused save: stale base version, or the reader's problems. */
export function tableSaveError(err: unknown): string {
  if (err instanceof ApiError && err.status === 409) {
    return `Someone saved a newer version of this model while you were editing (${err.message}). ` +
      'Your edits were not saved. Reload the model to see the newest version, then make your edits again.';
  }
  if (err instanceof ApiError && err.status === 400 && err.details && typeof err.details === 'object' && 'problems' in err.details) {
    const problems = (err.details as { problems: TableProblem[] }).problems;
    if (Array.isArray(problems) && problems.length) return problems.slice(0, 5).map(describeTableProblem).join('; ');
  }
  return errorMessage(err);
}

export const useModelTablesStore = defineStore('modelTables', () => {
  /** big (every row of the model): shallow, replaced whole on every load */
  const view = shallowRef<ModelTables | null>(null);
  const edits = ref<TableEdit[]>([]);
  const loading = ref(false);
  const saving = ref(false);
  const error = ref<string | null>(null);
  const stale = ref(false);

  /** the reader's problems with the pending edits (none without edits) */
  const problems = computed<TableProblem[]>(() => (view.value ? checkTableEdits(view.value, edits.value) : []));
  const editCount = computed(() => edits.value.length);

  function tableOf(name: string) {
    return view.value?.tables.find((t) => t.name === name) ?? null;
  }

  async function load(modelId: number): Promise<void> {
    loading.value = true;
    error.value = null;
    if (view.value?.modelId !== modelId) {
      view.value = null;
      edits.value = [];
    }
    try {
      view.value = await modelsApi.getModelTables(modelId);
      stale.value = false;
    } catch (err) {
      error.value = errorMessage(err);
    } finally {
      loading.value = false;
    }
  }

  function change(table: EditableTable, row: number, column: string, value: TableCell): void {
    const t = tableOf(table);
    if (!t) return;
    edits.value = withEdit(t, edits.value, { action: 'change', table, row, column, value });
  }

  function addRow(table: EditableTable, values: Record<string, TableCell> = {}): void {
    edits.value = [...edits.value, { action: 'add', table, values }];
  }

  function deleteRow(table: EditableTable, row: number): void {
    edits.value = [...edits.value, { action: 'delete', table, row }];
  }

  function discard(): void {
    edits.value = [];
  }

  /** Undo the last pending edit. */
  function undo(): void {
    edits.value = edits.value.slice(0, -1);
  }

  /** Saves every pending edit as one new version; returns it, or null with `error` set. */
  async function save(message?: string): Promise<ModelSummary | null> {
    const v = view.value;
    if (!v || edits.value.length === 0) return null;
    saving.value = true;
    error.value = null;
    stale.value = false;
    try {
      const summary = await modelsApi.saveTableEdits(v.modelId, { baseVersion: v.version, edits: edits.value, ...(message ? { message } : {}) });
      edits.value = [];
      await load(v.modelId);
      return summary;
    } catch (err) {
      stale.value = err instanceof ApiError && err.status === 409;
      error.value = tableSaveError(err);
      return null;
    } finally {
      saving.value = false;
    }
  }

  return { view, edits, loading, saving, error, stale, problems, editCount, tableOf, load, change, addRow, deleteRow, discard, undo, save };
});
