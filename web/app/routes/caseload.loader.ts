import { infantsQueryOptions } from '../../features/infants/api/get-infants';
import { readCaseloadView } from '../../features/infants/hooks/use-caseload-view';
import { pageLoader } from '../loaders/page-loader';

/** The caseload page the address asks for, read exactly as the page reads it, so the page finds it in the cache. */
export const loader = pageLoader(({ user, url }, ensure) => {
  ensure(infantsQueryOptions(readCaseloadView(url.searchParams, user.role)));
});
