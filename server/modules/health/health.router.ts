import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { Redis } from 'ioredis';

const withTimeout = <T>(p: Promise<T>, ms: number) =>
  Promise.race([p, new Promise<never>((_, reject) => setTimeout(() => reject(new Error('timeout')), ms).unref())]);

export function healthRouter(ds: DataSource, redis: Redis): Router {
  const r = Router();
  r.get('/', async (_req, res) => {
    const db = await withTimeout(ds.query('SELECT 1'), 2000).then(() => 'ok' as const, () => 'down' as const);
    const rd = await withTimeout(redis.ping(), 2000).then(() => 'ok' as const, () => 'down' as const);
    const ok = db === 'ok' && rd === 'ok';
    res.set('Cache-Control', 'no-store');
    res.status(ok ? 200 : 503).json({ status: ok ? 'ok' : 'degraded', db, redis: rd });
  });
  return r;
}
