import type { AppAbility } from '@shared/auth/ability';
import type { SessionUser } from '@shared/schemas/session';
import type { ReadAuditSink } from '../modules/audit/read-audit';

declare global {
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
    interface Request {
      ability: AppAbility;
      /** Where `auditRead` writes (set for every /api request by `readAuditMiddleware`). */
      readAudit: ReadAuditSink;
    }
  }
}

declare module 'express-session' {
  interface SessionData {
    signedInAt?: number;
  }
}

export {};
