import type { RequestHandler } from 'express';
import { UnauthenticatedError } from '../lib/errors';

export const requireUser: RequestHandler = (req, _res, next) => next(req.user ? undefined : new UnauthenticatedError());
