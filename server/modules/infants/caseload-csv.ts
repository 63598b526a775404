import { Router } from 'express';
import { INFANT_FLAG_LABELS, INFANT_STATUS_LABELS, listInfantsQuerySchema, type InfantSummary, type ListInfantsQuery } from '@shared/schemas/infants';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { assertCanAny, currentUser } from '../../lib/http';
import { isoInZone, sendCsv, type CsvColumn } from '../../lib/csv';
import { auditRead } from '../audit/read-audit';
import { todayIn } from '../../lib/dates';
import type { InfantListRow } from '../../db/repositories/infants.repository';
import type { InfantsService } from './infants.service';

type Row = InfantListRow & { summary: InfantSummary };

const columns = (timeZone: string): CsvColumn<Row>[] => [
  { heading: 'Baby', value: (r) => r.summary.name },
  { heading: 'Date of birth', value: (r) => r.birth_date },
  { heading: 'Corrected age', value: (r) => r.summary.correctedAge },
  { heading: 'Status', value: (r) => INFANT_STATUS_LABELS[r.summary.status] },
  { heading: 'Flow now (L/min)', value: (r) => r.summary.activeFlowLpm },
  { heading: 'Home elevation (m)', value: (r) => r.summary.homeElevationM },
  { heading: 'Home air pressure (mmHg)', value: (r) => r.summary.homePressureMmHg },
  { heading: 'Nurse', value: (r) => r.summary.nurse?.name },
  { heading: 'Consultant', value: (r) => r.summary.consultant?.name },
  { heading: 'Flags', value: (r) => r.summary.flags.map((f) => INFANT_FLAG_LABELS[f]).join('; ') },
  { heading: `Enrolled (ISO 8601, ${timeZone})`, value: (r) => isoInZone(r.k_created_at, timeZone) },
  { heading: 'Nestflow record id', value: (r) => r.id },
];

/** GET /api/infants.csv: the caseload with the list's filters, search and sort, every matching baby. */
export function caseloadCsvRouter(service: InfantsService): Router {
  const r = Router();
  r.use(requireUser);
  r.get('/', validate({ query: listInfantsQuerySchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Infant');
    const user = currentUser(req);
    const today = todayIn(user.programmeTimeZone);
    const rows = service.exportRows(req.ability, user, req.query as unknown as ListInfantsQuery, today);
    await auditRead(req, { action: 'caseload.exported' });
    await sendCsv(res, `caseload-${today}.csv`, columns(user.programmeTimeZone), rows);
  });
  return r;
}
