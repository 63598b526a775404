import type { ErrorRequestHandler, RequestHandler } from 'express';
import { AppError, NotFoundError } from '../lib/errors';
import type { Logger } from '../lib/logger';

export const apiNotFound: RequestHandler = (_req, _res, next) => next(new NotFoundError('No such API route.'));

function isDatabaseDown(err: unknown): boolean {
  const code = (err as { code?: string })?.code;
  return ['ECONNREFUSED', 'ECONNRESET', '57P01', '57P03', '08006', '08001'].includes(code ?? '') ||
    /Connection terminated|connect ECONNREFUSED/.test((err as Error)?.message ?? '');
}

// Errors from body-parser, the router and static files carry their HTTP status (http-errors) and a type; a 4xx
// among them is the client's mistake and keeps its status. Known types get their own code and words.
const CLIENT_ERROR_TYPES: Record<string, { code: string; message: string }> = {
  'entity.parse.failed': { code: 'bad_json', message: 'The request body is not valid JSON.' },
  'entity.too.large': { code: 'too_large', message: 'The request is too large.' },
  'charset.unsupported': { code: 'unsupported_charset', message: 'The request body must be UTF-8.' },
  'encoding.unsupported': { code: 'unsupported_encoding', message: 'The request body uses a content encoding Nestflow does not accept (use gzip, deflate or none).' },
  'entity.verify.failed': { code: 'bad_request', message: 'The request body could not be checked.' },
  'request.aborted': { code: 'bad_request', message: 'The request was cut off before its body arrived.' },
  'request.size.invalid': { code: 'bad_request', message: 'The request body is not the length its header says.' },
  'parameters.too.many': { code: 'too_large', message: 'The request has too many fields.' },
};

function clientStatus(err: unknown): number | undefined {
  const e = err as { status?: unknown; statusCode?: unknown };
  const status = typeof e?.status === 'number' ? e.status : typeof e?.statusCode === 'number' ? e.statusCode : undefined;
  return status !== undefined && Number.isInteger(status) && status >= 400 && status < 500 ? status : undefined;
}

// A body that says it is gzip but is not: zlib's own error codes, raised while body-parser inflates it.
const isBadCompressedBody = (err: unknown) => /^Z_(DATA|BUF|STREAM)_ERROR$/.test(String((err as { code?: string })?.code));

// PostgreSQL refusing a character (NUL in text, or one the database encoding cannot hold): the contracts reject
// these first; this keeps any field they miss from becoming a 500.
const isBadCharacter = (err: unknown) => ['22P05', '22021'].includes(String((err as { code?: string })?.code));

// ioredis gives up on a command after its retries while Redis is unreachable.
const isRedisDown = (err: unknown) =>
  (err as Error)?.name === 'MaxRetriesPerRequestError' || /Connection is closed|Stream isn't writeable/.test((err as Error)?.message ?? '');

/** The one place errors become responses: typed errors keep their status, unknown ones become a logged 500. */
export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    if (res.headersSent) return;
    // Every error body carries the request id of its access-log line, so a reported failure can be found in the log.
    const send = (status: number, error: Record<string, unknown>) => res.status(status).json({ error: { ...error, requestId: req.id === undefined ? undefined : String(req.id) } });
    if (err instanceof AppError) {
      if (err.status === 429 && 'retryAfterSeconds' in err) res.set('Retry-After', String(err.retryAfterSeconds));
      send(err.status, { code: err.code, message: err.message, details: err.details });
      return;
    }
    if ((err as { code?: string }).code === 'EBADCSRFTOKEN') {
      send(403, { code: 'csrf_invalid', message: 'Your session form token is missing or out of date. Reload the page and try again.' });
      return;
    }
    if (isBadCompressedBody(err)) {
      send(400, { code: 'bad_encoding', message: 'The request body is not in the content encoding its header names.' });
      return;
    }
    const status = clientStatus(err);
    if (status !== undefined) {
      const known = CLIENT_ERROR_TYPES[String((err as { type?: string }).type)];
      const fallback = status === 404 ? { code: 'not_found', message: 'Not found.' } : { code: 'bad_request', message: 'The request could not be read.' };
      send(status, known ?? fallback);
      return;
    }
    if (isBadCharacter(err)) {
      send(400, { code: 'bad_text', message: 'The request holds a character that cannot be stored (for example a NUL).' });
      return;
    }
    if (isRedisDown(err)) {
      logger.warn('redis unavailable', { requestId: req.id, path: req.path, err });
      send(503, { code: 'unavailable', message: 'Nestflow is briefly unavailable. Please try again in a moment.' });
      return;
    }
    if (isDatabaseDown(err)) {
      logger.warn('database unavailable', { requestId: req.id, path: req.path, err });
      send(503, { code: 'unavailable', message: 'Nestflow is briefly unavailable. Please try again in a moment.' });
      return;
    }
    logger.error('unhandled error', { requestId: req.id, path: req.path, method: req.method, err });
    send(500, { code: 'internal', message: 'Something went wrong on our side. Please try again.' });
  };
}
