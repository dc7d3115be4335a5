/** /api/runs/:runId/comments — members of the project read; engineers and above write. */
import { Router } from 'express';
import { rolesAtLeast } from '../../shared/schemas/users.js';
import type { AppContext } from '../app.js';
import { currentUser, requireRole } from '../middleware/auth.js';
import { projectGuards } from '../membership/project-access.js';
import { addComment, listComments } from './comment.service.js';

export const COMMENT_READERS = rolesAtLeast('viewer');
export const COMMENT_WRITERS = rolesAtLeast('engineer');

export function commentsRouter({ dataSource }: AppContext): Router {
  const router = Router({ mergeParams: true });
  const guard = projectGuards(dataSource);
  router.get('/', requireRole(...COMMENT_READERS), guard.run('runId'), async (req, res) => {
    const member = typeof req.query.member === 'string' ? req.query.member : undefined;
    res.json(await listComments(dataSource, req.access!.runId!, member));
  });
  router.post('/', requireRole(...COMMENT_WRITERS), guard.run('runId', 'engineer'), async (req, res) => {
    res.status(201).json(await addComment(dataSource, currentUser(req), req.access!.runId!, req.body ?? {}));
  });
  return router;
}
