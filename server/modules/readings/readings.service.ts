import { weightWarnings } from '@shared/clinical/weight-check';
import type { DataSource, EntityManager } from 'typeorm';
import { subject } from '@casl/ability';
import type { AppAbility } from '@shared/auth/ability';
import { DEFAULT_POLICY_SETTINGS, withPolicyDefaults } from '@shared/schemas/policy';
import type { CreateReadingInput, Reading, UpdateReadingInput } from '@shared/schemas/readings';
import { accessibleWhere } from '../../auth/casl-to-sql';
import type { InfantEntity } from '../../db/entities/infant.entity';
import type { ReadingEntity } from '../../db/entities/reading.entity';
import { INFANT_ACL_COLUMNS } from '../../db/repositories/infants.repository';
import type { AppRepos } from '../../deps';
import type { JobProducer } from '../../jobs/producer';
import { ConflictError, ForbiddenError, NeedsConfirmationError, NotFoundError, ValidationError } from '../../lib/errors';
import type { Actor } from '../../lib/http';
import { applyNewWeight } from '../infants/update';
import { EXPORT_PAGE_ROWS } from '../../lib/csv';
import type { ReadingExportRow } from '../../db/repositories/readings.repository';
import { localDate } from '@shared/schedule/plan-checks';

const FUTURE_SLACK_MS = 5 * 60_000;

const fields = (i: InfantEntity) => ({ programmeId: i.programmeId, infantId: i.id, nurseId: i.nurseId } as Record<string, unknown>);

