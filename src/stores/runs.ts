/** Runs: history per model, the run being watched, its grid rows, member detail, picture, comparison. */
import { defineStore } from 'pinia';
import { computed, ref, shallowRef } from 'vue';
import * as runsApi from '../api/runs.js';
import type { MemberDetail, Run, RunComparison, RunGeometry, RunMembers, RunShape, RunSummary, ShapeKind } from '../../shared/schemas/runs.js';
import { errorMessage } from '../utils/format.js';
import { runFailureMessage } from '../utils/runFormat.js';

export const POLL_MS = 400;

export function isFinished(run: Pick<RunSummary, 'status'> | null | undefined): boolean {
  return !!run && (run.status === 'done' || run.status === 'failed');
}

export const useRunsStore = defineStore('runs', () => {
  const history = ref<RunSummary[]>([]);
  const historyModelId = ref<number | null>(null);
  const current = ref<Run | null>(null);
  /** big: kept shallow so 50 000 rows are not made reactive one by one */
  const members = shallowRef<RunMembers | null>(null);
  const detail = shallowRef<MemberDetail | null>(null);
  const geometry = shallowRef<RunGeometry | null>(null);
  const comparison = shallowRef<RunComparison | null>(null);
  /** the mode or buckled shape the picture draws (null: none) */
  const shape = shallowRef<RunShape | null>(null);
  const shapeLoading = ref(false);
  const loading = ref(false);
  const starting = ref(false);
  const error = ref<string | null>(null);
  let pollTimer: ReturnType<typeof setTimeout> | null = null;

  const running = computed(() => !!current.value && !isFinished(current.value));

  function stopWatching(): void {
    if (pollTimer) clearTimeout(pollTimer);
    pollTimer = null;
  }

  async function loadHistory(modelId: number): Promise<void> {
    try {
      history.value = await runsApi.listRuns(modelId);
      historyModelId.value = modelId;
    } catch (err) {
      error.value = errorMessage(err);
    }
  }

  async function loadMembers(runId: number): Promise<void> {
    loading.value = true;
    try {
      members.value = await runsApi.getRunMembers(runId);
    } catch (err) {
      error.value = errorMessage(err);
    } finally {
      loading.value = false;
    }
  }

  /** Polls a run until it finishes, then loads its rows and the history. */
  async function watchRun(runId: number): Promise<void> {
    stopWatching();
    error.value = null;
    const tick = async (): Promise<void> => {
      try {
        const run = await runsApi.getRun(runId);
        current.value = run;
        if (!isFinished(run)) {
          pollTimer = setTimeout(() => void tick(), POLL_MS);
          return;
        }
        pollTimer = null;
        if (run.status === 'failed') error.value = runFailureMessage(run.message);
        else await loadMembers(run.id);
        await loadHistory(run.modelId);
      } catch (err) {
        error.value = errorMessage(err);
        pollTimer = null;
      }
    };
    await tick();
  }

  /** Starts a run of the model's current version and watches it. */
  async function start(modelId: number): Promise<Run | null> {
    starting.value = true;
    error.value = null;
    try {
      const run = await runsApi.startRun(modelId, {});
      current.value = run;
      void watchRun(run.id);
      return run;
    } catch (err) {
      error.value = errorMessage(err);
      return null;
    } finally {
      starting.value = false;
    }
  }

  /** Shows a model's latest finished run (or watches its running one). */
  async function openLatest(modelId: number): Promise<void> {
    stopWatching();
    if (historyModelId.value !== modelId) {
      current.value = null;
      members.value = null;
      history.value = [];
    }
    loading.value = true;
    error.value = null;
    try {
      await loadHistory(modelId);
      const latest = history.value[0];
      if (!latest) {
        current.value = null;
        members.value = null;
      } else if (!isFinished(latest)) void watchRun(latest.id);
      else await openRun(latest.id);
    } finally {
      loading.value = false;
    }
  }

  async function openRun(runId: number): Promise<void> {
    stopWatching();
    error.value = null;
    try {
      current.value = await runsApi.getRun(runId);
      if (current.value.status === 'done') await loadMembers(runId);
      else members.value = null;
    } catch (err) {
      error.value = errorMessage(err);
    }
  }

  async function loadDetail(runId: number, member: string, loadingId?: string | null): Promise<void> {
    loading.value = true;
    error.value = null;
    try {
      detail.value = await runsApi.getMemberDetail(runId, member, loadingId);
    } catch (err) {
      error.value = errorMessage(err);
    } finally {
      loading.value = false;
    }
  }

  async function loadGeometry(runId: number, loadingId?: string | null): Promise<void> {
    error.value = null;
    try {
      geometry.value = await runsApi.getRunGeometry(runId, loadingId);
    } catch (err) {
      error.value = errorMessage(err);
    }
  }

  /** Loads one shape for the picture; null clears it. */
  async function loadShape(runId: number, choice: { kind: ShapeKind; index: number; loading?: string | null } | null): Promise<void> {
    if (!choice) {
      shape.value = null;
      return;
    }
    shapeLoading.value = true;
    error.value = null;
    try {
      shape.value = await runsApi.getRunShape(runId, choice.kind, choice.index, choice.loading);
    } catch (err) {
      shape.value = null;
      error.value = errorMessage(err);
    } finally {
      shapeLoading.value = false;
    }
  }

  async function compare(a: number, b: number): Promise<void> {
    loading.value = true;
    error.value = null;
    try {
      comparison.value = await runsApi.compareRuns(a, b);
    } catch (err) {
      error.value = errorMessage(err);
    } finally {
      loading.value = false;
    }
  }

  return {
    history, current, members, detail, geometry, comparison, shape, shapeLoading, loading, starting, error, running,
    loadHistory, loadMembers, watchRun, stopWatching, start, openLatest, openRun, loadDetail, loadGeometry, loadShape, compare,
  };
});
