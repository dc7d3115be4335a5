/** Messages of the capture mail server (admins: all; others: those addressed to them). */
import { defineStore } from 'pinia';
import { ref } from 'vue';
import * as api from '../api/outbox.js';
import type { OutboxMessage } from '../../shared/schemas/mail.js';
import { errorMessage } from '../utils/format.js';

export const useOutboxStore = defineStore('outbox', () => {
  const messages = ref<OutboxMessage[]>([]);
  const loading = ref(false);
  const error = ref<string | null>(null);

  async function load(): Promise<void> {
    loading.value = true;
    error.value = null;
    try {
      messages.value = await api.listOutbox();
    } catch (err) {
      error.value = errorMessage(err);
    } finally {
      loading.value = false;
    }
  }

  return { messages, loading, error, load };
});
