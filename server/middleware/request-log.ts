import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import { pinoHttp } from 'pino-http';
import type { Logger } from '../lib/logger';

// An id a proxy or client sent is kept when it looks like an id (so one request can be followed across
// services); anything else is replaced by a fresh UUID.
const GOOD_ID = /^[A-Za-z0-9._:-]{8,100}$/;

export function requestId(req: IncomingMessage, res: ServerResponse): string {
  const incoming = req.headers['x-request-id'];
  const id = typeof incoming === 'string' && GOOD_ID.test(incoming) ? incoming : randomUUID();
  res.setHeader('X-Request-Id', id);
  return id;
}

/**
 * One access-log line per request: id, method, path (never the query string, which can hold a search for a
 * baby's name), status and time taken. Bodies and headers are never logged.
 */
export function requestLog(logger: Logger) {
  return pinoHttp({
    logger: logger.pino,
    genReqId: requestId,
    quietReqLogger: true,
    serializers: {
      req: (req: { id?: unknown; method?: string; url?: string }) => ({ id: req.id, method: req.method, path: (req.url ?? '').split('?')[0] }),
      res: (res: { statusCode?: number | null; raw?: { statusCode?: number } }) => ({ status: res.raw?.statusCode ?? res.statusCode }),
      err: (err: Error) => ({ type: err.name, message: err.message }),
    },
    customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info'),
    customSuccessMessage: () => 'request',
    customErrorMessage: () => 'request failed',
    // The web bundle's files are not worth a line each.
    autoLogging: { ignore: (req) => !(req.url ?? '').startsWith('/api/') },
  });
}
