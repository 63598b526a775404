import path from 'node:path';
import { loadEnv } from '../../server/env';
import { createLogger } from '../../server/lib/logger';
import { closeOnSignals } from '../lib/listen';
import { startFakeMail } from './app';

const env = loadEnv();
const log = createLogger(env.LOG_LEVEL, 'fake-mail');
const fake = await startFakeMail({
  smtpPort: env.FAKE_SMTP_PORT, httpPort: env.FAKE_MAIL_HTTP_PORT, inboxFile: env.FAKE_INBOX_DIR ? path.join(env.FAKE_INBOX_DIR, 'mail.jsonl') : undefined,
});
log.info('fake mail listening', { smtp: `127.0.0.1:${fake.smtpPort}`, http: `http://127.0.0.1:${fake.httpPort}` });
closeOnSignals(fake.close, (err) => log.error('fake mail did not close cleanly', { err: String(err) }));
