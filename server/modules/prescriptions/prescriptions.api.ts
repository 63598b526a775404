import { idParamsSchema } from '@shared/schemas/common';
import { decisionSchema, prescriptionSchema, queueSchema } from '@shared/schemas/prescriptions';
import { json, route } from '../../openapi/api-route';

export const prescriptionsApi = [
  route('get', '/prescriptions/queue', { summary: 'Proposals waiting for sign-off', who: 'consultant, coordinator', responses: { 200: json('Waiting proposals', queueSchema) } }),
  route('get', '/prescriptions/:id', { summary: 'One setting version with its working', who: 'staff who may read the baby', params: idParamsSchema, responses: { 200: json('The version', prescriptionSchema) } }),
  route('post', '/prescriptions/:id/decision', { summary: 'Approve or send back a proposal', who: 'consultant', params: idParamsSchema, body: decisionSchema, errors: [409], responses: { 200: json('The version after the decision', prescriptionSchema) } }),
];
