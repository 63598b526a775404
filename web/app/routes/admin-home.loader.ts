import { healthQueryOptions } from '../../features/health/api/get-health';
import { overviewQueryOptions } from '../../features/overview/api/get-overview';
import { pageLoader } from '../loaders/page-loader';

/** The admin's start page: their overview and the service status card. */
export const loader = pageLoader((_request, ensure) => {
  ensure(overviewQueryOptions());
  ensure(healthQueryOptions());
});
