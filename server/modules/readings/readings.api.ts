import { idParamsSchema } from '@shared/schemas/common';
import { createReadingSchema, readingListSchema, readingSchema, readingsQuerySchema, updateReadingSchema } from '@shared/schemas/readings';
import { json, route } from '../../openapi/api-route';
import { csvFile } from '../infants/infants.api';

export const readingsApi = [
  route('post', '/infants/:id/readings', { summary: 'Log a spot reading', who: 'nurse (caseload), coordinator, family (own, marked)', params: idParamsSchema, body: createReadingSchema, errors: [422], responses: { 201: json('Saved', readingSchema) } }),
  route('get', '/infants/:id/readings', { summary: 'Readings between from and to (default: the last 90 days)', who: 'staff who may read the baby; family: own', params: idParamsSchema, query: readingsQuerySchema, responses: { 200: json('Readings, oldest first', readingListSchema) } }),
  route('get', '/infants/:id/readings.csv', { summary: 'Every reading of the baby (or those between from and to) as CSV', who: 'as GET /infants/:id/readings', params: idParamsSchema, query: readingsQuerySchema, responses: { 200: csvFile('Readings, oldest first') } }),
  route('patch', '/readings/:id', { summary: 'Correct a reading within the edit window', who: 'the person who logged it', params: idParamsSchema, body: updateReadingSchema, errors: [409], responses: { 200: json('Corrected', readingSchema) } }),
];
