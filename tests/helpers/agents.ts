import type { Express } from 'express';
import request from 'supertest';
import { TEST_PASSWORD } from './factories';

export type Agent = ReturnType<typeof request.agent> & { csrf: string };

/** A cookie-keeping client with a fresh CSRF token, optionally signed in. */
export async function anonymousAgent(app: Express): Promise<Agent> {
  const agent = request.agent(app) as Agent;
  const res = await agent.get('/api/session').expect(200);
  agent.csrf = res.body.csrfToken;
  return agent;
}

export async function signedInAgent(app: Express, email: string, password = TEST_PASSWORD): Promise<Agent> {
  const agent = await anonymousAgent(app);
  const res = await agent.post('/api/session').set('X-CSRF-Token', agent.csrf).send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in failed for ${email}: ${res.status} ${JSON.stringify(res.body)}`);
  agent.csrf = res.body.csrfToken;
  return agent;
}
