import { sitesResponseSchema } from '@shared/schemas/sites';
import { json, route } from '../../openapi/api-route';

export const sitesApi = [route('get', '/sites', { summary: 'Hospital sites of the programme', who: 'staff', responses: { 200: json('Sites', sitesResponseSchema) } })];
