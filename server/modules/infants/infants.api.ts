import { z } from 'zod';
import { idParamsSchema } from '@shared/schemas/common';
import { auditEventsSchema, infantDetailSchema, infantsPageSchema, listInfantsQuerySchema, updateInfantSchema } from '@shared/schemas/infants';
import { enrolInfantSchemaFor, replaceContactsSchemaFor } from '@shared/schemas/infant-contacts';
import { prescriptionListSchema } from '@shared/schemas/prescriptions';
import { json, route } from '../../openapi/api-route';

/** A CSV download: UTF-8 with a byte-order mark, first row the headings (DEVELOPERS.md, "CSV exports"). */
export const csvFile = (description: string) => ({ description, type: 'text/csv', schema: z.string() });

export const infantsApi = [
  route('get', '/infants', { summary: 'Caseload: one page, filtered, searched and sorted', who: 'staff (nurse: own caseload); family: own babies', query: listInfantsQuerySchema, responses: { 200: json('One page of babies', infantsPageSchema) } }),
  route('get', '/infants.csv', { summary: 'Caseload as CSV: every baby the list’s filters match (paging ignored)', who: 'as GET /infants', query: listInfantsQuerySchema, responses: { 200: csvFile('The caseload') } }),
  route('post', '/infants', { summary: 'Enrol a baby (idempotent by enrolKey)', who: 'coordinator', body: enrolInfantSchemaFor(), errors: [422], responses: { 201: json('Enrolled', infantDetailSchema), 200: json('Already enrolled with this enrolKey', infantDetailSchema) } }),
  route('get', '/infants/:id', { summary: 'A baby’s record', who: 'staff who may read the baby; family: own', params: idParamsSchema, responses: { 200: json('Record', infantDetailSchema) } }),
  route('patch', '/infants/:id', { summary: 'Change weight, home, nurse or consultant', who: 'coordinator', params: idParamsSchema, body: updateInfantSchema, errors: [409, 422], responses: { 200: json('Record after the change', infantDetailSchema) } }),
  route('put', '/infants/:id/contacts', { summary: 'Replace the family contacts', who: 'coordinator', params: idParamsSchema, body: replaceContactsSchemaFor(), responses: { 200: json('Record after the change', infantDetailSchema) } }),
  route('get', '/infants/:id/prescriptions', { summary: 'Setting versions with their working', who: 'staff; family: the active plan only', params: idParamsSchema, responses: { 200: json('Versions', prescriptionListSchema) } }),
  route('get', '/infants/:id/audit', { summary: 'The baby’s audit trail', who: 'staff', params: idParamsSchema, responses: { 200: json('Audit lines with the names they point at', auditEventsSchema) } }),
];
