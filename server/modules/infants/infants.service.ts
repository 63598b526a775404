import type { DataSource } from 'typeorm';
import type { AppAbility } from '@shared/auth/ability';
import type { ContactInput, EnrolInfantInput, InfantSummary, ListInfantsQuery, UpdateInfantInput } from '@shared/schemas/infants';
import { accessibleWhere, type SqlFilter } from '../../auth/casl-to-sql';
import { INFANT_ACL_COLUMNS, sortKeyLength, sortValues, type InfantListRow } from '../../db/repositories/infants.repository';
import { encodeCursor, pageCursors, positionOf, readingFrom } from '../../lib/cursor';
import { EXPORT_PAGE_ROWS } from '../../lib/csv';
import type { AppRepos } from '../../deps';
import type { JobProducer } from '../../jobs/producer';
import { ForbiddenError, NotFoundError } from '../../lib/errors';
import type { Actor } from '../../lib/http';
import { enrolInfant } from './enrol';
import { toDetail, toSummary } from './infants.mapper';
import { replaceContacts, updateInfant } from './update';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const asObject = (v: unknown) => (v && typeof v === 'object' ? (v as Record<string, unknown>) : {});

/** Staff ids an audit line names: a visit's nurse before and after, a changed nurse or consultant on the record. */
function staffIdsIn(details: Record<string, unknown> | null): string[] {
  const d = asObject(details);
  const changes = asObject(d.changes);
  const ids = [asObject(d.before).staffId, asObject(d.after).staffId, d.staffId,
    asObject(changes.nurseId).from, asObject(changes.nurseId).to, asObject(changes.consultantId).from, asObject(changes.consultantId).to];
  return ids.filter((id): id is string => typeof id === 'string' && UUID.test(id));
}

/** "Mine" narrows to the people a baby is assigned to; a nurse's rules already allow only their caseload. */
function scopeFilter(user: Express.User, query: Pick<ListInfantsQuery, 'scope'>): SqlFilter | undefined {
  if (query.scope === 'programme' && user.role === 'nurse') throw new ForbiddenError('A nurse sees their own caseload.');
  if (query.scope === 'mine' && user.role === 'consultant') return { sql: 'i.consultant_id = :me', params: { me: user.id } };
  if (query.scope === 'mine' && user.role === 'nurse') return { sql: 'i.nurse_id = :me', params: { me: user.id } };
  return undefined;
}

export function createInfantsService(ds: DataSource, repos: AppRepos, jobs: JobProducer) {
  const acl = (ability: AppAbility) => accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS);

  async function detail(ability: AppAbility, id: string, today: string) {
    const record = await repos.infants.findRecord(id, acl(ability));
    if (!record) throw new NotFoundError('No such baby in your records.');
    return toDetail(record.infant, record.site, record.contacts, record.active, record.names, today);
  }

  return {
    detail,

    async list(ability: AppAbility, user: Express.User, query: ListInfantsQuery, today: string) {
      const extra = scopeFilter(user, query);
      const { from, at } = positionOf(query, query.sort, sortKeyLength(query.sort));
      const { rows, more, total, estimate } = await readingFrom(from, repos.infants.listWithTotal(query, acl(ability), extra, at));
      const cursorOf = (r: InfantListRow) => encodeCursor({ sort: query.sort, values: sortValues(query.sort, r), id: r.id });
      return {
        items: rows.map((r) => toSummary(r, today)),
        total,
        totalIsEstimate: estimate,
        ...pageCursors({ query, from, rows, more, cursorOf }),
      };
    },

    /**
     * Every baby the list's filters, search and sort match (paging ignored), read page by page from the sort's keyset
     * so a large programme never sits in memory. The scope is checked here, before the first row is written.
     */
    exportRows(ability: AppAbility, user: Express.User, query: ListInfantsQuery, today: string): AsyncIterable<InfantListRow & { summary: InfantSummary }> {
      const extra = scopeFilter(user, query);
      const pageQuery = { ...query, pageSize: EXPORT_PAGE_ROWS };
      return (async function* () {
        let after: string[] | undefined;
        for (;;) {
          const { rows, more } = await repos.infants.list(pageQuery, acl(ability), extra, after ? { after } : {});
          for (const r of rows) yield { ...r, summary: toSummary(r, today) };
          if (!more || !rows.length) return;
          const last = rows.at(-1)!;
          after = [...sortValues(query.sort, last), last.id];
        }
      })();
    },

    async enrol(ability: AppAbility, actor: Actor, input: EnrolInfantInput, today: string) {
      const out = await enrolInfant(ds, repos, actor, input, today);
      if (out.prescriptionId) await jobs.enqueueConversion(out.prescriptionId);
      return { created: out.created, infant: await detail(ability, out.infant.id, today) };
    },

    async update(ability: AppAbility, actor: Actor, id: string, input: UpdateInfantInput, today: string) {
      const out = await updateInfant(ds, repos, ability, actor, id, input, today);
      if (out.prescriptionId) await jobs.enqueueConversion(out.prescriptionId);
      return detail(ability, id, today);
    },

    async replaceContacts(ability: AppAbility, actor: Actor, id: string, contacts: ContactInput[], today: string) {
      await replaceContacts(ds, repos, ability, actor, id, contacts);
      return detail(ability, id, today);
    },

    async audit(ability: AppAbility, id: string) {
      const infant = await repos.infants.findVisible(id, acl(ability));
      if (!infant) throw new NotFoundError('No such baby in your records.');
      const events = await repos.audit.listForEntity('infant', id);
      const names = await repos.infants.peopleNames(events.map((e) => e.actorId));
      const mentioned = await repos.infants.peopleNames(events.flatMap((e) => staffIdsIn(e.details)));
      return {
        people: Object.fromEntries(mentioned),
        items: events.map((e) => ({
          id: String(e.id), at: e.at.toISOString(), action: e.action, actor: e.actorId ? { id: e.actorId, name: names.get(e.actorId) ?? '' } : null, details: e.details,
        })),
      };
    },
  };
}
export type InfantsService = ReturnType<typeof createInfantsService>;
