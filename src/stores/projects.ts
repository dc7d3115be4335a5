/** Projects: the list, the one being shown, and their actions. */
import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import * as projectsApi from '../api/projects.js';
import type { CreateProjectInput, Project, UpdateProjectInput } from '../../shared/schemas/projects.js';
import { errorMessage } from '../utils/format.js';

/** Newest change first, then by name. */
export function sortProjects(list: readonly Project[]): Project[] {
  return [...list].sort((a, b) => b.updatedAt.localeCompare(a.updatedAt) || a.name.localeCompare(b.name));
}

export const useProjectsStore = defineStore('projects', () => {
  const items = ref<Project[]>([]);
  const current = ref<Project | null>(null);
  const loading = ref(false);
  const saving = ref(false);
  const error = ref<string | null>(null);

  const sorted = computed(() => sortProjects(items.value));

  function remember(project: Project): void {
    const i = items.value.findIndex((p) => p.id === project.id);
    if (i >= 0) items.value.splice(i, 1, project);
    else items.value.push(project);
    if (current.value?.id === project.id) current.value = project;
  }

  async function load(): Promise<void> {
    loading.value = true;
    error.value = null;
    try {
      items.value = await projectsApi.listProjects();
    } catch (err) {
      error.value = errorMessage(err);
    } finally {
      loading.value = false;
    }
  }

  async function loadOne(id: number): Promise<Project | null> {
    loading.value = true;
    error.value = null;
    if (current.value?.id !== id) current.value = null;
    try {
      current.value = await projectsApi.getProject(id);
      return current.value;
    } catch (err) {
      error.value = errorMessage(err);
      return null;
    } finally {
      loading.value = false;
    }
  }

  /** Creates a project; throws the ApiError so the form can show field messages. */
  async function create(input: CreateProjectInput): Promise<Project> {
    saving.value = true;
    error.value = null;
    try {
      const project = await projectsApi.createProject(input);
      remember(project);
      return project;
    } catch (err) {
      error.value = errorMessage(err);
      throw err;
    } finally {
      saving.value = false;
    }
  }

  /** Saves changes; throws the ApiError so the form can show field messages. */
  async function update(id: number, patch: UpdateProjectInput): Promise<Project> {
    saving.value = true;
    error.value = null;
    try {
      const project = await projectsApi.updateProject(id, patch);
      remember(project);
      return project;
    } catch (err) {
      error.value = errorMessage(err);
      throw err;
    } finally {
      saving.value = false;
    }
  }

  async function remove(id: number): Promise<boolean> {
    saving.value = true;
    error.value = null;
    try {
      await projectsApi.deleteProject(id);
      items.value = items.value.filter((p) => p.id !== id);
      if (current.value?.id === id) current.value = null;
      return true;
    } catch (err) {
      error.value = errorMessage(err);
      return false;
    } finally {
      saving.value = false;
    }
  }

  return { items, current, loading, saving, error, sorted, load, loadOne, create, update, remove };
});
