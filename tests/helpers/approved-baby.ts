import type { Express } from 'express';
import type { AppDeps } from '../../server/deps';
import { signedInAgent, type Agent } from './agents';
import { enrolmentBody, makeClinic, runPendingConversions } from './infants';

export const post = (a: Agent, path: string, body: unknown) => a.post(path).set('X-CSRF-Token', a.csrf).send(body as object);

/** A baby at home on a consultant-approved setting, with its family account linked and the team signed in. */
export async function approvedBaby(deps: AppDeps, app: Express, over: { homeElevationM?: number; weightKg?: number; flowLpm?: number } = {}) {
  const clinic = await makeClinic(deps);
  const coord = await signedInAgent(app, clinic.people.coordinator.email);
  const body = enrolmentBody(clinic, { familyEmail: clinic.people.family.email, weightKg: over.weightKg ?? 3, flowLpm: over.flowLpm ?? 0.25, homeElevationM: over.homeElevationM ?? 40 });
  const infant = (await post(coord, '/api/infants', body).expect(201)).body;
  await runPendingConversions(deps, infant.id);
  const consultant = await signedInAgent(app, clinic.people.consultant.email);
  const [rx] = (await consultant.get(`/api/infants/${infant.id}/prescriptions`).expect(200)).body.items;
  const approved = (await post(consultant, `/api/prescriptions/${rx.id}/decision`, { decision: 'approve' }).expect(200)).body;
  const family = await signedInAgent(app, clinic.people.family.email);
  return { clinic, infant, coord, consultant, family, rx: approved };
}
