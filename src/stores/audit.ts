/** The audit trail page being shown and its filters. */
import { defineStore } from 'pinia';
import { ref } from 'vue';
import * as api from '../api/audit.js';
import type { AuditEvent } from '../../shared/schemas/audit.js';
import { errorMessage } from '../utils/format.js';

export const useAuditStore = defineStore('audit', () => {
  const events = ref<AuditEvent[]>([]);
  const total = ref(0);
  const filters = ref<api.AuditFilters>({ limit: 200, offset: 0 });
  const loading = ref(false);
  const error = ref<string | null>(null);

  async function load(): Promise<void> {
    loading.value = true;
    error.value = null;
    try {
      const page = await api.listAudit(filters.value);
      events.value = page.events;
      total.value = page.total;
    } catch (err) {
      error.value = errorMessage(err);
    } finally {
      loading.value = false;
    }
  }

  return { events, total, filters, loading, error, load, csvUrl: () => api.auditCsvUrl(filters.value) };
});
