import { appendFileSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { startFakeMail } from '../../fakes/mail/app';
import { startFakeSms } from '../../fakes/sms/app';
import { loadEnv } from '../../server/env';
import { createHttpMailSearch } from '../../server/notifications/mail-search';
import { createMailSender } from '../../server/notifications/mail-sender';
import { createSmsSender } from '../../server/notifications/sms-sender';

// npm start keeps the fakes' inboxes under .data/fakes, so a fake restarted by the supervisor loses nothing.
const dir = mkdtempSync(path.join(tmpdir(), 'nestflow-inbox-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const env = loadEnv({ ...process.env, NODE_ENV: 'test' });

describe('the fakes keep their inboxes on disk', () => {
  it('when the mail fake restarts, then it still lists the message and its search still finds it by Message-ID', async () => {
    const file = path.join(dir, 'mail.jsonl');
    const first = await startFakeMail({ smtpPort: 0, httpPort: 0, inboxFile: file });
    const sender = createMailSender({ ...env, SMTP_HOST: '127.0.0.1', SMTP_PORT: first.smtpPort, SMTP_SECURE: false, SMTP_USER: undefined, SMTP_PASS: undefined });
    const since = new Date(Date.now() - 1000);
    await sender.send({ to: 'parent@test.example', subject: 'Visit', text: 'Tomorrow at 10:00', messageId: '<reminder-kept@nestflow.invalid>' });
    sender.close();
    await first.close();
    // A crash mid-write leaves at most a cut-off last line; it is skipped, the rest loads.
    appendFileSync(file, '{"id":"cut-off');

    const second = await startFakeMail({ smtpPort: 0, httpPort: 0, inboxFile: file });
    try {
      expect(second.messages().map((m) => [m.envelope.to, m.subject])).toEqual([[['parent@test.example'], 'Visit']]);
      const search = createHttpMailSearch(`http://127.0.0.1:${second.httpPort}`);
      expect(await search.findSent('<reminder-kept@nestflow.invalid>', since)).toEqual({ providerId: '<reminder-kept@nestflow.invalid>' });
      expect(await search.findSent('<reminder-other@nestflow.invalid>', since)).toBeNull();
      expect(await search.findSent('<reminder-kept@nestflow.invalid>', new Date(Date.now() + 120_000))).toBeNull();
      expect((await fetch(`http://127.0.0.1:${second.httpPort}/search`)).status).toBe(400);
    } finally {
      await second.close();
    }
  });

  it('when the SMS fake restarts, then it still lists the message and the provider list (messages.list) still finds it', async () => {
    const file = path.join(dir, 'sms.jsonl');
    const opts = { port: 0, accountSid: env.TWILIO_ACCOUNT_SID, authToken: env.TWILIO_AUTH_TOKEN, ourNumber: env.TWILIO_FROM, inboxFile: file };
    const first = await startFakeSms(opts);
    const since = new Date(Date.now() - 1000);
    const sent = await createSmsSender({ ...env, SMS_API_BASE: `http://127.0.0.1:${first.port}` }).send({ to: '+447700900123', body: 'Visit tomorrow' });
    await first.close();
    const second = await startFakeSms(opts);
    try {
      expect(second.messages().map((m) => m.sid)).toEqual([sent.providerId]);
      const sender = createSmsSender({ ...env, SMS_API_BASE: `http://127.0.0.1:${second.port}` });
      expect(await sender.findSent({ to: '+447700900123', body: 'Visit tomorrow' }, since)).toEqual({ providerId: sent.providerId });
      // Clearing through the inspection endpoint empties the file too.
      await fetch(`http://127.0.0.1:${second.port}/messages`, { method: 'DELETE' });
    } finally {
      await second.close();
    }
    const third = await startFakeSms(opts);
    expect(third.messages()).toEqual([]);
    await third.close();
  });
});
