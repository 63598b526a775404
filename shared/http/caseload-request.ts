import { listInfantsQuerySchema } from '../schemas/infants';
import { apiPath, readListView } from './list-view';

export const CASELOAD_API_PATH = '/api/infants';

/**
 * The caseload request a page address makes (web/features/infants/api/get-infants.ts reads its view with the same
 * schema and writes the request with the same `apiPath`), when that request is the same whoever is signed in: a
 * `scope` is kept for a consultant only, so an address holding one gets null.
 */
export function caseloadRequestFor(params: URLSearchParams): string | null {
  const view = readListView(listInfantsQuerySchema, params);
  if (view.scope !== undefined) return null;
  return apiPath(CASELOAD_API_PATH, { ...view });
}
