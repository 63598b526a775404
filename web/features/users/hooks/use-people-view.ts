import { listUsersQuerySchema } from '@shared/schemas/users';
import { useCursorUrlView } from '../../../lib/cursor-view';

/**
 * The People view lives in the address bar, so reload, back and a shared link all restore it; pages are reached by
 * position, and any other change starts again from the first page.
 */
export const usePeopleView = () => useCursorUrlView(listUsersQuerySchema);
