import { auditWords, type PeopleNames } from '@shared/audit/audit-words';
import type { AuditEvent } from '../api/get-infant-audit';

/** What happened, in words with what changed (the sentences live in shared/audit, one per stored action). */
export const auditText = (event: AuditEvent, people: PeopleNames = {}): string => auditWords(event.action, event.details, people);
