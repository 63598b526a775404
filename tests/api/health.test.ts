import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../helpers/test-app';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

describe('GET /api/health', () => {
  it('when PostgreSQL and Redis answer, then 200 ok', async () => {
    const res = await request(ctx.app).get('/api/health').expect(200);
    expect(res.body).toEqual({ status: 'ok', db: 'ok', redis: 'ok' });
  });

  it('when Redis is unreachable, then 503 naming the failing part', async () => {
    const broken = await import('../helpers/test-app').then((m) => m.createTestContext({ REDIS_URL: 'redis://127.0.0.1:1' }));
    try {
      const res = await request(broken.app).get('/api/health');
      expect(res.status).toBe(503);
      expect(res.body).toEqual({ status: 'degraded', db: 'ok', redis: 'down' });
    } finally {
      await broken.close();
    }
  });
});
