/** User administration (admin only). */
import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import * as usersApi from '../api/users.js';
import type { CreateUserInput, UpdateUserInput, User } from '../../shared/schemas/users.js';
import { errorMessage } from '../utils/format.js';

export const useUsersStore = defineStore('users', () => {
  const items = ref<User[]>([]);
  const loading = ref(false);
  const saving = ref(false);
  const error = ref<string | null>(null);

  const sorted = computed(() => [...items.value].sort((a, b) => a.email.localeCompare(b.email)));
  const activeCount = computed(() => items.value.filter((u) => u.active).length);

  function remember(user: User): void {
    const i = items.value.findIndex((u) => u.id === user.id);
    if (i >= 0) items.value.splice(i, 1, user);
    else items.value.push(user);
  }

  async function load(): Promise<void> {
    loading.value = true;
    error.value = null;
    try {
      items.value = await usersApi.listUsers();
    } catch (err) {
      error.value = errorMessage(err);
    } finally {
      loading.value = false;
    }
  }

  /** Creates a user; throws the ApiError so the form can show field messages. */
  async function create(input: CreateUserInput): Promise<User> {
    saving.value = true;
    error.value = null;
    try {
      const user = await usersApi.createUser(input);
      remember(user);
      return user;
    } catch (err) {
      error.value = errorMessage(err);
      throw err;
    } finally {
      saving.value = false;
    }
  }

  async function update(id: number, patch: UpdateUserInput): Promise<User | null> {
    saving.value = true;
    error.value = null;
    try {
      const user = await usersApi.updateUser(id, patch);
      remember(user);
      return user;
    } catch (err) {
      error.value = errorMessage(err);
      return null;
    } finally {
      saving.value = false;
    }
  }

  return { items, loading, saving, error, sorted, activeCount, load, create, update };
});
