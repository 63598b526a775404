import { listMessagesQuerySchema } from '@shared/schemas/messages';
import { useUrlView } from '../../../lib/url-view';

/** The message log view lives in the address bar, so reload, back and a shared link all restore it. */
export const useMessageLogView = () => useUrlView(listMessagesQuerySchema);
