import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { anonymousAgent } from '../helpers/agents';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({ SIGNIN_IP_LIMIT: '4' });
});
afterAll(() => ctx.close());

describe('sign-in rate limit per IP', () => {
  it('when one address tries many different accounts, then it is stopped with 429', async () => {
    const a = await anonymousAgent(ctx.app);
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) {
      const res = await a.post('/api/session').set('X-CSRF-Token', a.csrf).send({ email: `guess${i}@test.example`, password: 'password1' });
      statuses.push(res.status);
    }
    expect(statuses.slice(0, 4)).toEqual([401, 401, 401, 401]);
    expect(statuses.slice(4)).toEqual([429, 429]);
  });
});
