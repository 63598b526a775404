import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { fixedClock } from '../../server/lib/clock';
import { beat, stopBeating } from '../../server/lib/heartbeat';

const NOW = new Date('2026-11-24T10:00:00Z');
let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({}, { clock: fixedClock(NOW) });
});
afterAll(() => ctx.close());
const prefix = () => ctx.deps.env.QUEUE_PREFIX;

describe('GET /api/health/live', () => {
  it('when the process runs, then 200 without touching the database', async () => {
    const res = await request(ctx.app).get('/api/health/live').expect(200);
    expect(res.body.status).toBe('ok');
    expect(res.headers['cache-control']).toBe('no-store');
  });
});

describe('GET /api/health/ready', () => {
  it('when PostgreSQL and Redis answer, migrations are current and no worker has beaten, then 200 "degraded" with the worker missing', async () => {
    const res = await request(ctx.app).get('/api/health/ready').expect(200);
    expect(res.body).toEqual({ status: 'degraded', db: 'ok', redis: 'ok', migrations: 'current', workers: { status: 'missing', running: 0, seen: [] } });
  });

  it('when a worker beat 20 s ago, then it is running and the status is ok; the old path answers the same', async () => {
    await beat(ctx.deps.redis, prefix(), 'host-a:101', new Date(NOW.getTime() - 20_000));
    try {
      const res = await request(ctx.app).get('/api/health/ready').expect(200);
      expect(res.body.status).toBe('ok');
      expect(res.body.workers).toEqual({ status: 'ok', running: 1, seen: [{ id: 'host-a:101', lastSeen: '2026-11-24T09:59:40.000Z', ageSeconds: 20, stale: false }] });
      expect((await request(ctx.app).get('/api/health').expect(200)).body).toEqual(res.body);
    } finally {
      await stopBeating(ctx.deps.redis, prefix(), 'host-a:101');
    }
  });

  it('when the only worker last beat 61 s ago, then it is reported stale and missing', async () => {
    await beat(ctx.deps.redis, prefix(), 'host-b:202', new Date(NOW.getTime() - 61_000));
    try {
      const res = await request(ctx.app).get('/api/health/ready').expect(200);
      expect(res.body.status).toBe('degraded');
      expect(res.body.workers).toEqual({ status: 'missing', running: 0, seen: [{ id: 'host-b:202', lastSeen: '2026-11-24T09:58:59.000Z', ageSeconds: 61, stale: true }] });
    } finally {
      await stopBeating(ctx.deps.redis, prefix(), 'host-b:202');
    }
  });

  it('when Redis is unreachable, then 503 "down" naming the failing part', async () => {
    const broken = await createTestContext({ REDIS_URL: 'redis://127.0.0.1:1' });
    try {
      const res = await request(broken.app).get('/api/health/ready');
      expect(res.status).toBe(503);
      expect(res.body).toMatchObject({ status: 'down', db: 'ok', redis: 'down', migrations: 'current', workers: { status: 'missing', running: 0 } });
      // Liveness does not depend on Redis.
      await request(broken.app).get('/api/health/live').expect(200);
    } finally {
      await broken.close();
    }
  });

  it('when a migration is pending, then 503 with migrations "pending"', async () => {
    await ctx.deps.ds.query(`DELETE FROM migrations WHERE id = (SELECT max(id) FROM migrations) RETURNING name`).then(async (rows: Array<Array<{ name: string }>> | Array<{ name: string }>) => {
      const removed = (Array.isArray(rows[0]) ? (rows[0] as Array<{ name: string }>)[0] : (rows[0] as { name: string })).name;
      try {
        const res = await request(ctx.app).get('/api/health/ready');
        expect(res.status).toBe(503);
        expect(res.body).toMatchObject({ status: 'down', migrations: 'pending' });
      } finally {
        const ts = Number(removed.match(/(\d{13})$/)?.[1]);
        await ctx.deps.ds.query('INSERT INTO migrations ("timestamp", name) VALUES ($1, $2)', [ts, removed]);
      }
    });
  });
});
