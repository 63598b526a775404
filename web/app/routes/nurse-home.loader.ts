import { myDayQueryOptions } from '../../features/my-day/api/get-my-day';
import { pageLoader } from '../loaders/page-loader';

/** The nurse's start page: today's checks and visits. */
export const loader = pageLoader((_request, ensure) => {
  ensure(myDayQueryOptions());
});
