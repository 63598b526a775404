import type { DataSource } from 'typeorm';
import type { Preferences, UpdatePreferencesInput } from '@shared/schemas/preferences';
import type { FamilyContactEntity } from '../../db/entities/family-contact.entity';
import type { AppRepos } from '../../deps';
import { ConflictError, NotFoundError } from '../../lib/errors';
import type { Actor } from '../../lib/http';

const EDITABLE = ['mobile', 'email', 'preferredChannel', 'consentSms', 'consentEmail', 'language', 'remindersEnabled'] as const;

const toDto = (c: FamilyContactEntity, country: string): Preferences => ({
  contactId: c.id, name: c.name, relation: c.relation, mobile: c.mobile, email: c.email, preferredChannel: c.preferredChannel,
  consentSms: c.consentSms, consentEmail: c.consentEmail, language: c.language, remindersEnabled: c.remindersEnabled, timeZone: c.timeZone,
  rowVersion: c.rowVersion, country,
});

/**
 * A family member's own contact record. One person linked to several babies (twins) has one row per baby; a change
 * applies to all of them, so the programme never holds two versions of the same person's wishes.
 */
export function createPreferencesService(ds: DataSource, repos: AppRepos) {
  const mine = (userId: string) => repos.contacts.listForUser(userId);

  return {
    async get(userId: string): Promise<Preferences> {
      const [first] = await mine(userId);
      if (!first) throw new NotFoundError('There is no family contact record for this account.');
      return toDto(first, (await repos.policies.current(first.programmeId)).settings.country);
    },

    async update(actor: Actor, input: UpdatePreferencesInput): Promise<Preferences> {
      return ds.transaction(async (m) => {
        const rows = await repos.contacts.lockForUser(actor.id, m);
        if (rows.length === 0) throw new NotFoundError('There is no family contact record for this account.');
        if (rows[0].rowVersion !== input.rowVersion) throw new ConflictError('Your details were changed elsewhere meanwhile. Reload and try again.');
        const before = Object.fromEntries(EDITABLE.map((k) => [k, rows[0][k]]));
        const after = Object.fromEntries(EDITABLE.map((k) => [k, input[k]]));
        const changed = EDITABLE.filter((k) => before[k] !== after[k]);
        for (const c of rows) {
          Object.assign(c, after, { rowVersion: c.rowVersion + 1 });
          await repos.contacts.saveEntity(c, m);
          await repos.audit.append({
            programmeId: c.programmeId, actorId: actor.id, action: 'contact.preferences_changed', entityType: 'infant', entityId: c.infantId, ip: actor.ip,
            // Which fields changed and the switches' new values; addresses themselves are not copied into the audit trail.
            details: { contactId: c.id, changed, remindersEnabled: input.remindersEnabled, consentSms: input.consentSms, consentEmail: input.consentEmail, preferredChannel: input.preferredChannel, language: input.language },
          }, m);
        }
        // The family's own number, now read (E.164): a flag raised for an unreadable old one is settled for each
        // baby whose contacts are all readable now.
        await repos.infants.clearUnreadableNumberFlagWhereAllReadable(rows.map((c) => c.infantId), m);
        return toDto(rows[0], (await repos.policies.current(rows[0].programmeId, m)).settings.country);
      });
    },
  };
}
export type PreferencesService = ReturnType<typeof createPreferencesService>;
