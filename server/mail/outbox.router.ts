/**
 * /api/outbox — the messages the capture server received, newest first: admins read all of
 * them; everyone else reads the messages addressed to them (their "inbox" in development).
 */
import { Router } from 'express';
import type { OutboxMessage } from '../../shared/schemas/mail.js';
import type { AppContext } from '../app.js';
import { currentUser, requireAuth } from '../middleware/auth.js';
import { OutboxEntity, type OutboxRecord } from './outbox.entity.js';

export function toOutboxMessage(r: OutboxRecord): OutboxMessage {
  return {
    id: r.id,
    from: r.fromAddress,
    to: JSON.parse(r.toJson) as string[],
    subject: r.subject,
    text: r.text,
    html: r.html,
    kind: r.kind,
    receivedAt: r.receivedAt.toISOString(),
  };
}

export function outboxRouter({ dataSource }: AppContext): Router {
  const router = Router();
  router.get('/', requireAuth, async (req, res) => {
    const user = currentUser(req);
    const limit = Math.min(500, Math.max(1, Number(req.query.limit) || 100));
    const qb = dataSource.getRepository(OutboxEntity).createQueryBuilder('o').orderBy('o.id', 'DESC').take(limit);
    // toJson is a JSON array of lower-case addresses: match the quoted address exactly
    if (user.role !== 'admin') qb.where('o.toJson LIKE :addr', { addr: `%${JSON.stringify(user.email).replace(/[%_]/g, '')}%` });
    const rows = await qb.getMany();
    res.json(rows.map(toOutboxMessage).filter((m) => user.role === 'admin' || m.to.map((t) => t.toLowerCase()).includes(user.email)));
  });
  return router;
}
