/**
 * /api/runs/:runId/suggestions — section suggestions of a run (engineers and above, on the
 * run's project); apply makes a new model version (refused once the model is approved) and
 * starts a run of it.
 */
import { Router } from 'express';
import { rolesAtLeast } from '../../shared/schemas/users.js';
import type { AppContext } from '../app.js';
import { currentUser, requireRole } from '../middleware/auth.js';
import { parseId } from '../middleware/params.js';
import { projectGuards } from '../membership/project-access.js';
import { assertModelEditable } from '../reviews/lock.js';
import { applySuggestions, suggestForRun } from './suggestion.service.js';

export const SUGGESTION_ROLES = rolesAtLeast('engineer');

export function suggestionsRouter({ dataSource }: AppContext): Router {
  const router = Router({ mergeParams: true });
  const guard = projectGuards(dataSource);
  const runId = (params: unknown) => parseId((params as Record<string, string>).runId, 'Run');
  router.post('/', requireRole(...SUGGESTION_ROLES), guard.run('runId', 'engineer'), async (req, res) => {
    res.json(await suggestForRun(dataSource, runId(req.params), currentUser(req).id, req.body));
  });
  router.post('/apply', requireRole(...SUGGESTION_ROLES), guard.run('runId', 'engineer'), async (req, res) => {
    await assertModelEditable(dataSource, req.access!.modelId!);
    res.status(202).json(await applySuggestions(dataSource, runId(req.params), currentUser(req).id, req.body));
  });
  return router;
}
