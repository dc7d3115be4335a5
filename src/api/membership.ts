/** Project membership endpoints: one function per route. */
import type { AddMemberInput, ProjectAccess, ProjectMember, ProjectRole } from '../../shared/schemas/membership.js';
import { http } from './http.js';

/** GET /api/projects/:projectId/members. */
export function listMembers(projectId: number): Promise<ProjectMember[]> {
  return http.get<ProjectMember[]>(`/api/projects/${projectId}/members`);
}

/** POST /api/projects/:projectId/members (admin, project lead). */
export function addMember(projectId: number, input: AddMemberInput): Promise<ProjectMember> {
  return http.post<ProjectMember>(`/api/projects/${projectId}/members`, input);
}

/** PATCH /api/projects/:projectId/members/:userId. */
export function changeMemberRole(projectId: number, userId: number, role: ProjectRole): Promise<ProjectMember> {
  return http.patch<ProjectMember>(`/api/projects/${projectId}/members/${userId}`, { role });
}

/** DELETE /api/projects/:projectId/members/:userId. */
export function removeMember(projectId: number, userId: number): Promise<void> {
  return http.delete(`/api/projects/${projectId}/members/${userId}`);
}

/** GET /api/projects/:projectId/access: the caller's effective role. */
export function getAccess(projectId: number): Promise<ProjectAccess> {
  return http.get<ProjectAccess>(`/api/projects/${projectId}/access`);
}
