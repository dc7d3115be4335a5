/**
 * /api/projects — every role reads; engineer, lead and admin create and edit; only lead
 * and admin delete (deleting drops the models and runs under it, so it sits with those
 * who sign work off).
 */
import { Router } from 'express';
import { rolesAtLeast } from '../../shared/schemas/users.js';
import type { AppContext } from '../app.js';
import { currentUser, requireRole } from '../middleware/auth.js';
import { parseId } from '../middleware/params.js';
import { createProject, deleteProject, getProject, listProjects, updateProject } from './project.service.js';
import { creatorRole, ensureMember } from '../membership/member.service.js';
import { projectGuards, visibleProjectIds } from '../membership/project-access.js';
import { assertProjectDeletable } from '../reviews/lock.js';

export const PROJECT_READERS = rolesAtLeast('viewer');
export const PROJECT_EDITORS = rolesAtLeast('engineer');
export const PROJECT_DELETERS = rolesAtLeast('lead');

export function projectsRouter({ dataSource }: AppContext): Router {
  const router = Router();
  const guard = projectGuards(dataSource);

  router.get('/', requireRole(...PROJECT_READERS), async (req, res) => {
    const visible = await visibleProjectIds(dataSource, currentUser(req));
    res.json((await listProjects(dataSource)).filter((p) => visible === null || visible.has(p.id)));
  });

  router.post('/', requireRole(...PROJECT_EDITORS), async (req, res) => {
    const user = currentUser(req);
    const project = await createProject(dataSource, user.id, req.body ?? {});
    await ensureMember(dataSource.manager, project.id, user.id, creatorRole(user.role));
    res.status(201).json(project);
  });

  router.get('/:id', requireRole(...PROJECT_READERS), guard.project('id'), async (req, res) => {
    res.json(await getProject(dataSource, parseId(req.params.id, 'Project')));
  });

  router.patch('/:id', requireRole(...PROJECT_EDITORS), guard.project('id', 'engineer'), async (req, res) => {
    res.json(await updateProject(dataSource, parseId(req.params.id, 'Project'), req.body ?? {}));
  });

  router.delete('/:id', requireRole(...PROJECT_DELETERS), guard.project('id', 'lead'), async (req, res) => {
    await assertProjectDeletable(dataSource, req.access!.projectId);
    await deleteProject(dataSource, parseId(req.params.id, 'Project'));
    res.status(204).end();
  });

  return router;
}
