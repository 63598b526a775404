import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express from 'express';
import request from 'supertest';
import twilio from 'twilio';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { startFakeMail, type FakeMail } from '../../fakes/mail/app';
import { startFakeSms, type FakeSms } from '../../fakes/sms/app';
import { loadEnv, type Env } from '../../server/env';
import { createMailSender, type MailSender } from '../../server/notifications/mail-sender';
import { createSmsSender, type SmsSender } from '../../server/notifications/sms-sender';
import { PermanentSendError, TemporarySendError } from '../../server/notifications/errors';

const AUTH_TOKEN = 'nestflow-test-sms-auth-token';
const inbound: { body: Record<string, string>; signature: string | undefined }[] = [];

let mail: FakeMail;
let sms: FakeSms;
let webhook: Server;
let webhookUrl: string;
let env: Env;
let mailSender: MailSender;
let smsSender: SmsSender;
const mailHttp = () => `http://127.0.0.1:${mail.httpPort}`;
const smsHttp = () => `http://127.0.0.1:${sms.port}`;

beforeAll(async () => {
  const hook = express();
  hook.post('/webhooks/sms', express.urlencoded({ extended: false }), (req, res) => {
    inbound.push({ body: req.body as Record<string, string>, signature: req.get('x-twilio-signature') });
    res.type('text/xml').send('<Response/>');
  });
  webhook = createServer(hook);
  await new Promise<void>((resolve) => webhook.listen(0, '127.0.0.1', resolve));
  webhookUrl = `http://127.0.0.1:${(webhook.address() as AddressInfo).port}/webhooks/sms`;

  mail = await startFakeMail({ smtpPort: 0, httpPort: 0 });
  env = loadEnv({ ...process.env, NODE_ENV: 'test', TWILIO_AUTH_TOKEN: AUTH_TOKEN });
  sms = await startFakeSms({
    port: 0,
    inboundWebhookUrl: webhookUrl,
    accountSid: env.TWILIO_ACCOUNT_SID,
    authToken: AUTH_TOKEN,
    ourNumber: env.TWILIO_FROM,
  });
  env = loadEnv({
    ...process.env,
    NODE_ENV: 'test',
    SMTP_PORT: String(mail.smtpPort),
    SMS_API_BASE: smsHttp(),
    TWILIO_AUTH_TOKEN: AUTH_TOKEN,
  });
  mailSender = createMailSender(env);
  smsSender = createSmsSender(env);
});

afterAll(async () => {
  mailSender?.close();
  await Promise.all([
    mail?.close(),
    sms?.close(),
    webhook && new Promise<void>((resolve) => webhook.close(() => resolve())),
  ]);
});

beforeEach(async () => {
  inbound.splice(0);
  for (const base of [mailHttp(), smsHttp()]) {
    await request(base).post('/fail').send({ mode: 'none' }).expect(200);
    await request(base).delete('/messages').expect(204);
  }
});

