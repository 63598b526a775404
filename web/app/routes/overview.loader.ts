import { overviewQueryOptions } from '../../features/overview/api/get-overview';
import { pageLoader } from '../loaders/page-loader';

/** The coordinator and consultant start pages: the caller's own overview (the API answers for their role). */
export const loader = pageLoader((_request, ensure) => {
  ensure(overviewQueryOptions());
});
