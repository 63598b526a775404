import type { ConnectionOptions } from 'bullmq';
import { redisOptionsFromUrl } from '../server/lib/redis-url';

/** BullMQ needs maxRetriesPerRequest: null on worker connections; the URL's user, password, database and TLS are kept. */
export function redisConnection(url: string): ConnectionOptions {
  return { ...redisOptionsFromUrl(url), maxRetriesPerRequest: null };
}