describe('mail through nodemailer to the fake SMTP server', () => {
  it('when a mail is sent, then the fake keeps it with recipient, subject and text', async () => {
    const { providerId } = await mailSender.send({
      to: 'family@nestflow.example',
      subject: 'Home visit tomorrow at 10:00',
      text: 'Your nurse visits tomorrow at 10:00.',
    });
    expect(providerId).toMatch(/^<.+>$/);
    const res = await request(mailHttp()).get('/messages').expect(200);
    expect(res.body).toHaveLength(1);
    expect(res.body[0]).toMatchObject({
      envelope: { from: 'no-reply@nestflow.example', to: ['family@nestflow.example'] },
      subject: 'Home visit tomorrow at 10:00',
      text: 'Your nurse visits tomorrow at 10:00.',
    });
    expect(res.body[0].headers['message-id']).toBe(providerId);
  });

  it("when the fake answers 451 ('5xx', provider trouble), then a TemporarySendError", async () => {
    await request(mailHttp()).post('/fail').send({ mode: '5xx', count: 1 }).expect(200);
    const err = await mailSender.send({ to: 'a@nestflow.example', subject: 's', text: 't' }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(TemporarySendError);
    expect((err as TemporarySendError).providerCode).toBe(451);
    // count: 1 means the next transaction goes through again.
    await mailSender.send({ to: 'a@nestflow.example', subject: 's', text: 't' });
    expect(mail.messages()).toHaveLength(1);
  });

  it("when the fake answers 550 ('4xx', a final rejection), then a PermanentSendError", async () => {
    await request(mailHttp()).post('/fail').send({ mode: '4xx' }).expect(200);
    const err = await mailSender.send({ to: 'a@nestflow.example', subject: 's', text: 't' }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(PermanentSendError);
    expect((err as PermanentSendError).providerCode).toBe(550);
    expect(mail.messages()).toHaveLength(0);
  });

  it('when the fake never answers, then a TemporarySendError after the sender time-out', async () => {
    await request(mailHttp()).post('/fail').send({ mode: 'timeout', count: 1 }).expect(200);
    const quick = createMailSender(env, { timeoutMs: 500 });
    try {
      const err = await quick.send({ to: 'a@nestflow.example', subject: 's', text: 't' }).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(TemporarySendError);
    } finally {
      quick.close();
    }
  }, 5_000);
});

describe('SMS through the twilio SDK to the fake Messages API', () => {
  it('when an SMS is sent, then the fake keeps it, reached by the SDK with Basic auth', async () => {
    const { providerId } = await smsSender.send({ to: '+447700900123', body: 'Visit tomorrow at 10:00' });
    expect(providerId).toMatch(/^SM[0-9a-f]{32}$/);
    const res = await request(smsHttp()).get('/messages').expect(200);
    expect(res.body).toEqual([
      expect.objectContaining({
        sid: providerId,
        accountSid: env.TWILIO_ACCOUNT_SID,
        authUser: env.TWILIO_ACCOUNT_SID,
        to: '+447700900123',
        from: env.TWILIO_FROM,
        body: 'Visit tomorrow at 10:00',
      }),
    ]);
    expect(res.body[0].userAgent).toMatch(/^twilio-node\//);
  });

  it('when the provider answers 500, then a TemporarySendError', async () => {
    await request(smsHttp()).post('/fail').send({ mode: '5xx', count: 1 }).expect(200);
    const err = await smsSender.send({ to: '+447700900123', body: 'x' }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(TemporarySendError);
    expect(sms.messages()).toHaveLength(0);
  });

  it("when the provider answers 400, then a PermanentSendError with the provider's message", async () => {
    await request(smsHttp()).post('/fail').send({ mode: '4xx', count: 1 }).expect(200);
    const err = await smsSender.send({ to: '+447700900123', body: 'x' }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(PermanentSendError);
    expect((err as PermanentSendError).message).toBe('The To number is not valid');
    expect((err as PermanentSendError).providerCode).toBe(21211);
  });

  it('when the provider never answers, then a TemporarySendError after the sender time-out', async () => {
    await request(smsHttp()).post('/fail').send({ mode: 'timeout', count: 1 }).expect(200);
    const quick = createSmsSender(env, { timeoutMs: 500 });
    const started = Date.now();
    const err = await quick.send({ to: '+447700900123', body: 'x' }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(TemporarySendError);
    expect(Date.now() - started).toBeLessThan(3_000);
  }, 5_000);

  it('when a request lacks Basic auth or names a non-account SID, then the fake refuses it like the hosted API', async () => {
    const path = `/2010-04-01/Accounts/${env.TWILIO_ACCOUNT_SID}/Messages.json`;
    const form = { To: '+447700900123', From: env.TWILIO_FROM, Body: 'x' };
    await request(smsHttp()).post(path).type('form').send(form).expect(401);
    await request(smsHttp())
      .post('/2010-04-01/Accounts/XX00/Messages.json')
      .auth('XX00', AUTH_TOKEN)
      .type('form')
      .send(form)
      .expect(404);
    expect(sms.messages()).toHaveLength(0);
  });
});

describe('POST /inbound on the fake SMS server', () => {
  it('when a family replies STOP, then our webhook receives it form-encoded and signed like the hosted service', async () => {
    const res = await request(smsHttp()).post('/inbound').send({ from: '+447700900123', body: 'STOP' }).expect(200);
    expect(res.body).toMatchObject({ ok: true, forwarded: true, webhookStatus: 200 });
    expect(inbound).toHaveLength(1);
    expect(inbound[0].body).toEqual({
      From: '+447700900123',
      To: env.TWILIO_FROM,
      Body: 'STOP',
      MessageSid: res.body.messageSid,
      AccountSid: env.TWILIO_ACCOUNT_SID,
    });
    expect(twilio.validateRequest(AUTH_TOKEN, inbound[0].signature ?? '', webhookUrl, inbound[0].body)).toBe(true);
  });

  it('when the body is missing, then 400 and nothing is forwarded', async () => {
    await request(smsHttp()).post('/inbound').send({ body: 'STOP' }).expect(400);
    expect(inbound).toHaveLength(0);
  });
});
