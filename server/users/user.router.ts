/** /api/users — admin only: list, create (with role and initial password), change name/role/active. */
import { Router } from 'express';
import type { AppContext } from '../app.js';
import { currentUser, requireRole } from '../middleware/auth.js';
import { parseId } from '../middleware/params.js';
import { createUser, listUsers, updateUser } from './user.service.js';

export function usersRouter({ dataSource }: AppContext): Router {
  const router = Router();
  const admin = requireRole('admin');

  router.get('/', admin, async (_req, res) => {
    res.json(await listUsers(dataSource));
  });

  router.post('/', admin, async (req, res) => {
    res.status(201).json(await createUser(dataSource, req.body ?? {}));
  });

  router.patch('/:id', admin, async (req, res) => {
    res.json(await updateUser(dataSource, currentUser(req), parseId(req.params.id, 'User'), req.body ?? {}));
  });

  return router;
}
