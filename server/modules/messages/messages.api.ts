import { idParamsSchema } from '@shared/schemas/common';
import { listMessagesQuerySchema, messageResponseSchema, messagesPageSchema } from '@shared/schemas/messages';
import { json, route } from '../../openapi/api-route';
import { csvFile } from '../infants/infants.api';

export const messagesApi = [
  route('get', '/messages', { summary: 'The message log: one page, filtered and searched', who: 'admin, coordinator', query: listMessagesQuerySchema, responses: { 200: json('One page of messages', messagesPageSchema) } }),
  route('get', '/messages.csv', { summary: 'The message log as CSV: every message the filters and search match', who: 'as GET /messages', query: listMessagesQuerySchema, responses: { 200: csvFile('Messages in the list’s order') } }),
  route('post', '/messages/:id/retry', { summary: 'Send a failed or unknown-outcome message again', who: 'admin, coordinator', params: idParamsSchema, errors: [409], responses: { 200: json('The message', messageResponseSchema) } }),
  route('post', '/messages/:id/arrived', { summary: 'Record that an unknown-outcome message arrived', who: 'admin, coordinator', params: idParamsSchema, errors: [409], responses: { 200: json('The message', messageResponseSchema) } }),
];
