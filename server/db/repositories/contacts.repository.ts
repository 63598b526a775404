import type { DataSource, EntityManager } from 'typeorm';
import type { ContactInput } from '@shared/schemas/infants';
import { FamilyContactEntity } from '../entities/family-contact.entity';

export function createContactsRepository(ds: DataSource) {
  const repo = (m?: EntityManager) => (m ?? ds.manager).getRepository(FamilyContactEntity);
  return {
    /**
     * A STOP reply: every contact with this mobile (compared digits and + only) that still had SMS consent loses it.
     * Returns the contacts changed.
     */
    stopSmsForNumber: (from: string, m: EntityManager): Promise<Array<{ id: string; infant_id: string; programme_id: string }>> =>
      // Wrapped in a SELECT: TypeORM answers a bare UPDATE … RETURNING with [rows, rowCount], not the rows.
      m.query(
        `WITH stopped AS (
           UPDATE family_contacts SET consent_sms = false, row_version = row_version + 1, updated_at = now()
            WHERE mobile IS NOT NULL AND regexp_replace(mobile, '[^0-9+]', '', 'g') = $1 AND consent_sms
            RETURNING id, infant_id, programme_id)
         SELECT id, infant_id, programme_id FROM stopped`,
        [from],
      ),

    /** The contact rows of a family member's account (one per baby), in the family's order. */
    listForUser: (userId: string, m?: EntityManager) =>
      repo(m).find({ where: { userId }, order: { position: 'ASC', createdAt: 'ASC' } }),

    /** The same rows, locked for update until the caller's transaction ends. */
    lockForUser: (userId: string, m: EntityManager) =>
      repo(m).createQueryBuilder('c').setLock('pessimistic_write')
        .where('c.user_id = :userId', { userId }).orderBy('c.position', 'ASC').addOrderBy('c.created_at', 'ASC').getMany(),

    saveEntity: (c: FamilyContactEntity, m: EntityManager) => repo(m).save(c),

    listForInfant: (infantId: string, m?: EntityManager) => repo(m).find({ where: { infantId }, order: { position: 'ASC' } }),

    /**
     * Replaces the contact list. A person who stays on it (same e-mail, else same mobile, else same name) keeps
     * their family account link and their own reminder switch, and their pending reminders follow them to the new
     * row instead of being orphaned.
     */
    async replace(infantId: string, programmeId: string, contacts: ContactInput[], m: EntityManager) {
      const existing = await repo(m).find({ where: { infantId } });
      const digits = (v: string | null | undefined) => (v ? v.replace(/[^0-9+]/g, '') : null);
      const sameAs = (c: ContactInput) =>
        existing.find((e) => c.email && e.email === c.email) ??
        existing.find((e) => c.mobile && digits(e.mobile) === digits(c.mobile)) ??
        existing.find((e) => e.name.trim().toLowerCase() === c.name.trim().toLowerCase());
      const rows = contacts.map((c, position) => {
        const before = sameAs(c);
        return {
          before,
          row: repo(m).create({
            infantId, programmeId, position,
            name: c.name, relation: c.relation, mobile: c.mobile ?? null, email: c.email ?? null,
            preferredChannel: c.preferredChannel, consentSms: c.consentSms, consentEmail: c.consentEmail,
            language: c.language, timeZone: c.timeZone,
            userId: (c.email && before?.email === c.email && before.userId) || null,
            remindersEnabled: before?.remindersEnabled ?? true,
            rowVersion: (before?.rowVersion ?? 0) + 1,
          }),
        };
      });
      const saved = await repo(m).save(rows.map((r) => r.row));
      for (const [n, r] of rows.entries()) {
        if (r.before) await m.query(`UPDATE reminders SET contact_id = $2 WHERE contact_id = $1 AND status = 'scheduled'`, [r.before.id, saved[n].id]);
      }
      if (existing.length) await repo(m).delete(existing.map((e) => e.id));
      return saved;
    },

    /** Links contacts to family accounts of the same programme with the same e-mail, so those can sign in and see the baby. */
    linkFamilyAccounts: (infantId: string, programmeId: string, m?: EntityManager) =>
      (m ?? ds.manager).query(
        `UPDATE family_contacts fc SET user_id = u.id FROM users u
          WHERE fc.infant_id = $1 AND u.programme_id = $2 AND u.role = 'family' AND u.email = fc.email AND fc.user_id IS NULL`,
        [infantId, programmeId],
      ),

    /** The other direction: a new family account picks up the contacts that already carry its e-mail. */
    linkContactsToAccount: (userId: string, email: string, programmeId: string, m?: EntityManager) =>
      (m ?? ds.manager).query(`UPDATE family_contacts SET user_id = $1 WHERE programme_id = $2 AND email = $3 AND user_id IS NULL`, [userId, programmeId, email]),

    /** The babies a family account is linked to: the basis of the family's CASL rules. */
    async infantIdsForUser(userId: string): Promise<string[]> {
      const rows: Array<{ infant_id: string }> = await ds.query(`SELECT DISTINCT infant_id FROM family_contacts WHERE user_id = $1`, [userId]);
      return rows.map((r) => r.infant_id);
    },
  };
}
export type ContactsRepository = ReturnType<typeof createContactsRepository>;
