import type { DataSource, EntityManager } from 'typeorm';
import type { ContactInput } from '../../../shared/schemas/infants';
import { FamilyContactEntity } from '../entities/family-contact.entity';

export function createContactsRepository(ds: DataSource) {
  const repo = (m?: EntityManager) => (m ?? ds.manager).getRepository(FamilyContactEntity);
  return {
    listForInfant: (infantId: string, m?: EntityManager) => repo(m).find({ where: { infantId }, order: { position: 'ASC' } }),

    /** Replaces the contact list, keeping the family account link of a contact whose e-mail stays the same. */
    async replace(infantId: string, programmeId: string, contacts: ContactInput[], m: EntityManager) {
      const existing = await repo(m).find({ where: { infantId } });
      const links = new Map(existing.filter((c) => c.userId && c.email).map((c) => [c.email, c.userId]));
      await repo(m).delete({ infantId });
      const rows = contacts.map((c, position) =>
        repo(m).create({
          infantId, programmeId, position,
          name: c.name, relation: c.relation, mobile: c.mobile ?? null, email: c.email ?? null,
          preferredChannel: c.preferredChannel, consentSms: c.consentSms, consentEmail: c.consentEmail,
          language: c.language, timeZone: c.timeZone, userId: (c.email && links.get(c.email)) || null,
        }),
      );
      return repo(m).save(rows);
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
