import { useQuery } from '@tanstack/react-query';
import { sessionQueryOptions } from './session-keys';

export const useSession = () => useQuery(sessionQueryOptions());
