export interface RedisUrlOptions { host: string; port: number; db: number; username?: string; password?: string; tls?: { servername: string } }

/**
 * The connection options a Redis URL stands for, whole: user and password (percent-decoded), database number and
 * TLS for `rediss://`. BullMQ takes options rather than a URL, and dropping any of these silently connects to the
 * wrong place or not at all on a managed Redis.
 */
export function redisOptionsFromUrl(url: string): RedisUrlOptions {
  const u = new URL(url);
  if (u.protocol !== 'redis:' && u.protocol !== 'rediss:') throw new Error(`REDIS_URL must start with redis:// or rediss:// (got ${u.protocol})`);
  const db = u.pathname.length > 1 ? Number(u.pathname.slice(1)) : 0;
  if (!Number.isInteger(db) || db < 0) throw new Error('REDIS_URL database number must be a whole number');
  return {
    host: u.hostname.replace(/^\[(.*)\]$/, '$1'),
    port: Number(u.port || 6379),
    db,
    ...(u.username ? { username: decodeURIComponent(u.username) } : {}),
    ...(u.password ? { password: decodeURIComponent(u.password) } : {}),
    ...(u.protocol === 'rediss:' ? { tls: { servername: u.hostname } } : {}),
  };
}
