import { idParamsSchema } from '@shared/schemas/common';
import { createJourneySchema, journeyDecisionSchema, journeyListSchema, journeyResponseSchema } from '@shared/schemas/journeys';
import { json, route } from '../../openapi/api-route';

export const journeysApi = [
  route('post', '/infants/:id/journeys', { summary: 'Ask for a journey check', who: 'family (own baby), coordinator', params: idParamsSchema, body: createJourneySchema, errors: [409], responses: { 201: json('The journey with its plan', journeyResponseSchema) } }),
  route('get', '/infants/:id/journeys', { summary: 'The baby’s journey checks', who: 'staff (nurse: caseload); family: own', params: idParamsSchema, responses: { 200: json('Journeys', journeyListSchema) } }),
  route('get', '/journeys/waiting', { summary: 'Journey checks waiting for sign-off, oldest first', who: 'consultant, coordinator', responses: { 200: json('Waiting journeys', journeyListSchema) } }),
  route('get', '/journeys/:id', { summary: 'One journey check', who: 'staff who may read the baby; family: own (numbers once approved)', params: idParamsSchema, responses: { 200: json('The journey', journeyResponseSchema) } }),
  route('post', '/journeys/:id/decision', { summary: 'Approve or decline a journey check', who: 'consultant', params: idParamsSchema, body: journeyDecisionSchema, errors: [409], responses: { 200: json('The journey after the decision', journeyResponseSchema) } }),
];
