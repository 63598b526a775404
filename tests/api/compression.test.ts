import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent } from '../helpers/agents';
import { enrolmentBody, makeClinic } from '../helpers/infants';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

describe('compression', () => {
  it('when a client accepts gzip and the answer is large, then it is sent compressed; small answers are sent as they are', async () => {
    const clinic = await makeClinic(ctx.deps);
    const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
    for (let n = 0; n < 4; n++) await coord.post('/api/infants').set('X-CSRF-Token', coord.csrf).send(enrolmentBody(clinic)).expect(201);
    const list = await coord.get('/api/infants').set('Accept-Encoding', 'gzip').expect(200);
    expect(list.headers['content-encoding']).toBe('gzip');
    expect(list.body.items).toHaveLength(4);
    const health = await coord.get('/api/health').set('Accept-Encoding', 'gzip');
    expect(health.headers['content-encoding']).toBeUndefined();
  });
});
