import type { DataSource } from 'typeorm';
import type { Preferences, UpdatePreferencesInput } from '../../../shared/schemas/preferences';
import type { FamilyContactEntity } from '../../db/entities/family-contact.entity';
import { FamilyContactEntity as ContactEntity } from '../../db/entities/family-contact.entity';
import type { AppRepos } from '../../deps';
import { ConflictError, NotFoundError } from '../../lib/errors';
import type { Actor } from '../../lib/http';

const EDITABLE = ['mobile', 'email', 'preferredChannel', 'consentSms', 'consentEmail', 'language', 'remindersEnabled'] as const;

const toDto = (c: FamilyContactEntity): Preferences => ({
  contactId: c.id, name: c.name, relation: c.relation, mobile: c.mobile, email: c.email, preferredChannel: c.preferredChannel,
  consentSms: c.consentSms, consentEmail: c.consentEmail, language: c.language, remindersEnabled: c.remindersEnabled, timeZone: c.timeZone,
  rowVersion: c.rowVersion,
});

/**
 * A family member's own contact record. One person linked to several babies (twins) has one row per baby; a change
 * applies to all of them, so the programme never holds two versions of the same person's wishes.
 */
export function createPreferencesService(ds: DataSource, repos: AppRepos) {
  const mine = (userId: string, m = ds.manager) =>
    m.getRepository(ContactEntity).find({ where: { userId }, order: { position: 'ASC', createdAt: 'ASC' } });

  return {
    async get(userId: string): Promise<Preferences> {
      const [first] = await mine(userId);
      if (!first) throw new NotFoundError('There is no family contact record for this account.');
      return toDto(first);
    },

    async update(actor: Actor, input: UpdatePreferencesInput): Promise<Preferences> {
      return ds.transaction(async (m) => {
        const rows = await m.getRepository(ContactEntity).createQueryBuilder('c').setLock('pessimistic_write')
          .where('c.user_id = :userId', { userId: actor.id }).orderBy('c.position', 'ASC').addOrderBy('c.created_at', 'ASC').getMany();
        if (rows.length === 0) throw new NotFoundError('There is no family contact record for this account.');
        if (rows[0].rowVersion !== input.rowVersion) throw new ConflictError('Your details were changed elsewhere meanwhile. Reload and try again.');
        const before = Object.fromEntries(EDITABLE.map((k) => [k, rows[0][k]]));
        const after = Object.fromEntries(EDITABLE.map((k) => [k, input[k]]));
        const changed = EDITABLE.filter((k) => before[k] !== after[k]);
        for (const c of rows) {
          Object.assign(c, after, { rowVersion: c.rowVersion + 1 });
          await m.getRepository(ContactEntity).save(c);
          await repos.audit.append({
            programmeId: c.programmeId, actorId: actor.id, action: 'contact.preferences_changed', entityType: 'infant', entityId: c.infantId, ip: actor.ip,
            // Which fields changed and the switches' new values; addresses themselves are not copied into the audit trail.
            details: { contactId: c.id, changed, remindersEnabled: input.remindersEnabled, consentSms: input.consentSms, consentEmail: input.consentEmail, preferredChannel: input.preferredChannel, language: input.language },
          }, m);
        }
        return toDto(rows[0]);
      });
    },
  };
}
export type PreferencesService = ReturnType<typeof createPreferencesService>;
