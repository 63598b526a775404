import { policyHistorySchema, policySchema, updatePolicySchema } from '@shared/schemas/policy';
import { json, route } from '../../openapi/api-route';

export const policyApi = [
  route('get', '/policy', { summary: 'The programme’s current settings', who: 'signed-in staff and families', responses: { 200: json('Current settings version', policySchema) } }),
  route('put', '/policy', { summary: 'Save a new settings version', who: 'admin', body: updatePolicySchema, errors: [409], responses: { 200: json('The new version', policySchema) } }),
  route('get', '/policy/history', { summary: 'Every settings version', who: 'staff', responses: { 200: json('Versions, newest first', policyHistorySchema) } }),
];
