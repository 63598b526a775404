import { ourBabiesQueryOptions } from '../../features/family/api/get-our-babies';
import { pageLoader } from '../loaders/page-loader';

/** The family's start page: their own babies (the API narrows the list to them). */
export const loader = pageLoader((_request, ensure) => {
  ensure(ourBabiesQueryOptions());
});
