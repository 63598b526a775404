import type { Pool } from 'pg';
import type { SessionUser } from '@shared/schemas/session';
import { DEFAULT_COUNTRY } from '@shared/phone/phone';
import { preparedRows } from './prepared';

/** A stored session with its signed-in account, read together (`user` is null when signed out, disabled or gone). */
export interface StoredSession {
  sess: Record<string, unknown>;
  user: SessionUser | null;
}

// The session row and the account it names in one statement: this runs on every API request, so it replaces the
// store's own read plus a second read of the user, and is prepared (prepared.ts). The cast is guarded so a malformed id reads as "no account".
const FIND_WITH_USER = `
  SELECT s.sess, u.id, u.email, u.name, u.role, u.programme_id, p.name AS programme_name, p.time_zone AS programme_time_zone,
    (SELECT pp.settings->>'country' FROM programme_policies pp WHERE pp.programme_id = p.id ORDER BY pp.version DESC LIMIT 1) AS programme_country
  FROM session s
  LEFT JOIN users u ON NOT u.disabled AND u.id = CASE WHEN s.sess->'passport'->>'user' ~ '^[0-9a-fA-F-]{36}$' THEN (s.sess->'passport'->>'user')::uuid END
  LEFT JOIN programmes p ON p.id = u.programme_id
  WHERE s.sid = $1 AND s.expire >= to_timestamp($2)`;

interface Row {
  sess: Record<string, unknown> | string;
  id: string | null;
  email: string;
  name: string;
  role: SessionUser['role'];
  programme_id: string;
  programme_name: string;
  programme_time_zone: string;
  programme_country: string | null;
}

export function createSessionsRepository(pool: Pool) {
  return {
    async findWithUser(sid: string, nowMs: number): Promise<StoredSession | null> {
      const [row] = await preparedRows<Row>(pool, FIND_WITH_USER, [sid, nowMs / 1000]);
      if (!row) return null;
      const sess = typeof row.sess === 'string' ? (JSON.parse(row.sess) as Record<string, unknown>) : row.sess;
      const user: SessionUser | null = row.id && row.programme_name
        ? {
          id: row.id, email: row.email, name: row.name, role: row.role, programmeId: row.programme_id,
          programmeName: row.programme_name, programmeTimeZone: row.programme_time_zone, programmeCountry: row.programme_country ?? DEFAULT_COUNTRY,
        }
        : null;
      return { sess, user };
    },

    /** Moves a session's idle expiry on (the rolling cookie's server-side half). */
    async touch(sid: string, expireMs: number): Promise<void> {
      await pool.query('UPDATE session SET expire = to_timestamp($1) WHERE sid = $2', [Math.ceil(expireMs / 1000), sid]);
    },
  };
}
export type SessionsRepository = ReturnType<typeof createSessionsRepository>;
