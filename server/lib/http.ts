import type { Request } from 'express';
import { subject } from '@casl/ability';
import type { Action, SubjectName } from '@shared/auth/ability';
import { ForbiddenError, UnauthenticatedError } from './errors';

export function currentUser(req: Request): Express.User {
  if (!req.user) throw new UnauthenticatedError();
  return req.user;
}

/** Role-level check: does the caller have any rule for this action on this kind of record? */
export function assertCanAny(req: Request, action: Action, subjectName: SubjectName): void {
  if (!req.ability.can(action, subjectName)) throw new ForbiddenError();
}

/** Record-level check against the record's own fields. */
export function assertCan(req: Request, action: Action, subjectName: SubjectName, record: Record<string, unknown>): void {
  if (!req.ability.can(action, subject(subjectName, { ...record }))) throw new ForbiddenError();
}

export interface Actor {
  id: string;
  programmeId: string;
  ip: string | null;
}
export const actorOf = (req: Request): Actor => {
  const user = currentUser(req);
  return { id: user.id, programmeId: user.programmeId, ip: req.ip ?? null };
};
