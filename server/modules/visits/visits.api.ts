import { idParamsSchema } from '@shared/schemas/common';
import { bookVisitSchema, cancelVisitSchema, completeVisitSchema, moveVisitSchema, visitListSchema, visitSchema } from '@shared/schemas/visits';
import { json, route } from '../../openapi/api-route';

export const visitsApi = [
  route('post', '/infants/:id/visits', { summary: 'Book a visit', who: 'coordinator; the baby’s nurse', params: idParamsSchema, body: bookVisitSchema, responses: { 201: json('Booked', visitSchema) } }),
  route('get', '/infants/:id/visits', { summary: 'The baby’s visits', who: 'staff who may read the baby; family: own', params: idParamsSchema, responses: { 200: json('Visits', visitListSchema) } }),
  route('patch', '/visits/:id', { summary: 'Move a visit', who: 'coordinator; the baby’s nurse', params: idParamsSchema, body: moveVisitSchema, errors: [409], responses: { 200: json('Moved', visitSchema) } }),
  route('post', '/visits/:id/done', { summary: 'Mark a visit done', who: 'coordinator; the baby’s nurse', params: idParamsSchema, body: completeVisitSchema, errors: [409], responses: { 200: json('Done', visitSchema) } }),
  route('post', '/visits/:id/cancel', { summary: 'Cancel a visit', who: 'coordinator; the baby’s nurse', params: idParamsSchema, body: cancelVisitSchema, errors: [409], responses: { 200: json('Cancelled', visitSchema) } }),
];
