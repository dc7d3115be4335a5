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

export const PROJECT_READERS = rolesAtLeast('viewer');
export const PROJECT_EDITORS = rolesAtLeast('engineer');
export const PROJECT_DELETERS = rolesAtLeast('lead');

export function projectsRouter({ dataSource }: AppContext): Router {
  const router = Router();

  router.get('/', requireRole(...PROJECT_READERS), async (_req, res) => {
    res.json(await listProjects(dataSource));
  });

  router.post('/', requireRole(...PROJECT_EDITORS), async (req, res) => {
    res.status(201).json(await createProject(dataSource, currentUser(req).id, req.body ?? {}));
  });

  router.get('/:id', requireRole(...PROJECT_READERS), async (req, res) => {
    res.json(await getProject(dataSource, parseId(req.params.id, 'Project')));
  });

  router.patch('/:id', requireRole(...PROJECT_EDITORS), async (req, res) => {
    res.json(await updateProject(dataSource, parseId(req.params.id, 'Project'), req.body ?? {}));
  });

  router.delete('/:id', requireRole(...PROJECT_DELETERS), async (req, res) => {
    await deleteProject(dataSource, parseId(req.params.id, 'Project'));
    res.status(204).end();
  });

  return router;
}
