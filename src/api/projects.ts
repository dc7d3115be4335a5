/** Project endpoints: one function per route. */
import type { CreateProjectInput, Project, UpdateProjectInput } from '../../shared/schemas/projects.js';
import { http } from './http.js';

/** GET /api/projects. */
export function listProjects(): Promise<Project[]> {
  return http.get<Project[]>('/api/projects');
}

/** GET /api/projects/:id. */
export function getProject(id: number): Promise<Project> {
  return http.get<Project>(`/api/projects/${id}`);
}

/** POST /api/projects (engineer and above). */
export function createProject(input: CreateProjectInput): Promise<Project> {
  return http.post<Project>('/api/projects', input);
}

/** PATCH /api/projects/:id (engineer and above). */
export function updateProject(id: number, patch: UpdateProjectInput): Promise<Project> {
  return http.patch<Project>(`/api/projects/${id}`, patch);
}

/** DELETE /api/projects/:id (lead and admin). */
export function deleteProject(id: number): Promise<void> {
  return http.delete(`/api/projects/${id}`);
}
