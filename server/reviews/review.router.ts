/**
 * /api/runs/:runId/review — the review state and its steps. The account-role guard lets
 * engineers and above through; the project role (server/membership) and the state decide.
 */
import { Router } from 'express';
import { REVIEW_ACTIONS, type ReviewAction } from '../../shared/schemas/reviews.js';
import { rolesAtLeast } from '../../shared/schemas/users.js';
import type { AppContext } from '../app.js';
import { mailerFor } from '../mail/mailer.js';
import { currentUser, requireRole } from '../middleware/auth.js';
import { projectGuards } from '../membership/project-access.js';
import { getReview, reviewRun } from './review.service.js';

export const REVIEW_READERS = rolesAtLeast('viewer');
export const REVIEW_ACTORS: Record<ReviewAction, ReturnType<typeof rolesAtLeast>> = {
  submit: rolesAtLeast('engineer'),
  return: rolesAtLeast('lead'),
  approve: rolesAtLeast('lead'),
};

export function reviewsRouter({ dataSource, logger }: AppContext): Router {
  const router = Router({ mergeParams: true });
  const guard = projectGuards(dataSource);
  const runId = (req: { access?: { runId?: number } }) => req.access!.runId!;

  router.get('/', requireRole(...REVIEW_READERS), guard.run('runId'), async (req, res) => {
    res.json(await getReview(dataSource, currentUser(req), runId(req)));
  });
  for (const action of REVIEW_ACTIONS) {
    router.post(`/${action}`, requireRole(...REVIEW_ACTORS[action]), guard.run('runId'), async (req, res) => {
      res.json(await reviewRun(dataSource, mailerFor(dataSource, logger), currentUser(req), runId(req), action, req.body));
    });
  }
  return router;
}
