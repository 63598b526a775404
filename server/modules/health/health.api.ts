import { healthSchema, liveSchema } from '@shared/schemas/health';
import { json, route } from '../../openapi/api-route';

const ready = {
  summary: 'Can the API serve: PostgreSQL, Redis, migrations and the workers’ heartbeats',
  who: 'anyone',
  auth: 'public' as const,
  responses: { 200: json('Ready (status ok or degraded)', healthSchema), 503: json('Not ready: a dependency is down or a migration is pending', healthSchema) },
};
export const healthApi = [
  route('get', '/health', ready),
  route('get', '/health/ready', ready),
  route('get', '/health/live', { summary: 'The process answers', who: 'anyone', auth: 'public', responses: { 200: json('Alive', liveSchema) } }),
];
