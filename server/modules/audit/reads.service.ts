import { TZDate } from '@date-fns/tz';
import type { AppAbility } from '@shared/auth/ability';
import { auditWords } from '@shared/audit/audit-words';
import { isReadAction } from '@shared/audit/audit-actions';
import type { ReadLogPage, ReadLogQuery } from '@shared/schemas/audit';
import type { AppRepos } from '../../deps';
import { accessibleWhere } from '../../auth/casl-to-sql';
import { INFANT_ACL_COLUMNS } from '../../db/repositories/infants.repository';
import { NotFoundError, ValidationError } from '../../lib/errors';

// The page cursor is the last row's exact time and id; a forged one only moves the page (the baby and programme
// filters still apply in SQL).
const encode = (at: string, id: string) => Buffer.from(JSON.stringify([at, id])).toString('base64url');
function decode(text: string): { at: string; id: string } {
  try {
    const [at, id] = JSON.parse(Buffer.from(text, 'base64url').toString('utf8')) as unknown[];
    if (typeof at === 'string' && /^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{6}Z$/.test(at) && typeof id === 'string' && /^\d{1,19}$/.test(id)) return { at, id };
  } catch { /* falls through to the message below */ }
  throw new ValidationError({ 'query.cursor': ['This page link is out of date or damaged; go back to the first page.'] });
}

/** Midnight starting a calendar day in the programme's time zone. */
const dayStart = (day: string, timeZone: string, addDays = 0) => {
  const [y, m, d] = day.split('-').map(Number);
  return new Date(new TZDate(y, m - 1, d + addDays, 0, 0, 0, timeZone).getTime());
};

/** "Who looked at this baby's record" for an admin of the baby's programme. */
export function createReadsService(repos: Pick<AppRepos, 'audit' | 'infants'>) {
  return {
    async list(ability: AppAbility, programmeId: string, timeZone: string, infantId: string, q: ReadLogQuery): Promise<ReadLogPage> {
      const infant = await repos.infants.findVisible(infantId, accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS));
      if (!infant || infant.programmeId !== programmeId) throw new NotFoundError('No such baby in your records.');
      const rows = await repos.audit.listReads(programmeId, infantId, {
        actorId: q.actorId,
        from: q.from ? dayStart(q.from, timeZone) : undefined,
        to: q.to ? dayStart(q.to, timeZone, 1) : undefined,
        before: q.cursor ? decode(q.cursor) : undefined,
        limit: q.limit + 1,
      });
      const page = rows.slice(0, q.limit);
      const last = page[page.length - 1];
      return {
        items: page.filter((r) => isReadAction(r.action)).map((r) => ({
          id: r.id,
          at: r.at.toISOString(),
          action: r.action as ReadLogPage['items'][number]['action'],
          words: auditWords(r.action, r.details),
          person: r.actorId ? { id: r.actorId, name: r.actorName ?? 'someone no longer listed', role: r.actorRole ?? '' } : null,
          ip: r.ip,
        })),
        nextCursor: rows.length > q.limit && last ? encode(last.atExact, last.id) : null,
      };
    },
  };
}
export type ReadsService = ReturnType<typeof createReadsService>;
