import { conversionPreviewBodySchema, conversionPreviewResponseSchema } from '@shared/schemas/conversions';
import { json, route } from '../../openapi/api-route';

export const conversionsApi = [
  route('post', '/conversions/preview', { summary: 'The conversion with its working; nothing is stored', who: 'staff', body: conversionPreviewBodySchema, responses: { 200: json('Proposal and working', conversionPreviewResponseSchema) } }),
];
