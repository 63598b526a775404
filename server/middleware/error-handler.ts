import type { ErrorRequestHandler, RequestHandler } from 'express';
import { AppError, NotFoundError } from '../lib/errors';
import type { Logger } from '../lib/logger';

export const apiNotFound: RequestHandler = (_req, _res, next) => next(new NotFoundError('No such API route.'));

function isDatabaseDown(err: unknown): boolean {
  const code = (err as { code?: string })?.code;
  return ['ECONNREFUSED', 'ECONNRESET', '57P01', '57P03', '08006', '08001'].includes(code ?? '') ||
    /Connection terminated|connect ECONNREFUSED/.test((err as Error)?.message ?? '');
}

/** The one place errors become responses: typed errors keep their status, unknown ones become a logged 500. */
export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    if (res.headersSent) return;
    if (err instanceof AppError) {
      if (err.status === 429 && 'retryAfterSeconds' in err) res.set('Retry-After', String(err.retryAfterSeconds));
      res.status(err.status).json({ error: { code: err.code, message: err.message, details: err.details } });
      return;
    }
    if ((err as { code?: string }).code === 'EBADCSRFTOKEN') {
      res.status(403).json({ error: { code: 'csrf_invalid', message: 'Your session form token is missing or out of date. Reload the page and try again.' } });
      return;
    }
    if ((err as { type?: string }).type === 'entity.parse.failed') {
      res.status(400).json({ error: { code: 'bad_json', message: 'The request body is not valid JSON.' } });
      return;
    }
    if ((err as { type?: string }).type === 'entity.too.large') {
      res.status(413).json({ error: { code: 'too_large', message: 'The request is too large.' } });
      return;
    }
    if (isDatabaseDown(err)) {
      logger.warn('database unavailable', { path: req.path });
      res.status(503).json({ error: { code: 'unavailable', message: 'Nestflow is briefly unavailable. Please try again in a moment.' } });
      return;
    }
    logger.error('unhandled error', { path: req.path, method: req.method, err: (err as Error)?.stack });
    res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on our side. Please try again.' } });
  };
}
