/** The signed-in user and the sign-in actions. */
import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import * as authApi from '../api/auth.js';
import { ApiError } from '../api/http.js';
import type { ChangePasswordInput, LoginInput } from '../../shared/schemas/auth.js';
import { hasRoleAtLeast, type Role, type User } from '../../shared/schemas/users.js';
import { errorMessage } from '../utils/format.js';

export const useAuthStore = defineStore('auth', () => {
  const user = ref<User | null>(null);
  /** True once the first "who am I" call has answered, either way. */
  const checked = ref(false);
  const loading = ref(false);
  const error = ref<string | null>(null);

  const isSignedIn = computed(() => user.value !== null);
  const role = computed<Role | null>(() => user.value?.role ?? null);
  const isAdmin = computed(() => user.value?.role === 'admin');
  /** Engineers and above create and edit projects. */
  const canEdit = computed(() => atLeast('engineer'));
  /** Leads and admins delete projects. */
  const canDelete = computed(() => atLeast('lead'));

  function atLeast(minimum: Role): boolean {
    return user.value !== null && hasRoleAtLeast(user.value.role, minimum);
  }

  /** Asks the server who is signed in (once; pass `force` to ask again). */
  async function fetchMe(force = false): Promise<User | null> {
    if (checked.value && !force) return user.value;
    try {
      user.value = await authApi.me();
    } catch (err) {
      user.value = null;
      if (!(err instanceof ApiError && err.status === 401)) error.value = errorMessage(err);
    } finally {
      checked.value = true;
    }
    return user.value;
  }

  async function signIn(input: LoginInput): Promise<boolean> {
    loading.value = true;
    error.value = null;
    try {
      user.value = await authApi.login(input);
      checked.value = true;
      return true;
    } catch (err) {
      error.value = errorMessage(err);
      return false;
    } finally {
      loading.value = false;
    }
  }

  async function signOut(): Promise<void> {
    loading.value = true;
    error.value = null;
    try {
      await authApi.logout();
    } catch (err) {
      // The session is dropped on this side whatever the server said.
      error.value = errorMessage(err);
    } finally {
      user.value = null;
      checked.value = true;
      loading.value = false;
    }
  }

  /** Forgets the user without calling the server (the session has already ended). */
  function forget(): void {
    user.value = null;
    checked.value = true;
  }

  /** Throws the ApiError on failure so a form can show field messages. */
  async function changePassword(input: ChangePasswordInput): Promise<void> {
    loading.value = true;
    error.value = null;
    try {
      await authApi.changePassword(input);
    } catch (err) {
      error.value = errorMessage(err);
      throw err;
    } finally {
      loading.value = false;
    }
  }

  return { user, checked, loading, error, isSignedIn, role, isAdmin, canEdit, canDelete, atLeast, fetchMe, signIn, signOut, forget, changePassword };
});
