import { idParamsSchema } from '@shared/schemas/common';
import { chainCheckSchema, chainChecksSchema, readLogPageSchema, readLogQuerySchema } from '@shared/schemas/audit';
import { json, route } from '../../openapi/api-route';

export const auditApi = [
  route('get', '/audit/chain/checks', { summary: 'The latest verifications of the programme’s audit hash chain, newest first', who: 'admin', responses: { 200: json('Chain checks', chainChecksSchema) } }),
  route('post', '/audit/chain/verify', { summary: 'Verify the programme’s audit hash chain now; the answer names the first broken link, if any', who: 'admin', responses: { 200: json('The check just made', chainCheckSchema) } }),
  route('get', '/infants/:id/reads', { summary: 'Who looked at this baby’s record: by person and day, newest first, a page at a time (a damaged cursor is 400)', who: 'admin', params: idParamsSchema, query: readLogQuerySchema, responses: { 200: json('One page of reads', readLogPageSchema) } }),
];
