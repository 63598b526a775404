import { Router, type RequestHandler } from 'express';
import type { DataSource } from 'typeorm';
import type { Redis } from 'ioredis';
import { systemClock, type Clock } from '../../lib/clock';
import { readBeats } from '../../lib/heartbeat';
import type { Health } from '@shared/schemas/health';

const withTimeout = <T>(p: Promise<T>, ms: number) =>
  Promise.race([p, new Promise<never>((_, reject) => setTimeout(() => reject(new Error('timeout')), ms).unref())]);

type Check = 'ok' | 'down';
const check = (p: Promise<unknown>): Promise<Check> => withTimeout(p, 2000).then(() => 'ok' as const, () => 'down' as const);

export interface HealthOptions { ds: DataSource; redis: Redis; queuePrefix: string; clock?: Clock }

/**
 * /live: the process answers (a load balancer or systemd watchdog restarts it otherwise).
 * /ready: it can serve — PostgreSQL and Redis answer and no migration is pending (503 otherwise). The workers'
 * heartbeats are reported beside it; a worker gone quiet makes the status "degraded" but the API stays in
 * service, because requests do not need a worker to be answered.
 */
export function healthRouter({ ds, redis, queuePrefix, clock = systemClock }: HealthOptions): Router {
  const r = Router();
  r.use((_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  r.get('/live', (_req, res) => {
    res.json({ status: 'ok', uptimeSeconds: Math.round(process.uptime()) });
  });
  const ready: RequestHandler = async (_req, res) => {
    const [db, rd] = await Promise.all([check(ds.query('SELECT 1')), check(redis.ping())]);
    const migrations = db === 'ok'
      ? await withTimeout(ds.showMigrations(), 2000).then((pending) => (pending ? 'pending' as const : 'current' as const), () => 'unknown' as const)
      : 'unknown' as const;
    const beats = rd === 'ok' ? await withTimeout(readBeats(redis, queuePrefix, clock.now()), 2000).catch(() => []) : [];
    const live = beats.filter((b) => !b.stale);
    const workers: Health['workers'] = { status: live.length > 0 ? 'ok' : 'missing', running: live.length, seen: beats };
    const ok = db === 'ok' && rd === 'ok' && migrations === 'current';
    const body: Health = { status: !ok ? 'down' : workers.status === 'ok' ? 'ok' : 'degraded', db, redis: rd, migrations, workers };
    res.status(ok ? 200 : 503).json(body);
  };
  r.get('/ready', ready);
  // The original path answers as readiness, for anything already probing it.
  r.get('/', ready);
  return r;
}
