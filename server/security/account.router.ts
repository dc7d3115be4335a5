/**
 * /api/account — invitations (admin) and password reset by e-mail (public, rate-limited;
 * `forgot` answers 202 whether or not the address exists).
 */
import { Router } from 'express';
import type { AppContext } from '../app.js';
import { mailerFor } from '../mail/mailer.js';
import { currentUser, requireRole } from '../middleware/auth.js';
import { inviteUser, requestReset, setPasswordWithToken, tokenInfo } from './account.service.js';
import { accountLimiter, accountRateLimitsFromEnv } from './rate-limits.js';

export function accountRouter({ dataSource, logger }: AppContext): Router {
  const router = Router();
  const limits = accountRateLimitsFromEnv();
  const forgotLimiter = accountLimiter(limits, 'forgot');
  const setLimiter = accountLimiter(limits, 'set-password');
  const mailer = () => mailerFor(dataSource, logger);

  router.post('/invite', requireRole('admin'), async (req, res) => {
    res.status(201).json(await inviteUser(dataSource, mailer(), currentUser(req), req.body ?? {}));
  });
  router.post('/forgot', forgotLimiter, async (req, res) => {
    await requestReset(dataSource, mailer(), req.body);
    res.status(202).json({ message: 'If an account uses that address, a link to choose a new password is on its way.' });
  });
  router.get('/token', setLimiter, async (req, res) => {
    res.json(await tokenInfo(dataSource, typeof req.query.token === 'string' ? req.query.token : ''));
  });
  router.post('/set-password', setLimiter, async (req, res) => {
    await setPasswordWithToken(dataSource, req.body, req.ip ?? null);
    res.status(204).end();
  });
  return router;
}
