import express, { type Router } from 'express';
import type { FakeMailMessage } from './app';

const bare = (id: string) => id.trim().replace(/^<|>$/g, '').toLowerCase();

/**
 * Stands in for a hosted mail service's message search: which accepted messages carry this Message-ID (and were
 * received since a moment). The worker asks it to settle an attempt whose outcome it does not know.
 */
export function searchRouter(list: () => readonly FakeMailMessage[]): Router {
  const router = express.Router();
  router.get('/search', (req, res) => {
    const messageId = typeof req.query.messageId === 'string' ? bare(req.query.messageId) : '';
    const since = typeof req.query.since === 'string' ? Date.parse(req.query.since) : Number.NaN;
    if (!messageId || (req.query.since !== undefined && Number.isNaN(since))) {
      res.status(400).json({ error: { code: 'validation', message: 'Expected ?messageId=<id>[&since=<ISO time>]' } });
      return;
    }
    const found = list().filter((m) => bare(m.headers['message-id'] ?? '') === messageId && (Number.isNaN(since) || Date.parse(m.receivedAt) >= since));
    res.json({ messages: found.map((m) => ({ id: m.id, messageId: m.headers['message-id'], to: m.envelope.to, receivedAt: m.receivedAt })) });
  });
  return router;
}
