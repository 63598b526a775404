import { idParamsSchema } from '@shared/schemas/common';
import { prescriptionSchema } from '@shared/schemas/prescriptions';
import { stepDownPreviewSchema, stepDownRequestSchema } from '@shared/schemas/step-downs';
import { json, route } from '../../openapi/api-route';

export const stepDownsApi = [
  route('post', '/infants/:id/step-down-requests', { summary: 'Ask for the next rung of the ladder', who: 'nurse (caseload), coordinator', params: idParamsSchema, body: stepDownRequestSchema, errors: [409, 422], responses: { 201: json('The proposal made', prescriptionSchema) } }),
  route('get', '/infants/:id/step-down-checks', { summary: 'The rules a step down is checked against, with the evidence', who: 'staff who may read the baby', params: idParamsSchema, responses: { 200: json('Rules and evidence', stepDownPreviewSchema) } }),
];
