import type { ConnectionOptions } from 'bullmq';

/** BullMQ needs maxRetriesPerRequest: null on worker connections; the connection is always explicit. */
export function redisConnection(url: string): ConnectionOptions {
  const u = new URL(url);
  return {
    host: u.hostname,
    port: Number(u.port || 6379),
    db: u.pathname.length > 1 ? Number(u.pathname.slice(1)) : 0,
    password: u.password || undefined,
    maxRetriesPerRequest: null,
  };
}
