import { idParamsSchema } from '@shared/schemas/common';
import { invitationResponseSchema } from '@shared/schemas/accounts';
import { createUserSchema, listUsersQuerySchema, userResponseSchema, usersPageSchema } from '@shared/schemas/users';
import { json, route } from '../../openapi/api-route';

export const usersApi = [
  route('get', '/users', { summary: 'People of the programme', who: 'staff', query: listUsersQuerySchema, responses: { 200: json('One page of people', usersPageSchema) } }),
  route('post', '/users', { summary: 'Add a person; a set-up link is e-mailed', who: 'admin', body: createUserSchema, responses: { 202: json('Invitation sent (the same answer for an address that has an account)', invitationResponseSchema) } }),
  route('post', '/users/:id/setup-link', { summary: 'Send a new set-up link (ends the password and sessions)', who: 'admin', params: idParamsSchema, errors: [409], responses: { 202: json('Link sent', userResponseSchema) } }),
  route('post', '/users/:id/disable', { summary: 'Disable an account', who: 'admin', params: idParamsSchema, errors: [409], responses: { 200: json('Disabled', userResponseSchema) } }),
  route('post', '/users/:id/enable', { summary: 'Enable an account', who: 'admin', params: idParamsSchema, responses: { 200: json('Enabled', userResponseSchema) } }),
];
