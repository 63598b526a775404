import { sessionResponseSchema, signInResponseSchema, signInSchema } from '@shared/schemas/session';
import { json, route } from '../../openapi/api-route';

export const sessionApi = [
  route('get', '/session', { summary: 'The signed-in person (or null) and the CSRF token', who: 'anyone', auth: 'public', responses: { 200: json('Session', sessionResponseSchema) } }),
  route('post', '/session', { summary: 'Sign in', who: 'anyone', auth: 'public', body: signInSchema, errors: [401, 429], responses: { 200: json('Signed in, with the new CSRF token', signInResponseSchema) } }),
  route('delete', '/session', { summary: 'Sign out', who: 'anyone', auth: 'public', responses: { 204: { description: 'Signed out' } } }),
];
