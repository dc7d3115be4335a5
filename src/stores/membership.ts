/** Members of the project being shown, and the caller's effective role on it. */
import { defineStore } from 'pinia';
import { ref } from 'vue';
import * as api from '../api/membership.js';
import type { AddMemberInput, ProjectMember, ProjectRole } from '../../shared/schemas/membership.js';
import type { Role } from '../../shared/schemas/users.js';
import { errorMessage } from '../utils/format.js';

export const useMembershipStore = defineStore('membership', () => {
  const projectId = ref<number | null>(null);
  const members = ref<ProjectMember[]>([]);
  const role = ref<Role | null>(null);
  const loading = ref(false);
  const saving = ref(false);
  const error = ref<string | null>(null);

  async function load(id: number): Promise<void> {
    loading.value = true;
    error.value = null;
    if (projectId.value !== id) {
      members.value = [];
      role.value = null;
    }
    projectId.value = id;
    try {
      const [list, access] = await Promise.all([api.listMembers(id), api.getAccess(id)]);
      members.value = list;
      role.value = access.role;
    } catch (err) {
      error.value = errorMessage(err);
    } finally {
      loading.value = false;
    }
  }

  async function run<T>(work: () => Promise<T>): Promise<T> {
    saving.value = true;
    error.value = null;
    try {
      return await work();
    } catch (err) {
      error.value = errorMessage(err);
      throw err;
    } finally {
      saving.value = false;
    }
  }

  const add = (id: number, input: AddMemberInput) =>
    run(async () => {
      const m = await api.addMember(id, input);
      members.value = [...members.value, m];
      return m;
    });
  const changeRole = (id: number, userId: number, r: ProjectRole) =>
    run(async () => {
      const m = await api.changeMemberRole(id, userId, r);
      members.value = members.value.map((x) => (x.userId === userId ? m : x));
      return m;
    });
  const remove = (id: number, userId: number) =>
    run(async () => {
      await api.removeMember(id, userId);
      members.value = members.value.filter((x) => x.userId !== userId);
    });

  return { projectId, members, role, loading, saving, error, load, add, changeRole, remove };
});
