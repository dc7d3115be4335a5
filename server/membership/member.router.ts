/**
 * /api/projects/:projectId/members — members read the list; admins and the project's leads
 * add, change and remove. /api/projects/:projectId/access — the caller's effective role.
 */
import { Router } from 'express';
import { rolesAtLeast } from '../../shared/schemas/users.js';
import type { AppContext } from '../app.js';
import { currentUser, requireRole } from '../middleware/auth.js';
import { parseId } from '../middleware/params.js';
import { addMember, listMembers, removeMember, updateMember } from './member.service.js';
import { projectGuards } from './project-access.js';

export const MEMBER_READERS = rolesAtLeast('viewer');
export const MEMBER_MANAGERS = rolesAtLeast('lead');

export function membersRouter({ dataSource }: AppContext): Router {
  const router = Router({ mergeParams: true });
  const guard = projectGuards(dataSource);
  const projectId = (req: { access?: { projectId: number } }) => req.access!.projectId;

  router.get('/', requireRole(...MEMBER_READERS), guard.project('projectId'), async (req, res) => {
    res.json(await listMembers(dataSource, projectId(req)));
  });
  router.post('/', requireRole(...MEMBER_MANAGERS), guard.project('projectId', 'lead'), async (req, res) => {
    res.status(201).json(await addMember(dataSource, projectId(req), req.body ?? {}));
  });
  router.patch('/:userId', requireRole(...MEMBER_MANAGERS), guard.project('projectId', 'lead'), async (req, res) => {
    res.json(await updateMember(dataSource, currentUser(req), projectId(req), parseId(req.params.userId, 'User'), req.body ?? {}));
  });
  router.delete('/:userId', requireRole(...MEMBER_MANAGERS), guard.project('projectId', 'lead'), async (req, res) => {
    await removeMember(dataSource, currentUser(req), projectId(req), parseId(req.params.userId, 'User'));
    res.status(204).end();
  });
  return router;
}

export function accessRouter({ dataSource }: AppContext): Router {
  const router = Router({ mergeParams: true });
  const guard = projectGuards(dataSource);
  router.get('/', requireRole(...MEMBER_READERS), guard.project('projectId'), (req, res) => {
    res.json({ projectId: req.access!.projectId, role: req.access!.role });
  });
  return router;
}