export function createReadingsService(ds: DataSource, repos: AppRepos, jobs: JobProducer) {
  const infantAcl = (ability: AppAbility) => accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS);

  async function visibleInfant(ability: AppAbility, id: string, m?: EntityManager) {
    const infant = await repos.infants.findVisible(id, infantAcl(ability), m);
    if (!infant) throw new NotFoundError('No such baby in your records.');
    return infant;
  }

  async function toDto(rows: ReadingEntity[], windowMinutes: number): Promise<Reading[]> {
    return asDtos(rows, await repos.infants.peopleNames(rows.map((r) => r.createdBy)), windowMinutes);
  }

  function asDtos(rows: ReadingEntity[], names: Map<string, string>, windowMinutes: number): Reading[] {
    return rows.map((r) => ({
      id: r.id, infantId: r.infantId, checkId: r.checkId, takenAt: r.takenAt.toISOString(), spo2: r.spo2, pulse: r.pulse, flowLpm: r.flowLpm,
      state: r.state, weightKg: r.weightKg, notes: r.notes, familyReported: r.familyReported,
      createdBy: { id: r.createdBy, name: names.get(r.createdBy) ?? '' }, createdAt: r.createdAt.toISOString(),
      editableUntil: r.familyReported ? null : new Date(r.createdAt.getTime() + windowMinutes * 60_000).toISOString(),
      rowVersion: r.rowVersion,
    }));
  }

  return {
    async create(ability: AppAbility, actor: Actor & { role: string; timeZone: string }, infantId: string, input: CreateReadingInput) {
      const infant = await visibleInfant(ability, infantId);
      if (!ability.can('create', subject('Reading', fields(infant)))) throw new ForbiddenError('You cannot log readings for this baby.');
      const takenAt = new Date(input.takenAt);
      if (takenAt.getTime() > Date.now() + FUTURE_SLACK_MS) throw new ValidationError({ takenAt: ['The reading time is in the future'] });
      if (takenAt.getTime() < new Date(`${infant.birthDate}T00:00:00Z`).getTime() - 86_400_000) throw new ValidationError({ takenAt: ['The reading time is before birth'] });
      if (input.weightKg !== undefined) {
        const warnings = weightWarnings(input.weightKg, localDate(takenAt, actor.timeZone), { kg: infant.weightKg, date: infant.weightDate });
        if (warnings.length && !input.weightConfirmed) throw new NeedsConfirmationError('Check the weight before saving.', { weightKg: warnings });
      }
      const family = actor.role === 'family';
      const out = await ds.transaction(async (m) => {
        const locked = (await repos.infants.findForUpdate(infant.id, m))!;
        if (input.checkId && family) throw new ValidationError({ checkId: ['Family readings do not complete planned checks'] });
        const check = input.checkId ? await repos.checks.findOpen(input.checkId, infant.id, m) : null;
        if (input.checkId && !check) throw new ValidationError({ checkId: ['That check is not open for this baby'] });
        // A spot reading cannot stand in for an overnight study, a room-air challenge or a consultant's review.
        if (check && check.kind !== 'spot_check') throw new ValidationError({ checkId: ['Only a spot check is completed by a single reading'] });
        const reading = await repos.readings.insert(
          { programmeId: infant.programmeId, infantId: infant.id, checkId: check?.id ?? null, takenAt, spo2: input.spo2, pulse: input.pulse ?? null,
            flowLpm: input.flowLpm ?? null, state: input.state, weightKg: input.weightKg ?? null, notes: input.notes ?? null, familyReported: family, createdBy: actor.id },
          m,
        );
        const rxId = input.weightKg !== undefined && !family ? await applyNewWeight(repos, locked, input.weightKg, localDate(takenAt, actor.timeZone), actor.id, m) : null;
        await repos.infants.save(locked, m);
        // After the save: completing a check clears the overdue flag in SQL, which a later entity save would undo.
        if (check) await repos.checks.complete(check, actor.id, `reading:${reading.id}`, m);
        await repos.audit.append({ programmeId: infant.programmeId, actorId: actor.id, action: family ? 'reading.family_reported' : 'reading.logged', entityType: 'infant', entityId: infant.id, ip: actor.ip, details: { readingId: reading.id, checkId: check?.id ?? null, spo2: reading.spo2, pulse: reading.pulse, flowLpm: reading.flowLpm, state: reading.state } }, m);
        return { reading, rxId };
      });
      if (out.rxId) await jobs.enqueueConversion(out.rxId);
      const policy = await repos.policies.current(infant.programmeId);
      return (await toDto([out.reading], policy.settings.readingEditWindowMinutes))[0];
    },

    async list(ability: AppAbility, infantId: string, from?: string, to?: string) {
      const until = to ? new Date(to) : new Date();
      const since = from ? new Date(from) : new Date(until.getTime() - 90 * 86_400_000);
      // One statement: the baby (with the caller's rights), its readings, who logged them and the policy.
      const found = await repos.readings.forInfant(infantId, infantAcl(ability), since, until);
      if (!found) throw new NotFoundError('No such baby in your records.');
      if (!ability.can('read', subject('Reading', fields(found.infant)))) throw new ForbiddenError();
      const settings = found.policySettings ? withPolicyDefaults(found.policySettings) : DEFAULT_POLICY_SETTINGS;
      return { items: asDtos(found.readings, found.names, settings.readingEditWindowMinutes) };
    },

    /**
     * Every reading of the baby (or those in the window), oldest first, read a page at a time. The rights are
     * checked before the first row: another programme's baby is a 404 like the list.
     */
    async exportRows(ability: AppAbility, infantId: string, window: { from?: string; to?: string }): Promise<AsyncIterable<ReadingExportRow>> {
      const infant = await visibleInfant(ability, infantId);
      if (!ability.can('read', subject('Reading', fields(infant)))) throw new ForbiddenError();
      return (async function* () {
        let after: { takenAt: string; id: string } | undefined;
        for (;;) {
          const rows = await repos.readings.exportPage(infant.id, window, after, EXPORT_PAGE_ROWS);
          yield* rows;
          if (rows.length < EXPORT_PAGE_ROWS) return;
          const last = rows.at(-1)!;
          after = { takenAt: last.k_taken_at, id: last.id };
        }
      })();
    },

    /** Only the person who logged a reading, within the policy's edit window; every edit is audited. */
    async update(ability: AppAbility, actor: Actor, id: string, input: UpdateReadingInput) {
      const saved = await ds.transaction(async (m) => {
        const r = await repos.readings.findForUpdate(id, m);
        const infant = r ? await repos.infants.findVisible(r.infantId, infantAcl(ability), m) : null;
        if (!r || !infant) throw new NotFoundError('No such reading in your records.');
        if (r.createdBy !== actor.id) throw new ForbiddenError('Only the person who logged a reading can correct it.');
        const policy = await repos.policies.current(infant.programmeId, m);
        if (Date.now() > r.createdAt.getTime() + policy.settings.readingEditWindowMinutes * 60_000) {
          throw new ConflictError('The time to correct this reading has passed; log a new one with a note instead.');
        }
        if (r.rowVersion !== input.rowVersion) {
          throw new ConflictError('This reading was corrected elsewhere meanwhile. Reload it and make your correction again.', { rowVersion: ['Changed elsewhere'] });
        }
        const before = { spo2: r.spo2, pulse: r.pulse, flowLpm: r.flowLpm, state: r.state, notes: r.notes };
        const { rowVersion, ...changes } = input;
        Object.assign(r, Object.fromEntries(Object.entries(changes).filter(([, v]) => v !== undefined)), { rowVersion: rowVersion + 1 });
        await repos.readings.save(r, m);
        await repos.audit.append({ programmeId: infant.programmeId, actorId: actor.id, action: 'reading.corrected', entityType: 'infant', entityId: infant.id, ip: actor.ip, details: { readingId: r.id, before, after: { spo2: r.spo2, pulse: r.pulse, flowLpm: r.flowLpm, state: r.state, notes: r.notes } } }, m);
        return { r, window: policy.settings.readingEditWindowMinutes };
      });
      return (await toDto([saved.r], saved.window))[0];
    },
  };
}
export type ReadingsService = ReturnType<typeof createReadingsService>;
