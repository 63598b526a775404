import type { AppAbility } from '@shared/auth/ability';
import type { SessionUser } from '@shared/schemas/session';

declare global {
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
    interface Request {
      ability: AppAbility;
    }
  }
}

declare module 'express-session' {
  interface SessionData {
    signedInAt?: number;
  }
}

export {};
