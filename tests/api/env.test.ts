import { spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { parseEnv } from '../../server/env';

// Only what the environment says counts here: process.env of the test run is not mixed in.
const base = { DATABASE_URL: 'postgres://postgres@127.0.0.1:1/x', REDIS_URL: 'redis://127.0.0.1:1' };
const real = {
  NODE_ENV: 'production', SESSION_SECRET: 's'.repeat(40), SUPPLIER_LINK_SECRET: 'k'.repeat(40), SMTP_HOST: 'smtp.mail.example', MAIL_FROM: 'Larkmoor <care@larkmoor.example>',
  TWILIO_ACCOUNT_SID: `AC${'1a'.repeat(16)}`, TWILIO_AUTH_TOKEN: 'a-real-secret-token-0001', TWILIO_FROM: '+447700900000',
};

describe('where the senders send (npm start with other ports for the fakes)', () => {
  it('when only the fakes are moved, then mail, SMS and the mail search follow them', () => {
    const { env } = parseEnv({ ...base, FAKE_SMTP_PORT: '3352', FAKE_MAIL_HTTP_PORT: '3353', FAKE_SMS_PORT: '3354' });
    expect(env).toMatchObject({ SMTP_HOST: '127.0.0.1', SMTP_PORT: 3352, SMS_API_BASE: 'http://127.0.0.1:3354', MAIL_SEARCH_URL: 'http://127.0.0.1:3353' });
  });

  it('when nothing is set, then the default fake ports', () => {
    const { env } = parseEnv(base);
    expect(env).toMatchObject({ SMTP_PORT: 2526, SMS_API_BASE: 'http://127.0.0.1:3102', MAIL_SEARCH_URL: 'http://127.0.0.1:3101' });
  });

  it('when the senders are set explicitly, then those win, and empty means the hosted SMS service and no mail search', () => {
    const { env } = parseEnv({ ...base, FAKE_SMTP_PORT: '3352', SMTP_PORT: '2600', SMS_API_BASE: '', MAIL_SEARCH_URL: '' });
    expect(env).toMatchObject({ SMTP_PORT: 2600, SMS_API_BASE: '', MAIL_SEARCH_URL: '' });
  });
});

describe('production refuses fake settings', () => {
  it('when NODE_ENV=production with nothing else, then every missing setting is named', () => {
    const { problems } = parseEnv({ ...base, NODE_ENV: 'production' });
    const names = problems!.map((p) => p.split(':')[0]);
    expect(names).toEqual(['SESSION_SECRET', 'SUPPLIER_LINK_SECRET', 'SMTP_HOST', 'MAIL_FROM', 'TWILIO_ACCOUNT_SID', 'TWILIO_AUTH_TOKEN', 'TWILIO_FROM']);
  });

  it('when the public development token, the placeholder account or the local fakes are given, then each is refused by name', () => {
    const { problems } = parseEnv({
      ...base, ...real, TWILIO_AUTH_TOKEN: 'nestflow-fake-sms-auth-token', TWILIO_ACCOUNT_SID: 'AC00000000000000000000000000000000',
      SMTP_HOST: '127.0.0.1', SMS_API_BASE: 'http://127.0.0.1:3102', MAIL_SEARCH_URL: 'http://localhost:3101',
    });
    expect(problems!.map((p) => p.split(':')[0])).toEqual(['SMTP_HOST', 'TWILIO_ACCOUNT_SID', 'TWILIO_AUTH_TOKEN', 'SMS_API_BASE', 'MAIL_SEARCH_URL']);
    expect(problems!.join('\n')).toMatch(/forge|sign SMS replies/);
  });

  it('when real settings are given, then it starts: hosted SMS, submission port, no mail search', () => {
    const { env, problems } = parseEnv({ ...base, ...real });
    expect(problems).toBeUndefined();
    expect(env).toMatchObject({ SMTP_PORT: 587, SMS_API_BASE: '', MAIL_SEARCH_URL: '', COOKIE_SECURE: true });
    // A relay on this host is fine when it is not the fake's port.
    expect(parseEnv({ ...base, ...real, SMTP_HOST: '127.0.0.1', SMTP_PORT: '25' }).problems).toBeUndefined();
  });

  it.each(['server/main.ts', 'worker/main.ts'])('when %s starts in production with the defaults, then it exits non-zero naming each variable', (entry) => {
    const run = spawnSync(process.execPath, ['--import', 'tsx', entry], {
      env: { PATH: process.env.PATH, ...base, NODE_ENV: 'production', SESSION_SECRET: 's'.repeat(40), TWILIO_AUTH_TOKEN: 'nestflow-fake-sms-auth-token' },
      encoding: 'utf8', timeout: 20_000,
    });
    expect(run.status).toBe(1);
    for (const name of ['SMTP_HOST', 'MAIL_FROM', 'TWILIO_ACCOUNT_SID', 'TWILIO_AUTH_TOKEN', 'TWILIO_FROM']) expect(run.stderr).toContain(`${name}:`);
  });
});
