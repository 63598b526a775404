import type { Request, RequestHandler } from 'express';
import type { ReadAction } from '@shared/audit/audit-actions';
import type { ReadEntry } from '../../db/repositories/audit.repository';
import { currentUser } from '../../lib/http';

export interface ReadAuditSink {
  appendRead(entry: ReadEntry): Promise<void>;
}

/** Gives every API request the place its reads are recorded, so a router needs nothing more than `auditRead`. */
export const readAuditMiddleware = (sink: ReadAuditSink): RequestHandler => (req, _res, next) => {
  req.readAudit = sink;
  next();
};

export interface ReadOf {
  action: ReadAction;
  /** The baby whose record is read; leave out for a list (the caseload or message log export). */
  infantId?: string;
  /** Which part, when the baby is not the whole story (a recording's or a plan version's id). Ids only: no names or figures. */
  details?: Record<string, string | number>;
}

/**
 * Records that the signed-in person read a baby's clinical record: who, what, when (the database's clock), which
 * record and from which address (`req.ip`, which follows the app's `trust proxy` setting). Call it after the
 * rights check and the read succeeded, before sending: if the row cannot be written the read fails, so nothing is
 * shown that the trail does not hold. One INSERT, chained by the database trigger.
 */
export async function auditRead(req: Request, read: ReadOf): Promise<void> {
  const user = currentUser(req);
  await req.readAudit.appendRead({
    programmeId: user.programmeId,
    actorId: user.id,
    action: read.action,
    infantId: read.infantId ?? null,
    entityType: read.infantId ? 'infant' : read.action === 'messages.exported' ? 'messages' : 'caseload',
    details: read.details,
    ip: req.ip ?? null,
  });
}
