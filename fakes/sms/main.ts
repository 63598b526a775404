import path from 'node:path';
import { loadEnv } from '../../server/env';
import { createLogger } from '../../server/lib/logger';
import { closeOnSignals } from '../lib/listen';
import { startFakeSms } from './app';

const env = loadEnv();
const log = createLogger(env.LOG_LEVEL, 'fake-sms');
const fake = await startFakeSms({
  port: env.FAKE_SMS_PORT,
  inboxFile: env.FAKE_INBOX_DIR ? path.join(env.FAKE_INBOX_DIR, 'sms.jsonl') : undefined,
  inboundWebhookUrl: env.INBOUND_WEBHOOK_URL || undefined,
  accountSid: env.TWILIO_ACCOUNT_SID,
  authToken: env.TWILIO_AUTH_TOKEN,
  ourNumber: env.TWILIO_FROM,
});
log.info('fake SMS listening', { http: `http://127.0.0.1:${fake.port}` });
closeOnSignals(fake.close, (err) => log.error('fake SMS did not close cleanly', { err: String(err) }));
