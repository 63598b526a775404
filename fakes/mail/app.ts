import { randomUUID } from 'node:crypto';
import { createServer } from 'node:http';
import express from 'express';
import { SMTPServer, type SMTPServerDataStream, type SMTPServerSession } from 'smtp-server';
import { createFailureSwitch } from '../lib/failure-switch';
import { createInspectionRouter } from '../lib/inspection-router';
import { createInbox } from '../lib/inbox';
import { closeHttp, listenOn } from '../lib/listen';
import { parseMessage } from './parse-message';
import { searchRouter } from './search';

export interface FakeMailMessage {
  id: string;
  receivedAt: string;
  envelope: { from: string | null; to: string[] };
  subject: string;
  text: string;
  headers: Record<string, string>;
  raw: string;
}

export interface FakeMail {
  smtpPort: number;
  httpPort: number;
  messages(): readonly FakeMailMessage[];
  close(): Promise<void>;
}

function smtpError(responseCode: number, message: string): Error {
  return Object.assign(new Error(message), { responseCode });
}

export async function startFakeMail(opts: { smtpPort: number; httpPort: number; host?: string; inboxFile?: string }): Promise<FakeMail> {
  const host = opts.host ?? '127.0.0.1';
  const store = createInbox<FakeMailMessage>(opts.inboxFile);
  // The failure chosen at MAIL FROM, carried to DATA for 'accept-timeout'.
  const modes = new WeakMap<SMTPServerSession, string>();
  const failures = createFailureSwitch();

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    banner: 'Nestflow fake SMTP',
    logger: false,
    // A 'timeout' transaction holds its socket open; shutting down must not wait the default 30 s for it.
    closeTimeout: 500,
    onMailFrom(_address, session, callback) {
      // SMTP has its own classes: 4yz is "try again later", 5yz is "never". The '5xx' means provider
      // trouble worth retrying, so it answers 451; '4xx' means a request that will never succeed, so 550.
      const mode = failures.next();
      modes.set(session, mode);
      if (mode === 'timeout') return;
      if (mode === '5xx') return callback(smtpError(451, 'Requested action aborted: local error in processing'));
      if (mode === '4xx') return callback(smtpError(550, 'Requested action not taken: mailbox unavailable'));
      callback();
    },
    onData(stream: SMTPServerDataStream, session: SMTPServerSession, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => {
        const raw = Buffer.concat(chunks).toString('utf8');
        const id = randomUUID();
        store.push({
          id,
          receivedAt: new Date().toISOString(),
          envelope: {
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
            to: session.envelope.rcptTo.map((r) => r.address),
          },
          ...parseMessage(raw),
          raw,
        });
        if (modes.get(session) === 'accept-timeout') return;
        callback(null, `Queued as ${id}`);
      });
    },
  });
  // Client resets are routine for a sink; without a listener they would crash the process.
  smtp.on('error', () => undefined);

  const app = express();
  app.disable('x-powered-by');
  app.use(createInspectionRouter({ name: 'mail', list: store.list, clear: store.clear, failures }));
  app.use(searchRouter(store.list));
  const http = createServer(app);

  const smtpPort = await listenOn(smtp.server, opts.smtpPort, host);
  let httpPort: number;
  try {
    httpPort = await listenOn(http, opts.httpPort, host);
  } catch (err) {
    await new Promise<void>((resolve) => smtp.close(() => resolve()));
    throw err;
  }

  return {
    smtpPort,
    httpPort,
    messages: store.list,
    close: async () => {
      await Promise.all([closeHttp(http), new Promise<void>((resolve) => smtp.close(() => resolve()))]);
    },
  };
}
