import { idParamsSchema } from '@shared/schemas/common';
import { pdfFile, route } from '../../openapi/api-route';

export const carePlanApi = [
  route('get', '/infants/:id/care-plan.pdf', { summary: 'The printable care plan (tagged PDF); 404 before a setting is approved', who: 'anyone who may read the baby and its approved setting', params: idParamsSchema, responses: { 200: pdfFile('The care plan') } }),
];
