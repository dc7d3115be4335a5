/** Calculation packages: the job being written, polled until it is done. */
import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import type { ReportJob, StartReportInput } from '../../shared/schemas/reports.js';
import { getReport, reportFileUrl, startReport } from '../api/reports.js';
import { errorMessage } from '../utils/format.js';

/** Poll interval while a package is written (ms). */
export const REPORT_POLL_MS = 400;

export const useReportsStore = defineStore('reports', () => {
  const job = ref<ReportJob | null>(null);
  const writing = ref(false);
  const error = ref<string | null>(null);

  const fileUrl = computed(() => (job.value?.phase === 'done' ? reportFileUrl(job.value.runId, job.value.id) : null));
  /** 0…1 over both phases: gathering member forces, then writing pages */
  const progress = computed(() => {
    const j = job.value;
    if (!j) return 0;
    if (j.phase === 'done') return 1;
    const part = j.total ? j.done / j.total : 1;
    return j.phase === 'gathering' ? part / 2 : 0.5 + part / 2;
  });

  async function generate(runId: number, input: StartReportInput): Promise<void> {
    writing.value = true;
    error.value = null;
    job.value = null;
    try {
      job.value = await startReport(runId, input);
      while (job.value.phase === 'gathering' || job.value.phase === 'writing') {
        await new Promise((r) => setTimeout(r, REPORT_POLL_MS));
        job.value = await getReport(runId, job.value.id);
      }
      if (job.value.phase === 'failed') error.value = job.value.message;
    } catch (err) {
      error.value = errorMessage(err);
    } finally {
      writing.value = false;
    }
  }

  function reset(): void {
    job.value = null;
    error.value = null;
  }

  return { job, writing, error, fileUrl, progress, generate, reset };
});
