/** Imports: the upload being previewed, its commit, and the sample list. */
import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import * as importsApi from '../api/imports.js';
import type { CommitResult, ImportPreview, SampleInfo } from '../../shared/schemas/imports.js';
import { errorMessage } from '../utils/format.js';
import { cappedNote, errorsFirst, problemsByTable } from '../utils/importProblems.js';

export const useImportsStore = defineStore('imports', () => {
  const preview = ref<ImportPreview | null>(null);
  const samples = ref<SampleInfo[]>([]);
  const uploading = ref(false);
  const committing = ref(false);
  const error = ref<string | null>(null);
  /** problems as listed (the first 1,000 at most), errors first */
  const problems = computed(() => errorsFirst(preview.value?.problems ?? []));
  /** counts by table over every problem, tables with errors first */
  const problemTables = computed(() => (preview.value ? problemsByTable(preview.value) : []));
  /** "Showing 1,000 of N problems …" when the server capped the list */
  const capped = computed(() => (preview.value ? cappedNote(preview.value) : null));

  async function upload(projectId: number, files: readonly File[], fields: importsApi.UploadFields = {}): Promise<ImportPreview | null> {
    uploading.value = true;
    error.value = null;
    try {
      preview.value = await importsApi.uploadImport(projectId, files, fields);
      return preview.value;
    } catch (err) {
      error.value = errorMessage(err);
      return null;
    } finally {
      uploading.value = false;
    }
  }

  async function commit(name?: string): Promise<CommitResult | null> {
    const p = preview.value;
    if (!p) return null;
    committing.value = true;
    error.value = null;
    try {
      const result = await importsApi.commitImport(p.projectId, p.id, name ? { name } : {});
      preview.value = null;
      return result;
    } catch (err) {
      error.value = errorMessage(err);
      return null;
    } finally {
      committing.value = false;
    }
  }

  async function loadSamples(): Promise<void> {
    try {
      samples.value = await importsApi.listSamples();
    } catch (err) {
      error.value = errorMessage(err);
    }
  }

  function reset(): void {
    preview.value = null;
    error.value = null;
  }

  return { preview, samples, uploading, committing, error, problems, problemTables, capped, upload, commit, loadSamples, reset };
});
