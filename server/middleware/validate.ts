import type { Request, RequestHandler } from 'express';
import type { z } from 'zod';
import { ValidationError, type FieldErrors } from '../lib/errors';

type Schemas = { body?: z.ZodType; query?: z.ZodType; params?: z.ZodType };

export function zodIssuesToFields(issues: readonly z.core.$ZodIssue[], prefix?: string): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of issues) {
    const path = issue.path.map(String).join('.');
    const key = [prefix, path].filter(Boolean).join('.') || '_';
    const message =
      issue.code === 'unrecognized_keys' ? `Unknown field(s): ${issue.keys.join(', ')}` : issue.message;
    (out[key] ??= []).push(message);
  }
  return out;
}

/**
 * Runs the shared contract on each part of the request and replaces it with the parsed value. A function picks the
 * contract per request (phone numbers are read in the caller's programme's country).
 */
export function validate(schemasOrPick: Schemas | ((req: Request) => Schemas)): RequestHandler & { contract: Schemas | ((req: Request) => Schemas) } {
  const handler: RequestHandler = (req, _res, next) => {
    const schemas = typeof schemasOrPick === 'function' ? schemasOrPick(req) : schemasOrPick;
    const details: FieldErrors = {};
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const result = schema.safeParse(req[part] ?? {});
      if (result.success) {
        // Express 5 exposes req.query as a getter; redefine it so handlers see parsed, typed values.
        Object.defineProperty(req, part, { value: result.data, writable: true, configurable: true });
      } else {
        Object.assign(details, zodIssuesToFields(result.error.issues, part === 'body' ? undefined : part));
      }
    }
    if (Object.keys(details).length) return next(new ValidationError(details));
    next();
  };
  // The contracts stay readable on the handler, so tests/api/openapi.test.ts can check the API description uses them.
  return Object.assign(handler, { contract: schemasOrPick });
}
