import { listMessagesQuerySchema } from '@shared/schemas/messages';
import { useCursorUrlView } from '../../../lib/cursor-view';

/**
 * The message log view lives in the address bar, so reload, back and a shared link all restore it; pages are
 * reached by position, and any other change starts again from the first page.
 */
export const useMessageLogView = () => useCursorUrlView(listMessagesQuerySchema);
