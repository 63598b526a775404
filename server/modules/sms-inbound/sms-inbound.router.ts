import express, { Router } from 'express';
import twilio from 'twilio';
import type { DataSource } from 'typeorm';
import type { AppRepos } from '../../deps';
import type { Logger } from '../../lib/logger';
import { smsNumber } from '@shared/reminders/recipient';
import { EMPTY_TWIML, inboundSmsSchema } from '@shared/schemas/sms';

// Replies that mean "no more texts" on SMS networks (common practice).
const STOP_WORDS = new Set(['STOP', 'STOPALL', 'UNSUBSCRIBE', 'CANCEL', 'END', 'QUIT']);

/**
 * The provider's webhook for replies. It carries no session: the request is trusted only when its signature checks
 * out against our auth token and the webhook address configured with the provider. A STOP reply withdraws SMS
 * consent for every contact with that number, which every later message respects.
 */
export function smsInboundRouter(opts: { ds: DataSource; repos: AppRepos; logger: Logger; authToken: string; webhookUrl: string | undefined }) {
  const router = Router();
  router.post('/', express.urlencoded({ extended: false, limit: '20kb' }), async (req, res) => {
    if (!opts.webhookUrl) {
      res.status(503).json({ error: { code: 'not_configured', message: 'Inbound SMS is not configured (INBOUND_WEBHOOK_URL).' } });
      return;
    }
    const signature = req.get('x-twilio-signature') ?? '';
    const params = (req.body ?? {}) as Record<string, string>;
    if (!signature || !twilio.validateRequest(opts.authToken, signature, opts.webhookUrl, params)) {
      res.status(403).json({ error: { code: 'forbidden', message: 'Signature does not match.' } });
      return;
    }
    const parsed = inboundSmsSchema.safeParse(params);
    if (!parsed.success) {
      res.status(400).json({ error: { code: 'validation', message: 'Expected From and Body.' } });
      return;
    }
    const word = parsed.data.Body.trim().toUpperCase();
    if (STOP_WORDS.has(word)) {
      const from = smsNumber(parsed.data.From);
      await opts.ds.transaction(async (m) => {
        const rows = await opts.repos.contacts.stopSmsForNumber(from, m);
        for (const c of rows) {
          await opts.repos.audit.append({
            programmeId: c.programme_id, actorId: null, action: 'contact.sms_stopped', entityType: 'infant', entityId: c.infant_id,
            details: { contactId: c.id, word, messageSid: parsed.data.MessageSid ?? null },
          }, m);
        }
        opts.logger.info('sms stop honoured', { contacts: rows.length });
      });
    }
    // An empty reply: the provider sends nothing back on our behalf.
    res.type('text/xml').send(EMPTY_TWIML);
  });
  return router;
}
