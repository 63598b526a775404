import { preferencesResponseSchema, updatePreferencesSchemaFor } from '@shared/schemas/preferences';
import { json, route } from '../../openapi/api-route';

export const preferencesApi = [
  route('get', '/me/preferences', { summary: 'My contact details, channel, consents and reminder switch', who: 'family', responses: { 200: json('Preferences', preferencesResponseSchema) } }),
  route('put', '/me/preferences', { summary: 'Save my preferences', who: 'family', body: updatePreferencesSchemaFor(), errors: [409], responses: { 200: json('Saved', preferencesResponseSchema) } }),
];
