import { listUsersQuerySchema } from '@shared/schemas/users';
import { useUrlView } from '../../../lib/url-view';

/** The People view lives in the address bar, so reload, back and a shared link all restore it. */
export const usePeopleView = () => useUrlView(listUsersQuerySchema);
