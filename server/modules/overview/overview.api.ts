import { overviewSchema } from '@shared/schemas/overview';
import { json, route } from '../../openapi/api-route';

export const overviewApi = [route('get', '/overview', { summary: 'The caller’s start page, one view per role', who: 'admin, coordinator, consultant', responses: { 200: json('Overview', overviewSchema) } })];
