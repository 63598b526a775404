import { randomBytes } from 'node:crypto';
import { createServer } from 'node:http';
import express, { type Request, type Response } from 'express';
import { createFailureSwitch } from '../lib/failure-switch';
import { createInspectionRouter } from '../lib/inspection-router';
import { createInbox } from '../lib/inbox';
import { closeHttp, listenOn } from '../lib/listen';
import { forwardInbound, type InboundForwarding } from './inbound';

export interface FakeSmsMessage {
  sid: string;
  accountSid: string;
  to: string;
  from: string;
  body: string;
  dateCreated: string;
  /** Kept so tests can prove the request came through the SDK's own client, not a hand-made call. */
  userAgent: string | null;
  authUser: string | null;
}

export interface FakeSms {
  port: number;
  messages(): readonly FakeSmsMessage[];
  close(): Promise<void>;
}

export interface FakeSmsOptions extends InboundForwarding {
  port: number;
  host?: string;
  /** Keeps the inbox on disk (one JSON line per message) so a restart loses nothing. */
  inboxFile?: string;
}

const newSid = (prefix: string) => prefix + randomBytes(16).toString('hex');
// The hosted API dates its resources in RFC 2822 form.
const rfc2822 = (d: Date) => d.toUTCString().replace('GMT', '+0000');

function providerError(res: Response, status: number, code: number, message: string): void {
  res.status(status).json({ code, message, more_info: `https://www.twilio.com/docs/errors/${code}`, status });
}

function basicUser(req: Request): string | null {
  const match = /^Basic\s+(.+)$/i.exec(req.get('authorization') ?? '');
  if (!match) return null;
  const decoded = Buffer.from(match[1], 'base64').toString('utf8');
  const colon = decoded.indexOf(':');
  return colon > 0 && colon < decoded.length - 1 ? decoded.slice(0, colon) : null;
}

export async function startFakeSms(opts: FakeSmsOptions): Promise<FakeSms> {
  const store = createInbox<FakeSmsMessage>(opts.inboxFile);
  const failures = createFailureSwitch();
  const app = express();
  app.disable('x-powered-by');
  app.use(createInspectionRouter({ name: 'sms', list: store.list, clear: store.clear, failures }));

  app.post('/2010-04-01/Accounts/:sid/Messages.json', express.urlencoded({ extended: false }), (req, res) => {
    const accountSid = String(req.params.sid);
    const user = basicUser(req);
    if (!user) return providerError(res, 401, 20003, 'Authenticate');
    // API keys (SK…) may authenticate for an account; otherwise the user must be the account in the path.
    if (!accountSid.startsWith('AC') || (user !== accountSid && !user.startsWith('SK'))) {
      return providerError(res, 404, 20404, 'The requested resource was not found');
    }
    const mode = failures.next();
    if (mode === 'timeout') return;
    if (mode === '5xx') return providerError(res, 500, 20500, 'Internal Server Error');
    if (mode === '4xx') return providerError(res, 400, 21211, 'The To number is not valid');

    const { To: to, From: from, Body: body } = (req.body ?? {}) as Record<string, string | undefined>;
    if (!to) return providerError(res, 400, 21604, "A 'To' phone number is required.");
    if (!from) return providerError(res, 400, 21603, "A 'From' phone number is required.");
    if (!body) return providerError(res, 400, 21602, 'Message body is required.');

    const now = new Date();
    const message: FakeSmsMessage = {
      sid: newSid('SM'),
      accountSid,
      to,
      from,
      body,
      dateCreated: now.toISOString(),
      userAgent: req.get('user-agent') ?? null,
      authUser: user,
    };
    store.push(message);
    if (mode === 'accept-timeout') return;
    res.status(201).json({
      sid: message.sid,
      account_sid: accountSid,
      to,
      from,
      body,
      status: 'queued',
      direction: 'outbound-api',
      num_segments: '1',
      date_created: rfc2822(now),
      date_updated: rfc2822(now),
      date_sent: null,
      error_code: null,
      error_message: null,
      api_version: '2010-04-01',
      uri: `/2010-04-01/Accounts/${accountSid}/Messages/${message.sid}.json`,
    });
  });

  // The list resource, filtered like the hosted one by To, From and sent date (DateSent> is day-granular there).
  app.get('/2010-04-01/Accounts/:sid/Messages.json', (req, res) => {
    const accountSid = String(req.params.sid);
    const user = basicUser(req);
    if (!user) return providerError(res, 401, 20003, 'Authenticate');
    if (!accountSid.startsWith('AC') || (user !== accountSid && !user.startsWith('SK'))) {
      return providerError(res, 404, 20404, 'The requested resource was not found');
    }
    const query = req.query as Record<string, string | undefined>;
    const after = query['DateSent>'] ? Date.parse(query['DateSent>']) : null;
    const pageSize = Math.min(1000, Number(query.PageSize ?? 50) || 50);
    const matches = store.list()
      .filter((m) => m.accountSid === accountSid && (!query.To || m.to === query.To) && (!query.From || m.from === query.From))
      .filter((m) => after === null || Date.parse(m.dateCreated) >= after)
      .slice(-pageSize)
      .reverse();
    const uri = req.originalUrl;
    res.json({
      messages: matches.map((m) => ({
        sid: m.sid, account_sid: m.accountSid, to: m.to, from: m.from, body: m.body, status: 'delivered', direction: 'outbound-api',
        date_created: rfc2822(new Date(m.dateCreated)), date_updated: rfc2822(new Date(m.dateCreated)), date_sent: rfc2822(new Date(m.dateCreated)),
        num_segments: '1', error_code: null, error_message: null, api_version: '2010-04-01',
        uri: `/2010-04-01/Accounts/${accountSid}/Messages/${m.sid}.json`,
      })),
      page: 0, page_size: pageSize, start: 0, end: Math.max(0, matches.length - 1),
      uri, first_page_uri: uri, next_page_uri: null, previous_page_uri: null,
    });
  });

  app.post('/inbound', express.json(), express.urlencoded({ extended: false }), async (req, res) => {
    const { from, body } = (req.body ?? {}) as { from?: unknown; body?: unknown };
    if (typeof from !== 'string' || !from || typeof body !== 'string') {
      res.status(400).json({ error: { code: 'validation', message: 'Expected { from, body }' } });
      return;
    }
    const result = await forwardInbound(opts, { from, body, messageSid: newSid('SM') });
    res.status(result.ok ? 200 : 502).json(result);
  });

  const http = createServer(app);
  const port = await listenOn(http, opts.port, opts.host ?? '127.0.0.1');
  return { port, messages: store.list, close: () => closeHttp(http) };
}
