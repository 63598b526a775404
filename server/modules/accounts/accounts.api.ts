import { changePasswordSchema, setPasswordResponseSchema, setPasswordSchema, setupLinkCheckSchema, setupLinkInfoSchema } from '@shared/schemas/accounts';
import { json, route } from '../../openapi/api-route';

export const accountsApi = [
  route('post', '/account/set-password/check', { summary: 'Who a set-up link is for', who: 'anyone with a set-up link', auth: 'public', body: setupLinkCheckSchema, responses: { 200: json('The link’s account', setupLinkInfoSchema) } }),
  route('post', '/account/set-password', { summary: 'Choose a password with a set-up link', who: 'anyone with a set-up link', auth: 'public', body: setPasswordSchema, responses: { 200: json('Password set', setPasswordResponseSchema) } }),
  route('put', '/me/password', { summary: 'Change my password (other sessions end)', who: 'anyone signed in', body: changePasswordSchema, errors: [429], responses: { 204: { description: 'Changed' } } }),
];
