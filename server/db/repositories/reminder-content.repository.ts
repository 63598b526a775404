import type { DataSource, EntityManager } from 'typeorm';
import type { CheckKind } from '@shared/schemas/schedule';
import type { Channel } from '@shared/schemas/messages';

/** The family_contacts columns a message is addressed by. */
export interface FamilyContactRow {
  name: string;
  language: string;
  time_zone: string;
  preferred_channel: Channel;
  consent_sms: boolean;
  consent_email: boolean;
  mobile: string | null;
  email: string | null;
  reminders_enabled: boolean;
}

/**
 * The reads that planning and sending a reminder need besides the reminder itself: who it goes to, the names it
 * mentions and what a digest lists. Each runs on the caller's transaction when given one.
 */
export function createReminderContentRepository(ds: DataSource) {
  const q = (m?: EntityManager) => m ?? ds.manager;
  return {
    /** A family contact as stored (consent, opt-out and addresses are read at send time). */
    familyContact: async (id: string, m: EntityManager): Promise<FamilyContactRow | undefined> =>
      (await q(m).query(`SELECT * FROM family_contacts WHERE id = $1`, [id]))[0],

    /** A staff member as a message recipient. */
    staffRecipient: async (userId: string, m: EntityManager): Promise<{ name: string; email: string; disabled: boolean } | undefined> =>
      (await q(m).query(`SELECT name, email, disabled FROM users WHERE id = $1`, [userId]))[0],

    staffName: async (userId: string, m: EntityManager): Promise<{ name: string } | undefined> =>
      (await q(m).query(`SELECT name FROM users WHERE id = $1`, [userId]))[0],

    infantGivenName: async (infantId: string, m: EntityManager): Promise<{ given_name: string } | undefined> =>
      (await q(m).query(`SELECT given_name FROM infants WHERE id = $1`, [infantId]))[0],

    programmeName: async (programmeId: string, m: EntityManager): Promise<{ name: string }> =>
      (await q(m).query(`SELECT name FROM programmes WHERE id = $1`, [programmeId]))[0],

    programmeTimeZone: async (programmeId: string, m: EntityManager): Promise<{ time_zone: string }> =>
      (await q(m).query(`SELECT time_zone FROM programmes WHERE id = $1`, [programmeId]))[0],

    /** The programme's consultants who can still sign in: the recipients of the sign-off digest. */
    activeConsultants: (programmeId: string, m: EntityManager): Promise<Array<{ id: string; name: string; email: string }>> =>
      q(m).query(`SELECT id, name, email FROM users WHERE programme_id = $1 AND role = 'consultant' AND NOT disabled`, [programmeId]),

    /** The programme's coordinators who can still sign in, in a stable order: the recipients of failure alerts. */
    activeCoordinators: (programmeId: string, m: EntityManager): Promise<Array<{ id: string; name: string; email: string }>> =>
      q(m).query(`SELECT id, name, email FROM users WHERE programme_id = $1 AND role = 'coordinator' AND NOT disabled ORDER BY id`, [programmeId]),

    /** Every programme with its time zone: the morning digests are planned per programme. */
    programmeZones: (): Promise<Array<{ id: string; time_zone: string }>> => ds.query(`SELECT id, time_zone FROM programmes`),

    /**
     * Who gets a morning digest: every active nurse, and each active consultant only when something (a proposed
     * setting or a journey check) has waited since `waitingSince` or earlier.
     */
    digestRecipients: (programmeId: string, waitingSince: Date): Promise<Array<{ id: string; name: string; email: string; role: 'nurse' | 'consultant' }>> =>
      ds.query(
        `SELECT u.id, u.name, u.email, u.role FROM users u
          WHERE u.programme_id = $1 AND NOT u.disabled
            AND (u.role = 'nurse' OR (u.role = 'consultant' AND (
              EXISTS (SELECT 1 FROM prescriptions rx WHERE rx.programme_id = $1 AND rx.status = 'proposed' AND COALESCE(rx.computed_at, rx.created_at) <= $2)
              OR EXISTS (SELECT 1 FROM journeys j WHERE j.programme_id = $1 AND j.status = 'waiting' AND j.created_at <= $2))))`,
        [programmeId, waitingSince],
      ),

    /** A nurse's checks due by `today` (or overdue) for the babies in their care: the first 100, oldest due first. */
    nurseDigestChecks: (nurseId: string | null, programmeId: string, today: string, m: EntityManager): Promise<Array<{ kind: CheckKind; due_date: string; status: string; given_name: string; family_name: string; home_address: string }>> =>
      q(m).query(
        `SELECT c.kind, to_char(c.due_date, 'YYYY-MM-DD') AS due_date, c.status, i.given_name, i.family_name, i.home_address
           FROM checks c JOIN infants i ON i.id = c.infant_id
          WHERE i.nurse_id = $1 AND i.programme_id = $2 AND c.status IN ('planned','overdue') AND c.due_date <= $3
          ORDER BY c.due_date, i.family_name LIMIT 100`,
        [nurseId, programmeId, today],
      ),

    /** The visits booked for a staff member on a local date, in time order (at most 50). */
    nurseDigestVisits: (staffId: string | null, programmeId: string, today: string, m: EntityManager): Promise<Array<{ local_time: string; kind: string; purpose: string; given_name: string; family_name: string; home_address: string }>> =>
      q(m).query(
        `SELECT v.local_time, v.kind, v.purpose, i.given_name, i.family_name, i.home_address
           FROM visits v JOIN infants i ON i.id = v.infant_id
          WHERE v.staff_id = $1 AND v.programme_id = $2 AND v.status = 'booked' AND v.local_date = $3 ORDER BY v.starts_at LIMIT 50`,
        [staffId, programmeId, today],
      ),

    /**
     * What waits for a consultant's decision since `waitingSince` or earlier: proposed settings and journey checks
     * in one list (destination is null for a setting), oldest first, at most 100.
     */
    consultantDigestItems: (programmeId: string, waitingSince: Date, m: EntityManager): Promise<Array<{ given_name: string; family_name: string; reason: string | null; proposed_flow_lpm: string | null; destination: string | null; since: Date }>> =>
      q(m).query(
        `SELECT i.given_name, i.family_name, p.reason, p.proposed_flow_lpm, NULL AS destination, COALESCE(p.computed_at, p.created_at) AS since
           FROM prescriptions p JOIN infants i ON i.id = p.infant_id
          WHERE p.programme_id = $1 AND p.status = 'proposed' AND COALESCE(p.computed_at, p.created_at) <= $2
         UNION ALL
         SELECT i.given_name, i.family_name, NULL, NULL, j.destination_name, j.created_at
           FROM journeys j JOIN infants i ON i.id = j.infant_id
          WHERE j.programme_id = $1 AND j.status = 'waiting' AND j.created_at <= $2
          ORDER BY since LIMIT 100`,
        [programmeId, waitingSince],
      ),
  };
}
export type ReminderContentRepository = ReturnType<typeof createReminderContentRepository>;
