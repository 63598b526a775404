import { idParamsSchema } from '@shared/schemas/common';
import { myDaySchema, scheduleResponseSchema } from '@shared/schemas/schedule';
import { json, route } from '../../openapi/api-route';

export const scheduleApi = [
  route('get', '/infants/:id/schedule', { summary: 'Planned, overdue and done checks', who: 'staff who may read the baby', params: idParamsSchema, responses: { 200: json('Checks', scheduleResponseSchema) } }),
  route('get', '/my-day', { summary: 'Today’s round and the coming week', who: 'staff', responses: { 200: json('The day', myDaySchema) } }),
];
