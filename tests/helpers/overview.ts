import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import type { AppDeps } from '../../server/deps';
import { signedInAgent, type Agent } from './agents';
import { post } from './approved-baby';
import { enrolmentBody, makeClinic, runPendingConversions } from './infants';

export type Clinic = Awaited<ReturnType<typeof makeClinic>>;

/** A programme with staff signed in, and short ways to put its babies in the states the overview counts. */
export async function overviewClinic(deps: AppDeps, app: Express) {
  const clinic = await makeClinic(deps);
  const coord = await signedInAgent(app, clinic.people.coordinator.email);
  const consultant = await signedInAgent(app, clinic.people.consultant.email);
  const q = (sql: string, params: unknown[]) => deps.ds.query(sql, params);

  /** Enrolled through the API: the proposal is still being worked out ('preparing'). */
  const enrolled = async (): Promise<{ id: string }> => (await post(coord, '/api/infants', enrolmentBody(clinic, { homeElevationM: 40 })).expect(201)).body;
  /** Worked out and waiting for sign-off; returns the proposal's id. */
  const proposed = async () => {
    const infant = await enrolled();
    const [rxId] = await runPendingConversions(deps, infant.id);
    return { infant, rxId };
  };
  /** Approved by the consultant through the API. */
  const approved = async () => {
    const { infant, rxId } = await proposed();
    await post(consultant, `/api/prescriptions/${rxId}/decision`, { decision: 'approve' }).expect(200);
    return { infant, rxId };
  };
  return {
    clinic, coord, consultant, enrolled, proposed, approved,
    /** Demo-free way to give a setting a past decision time (the API stamps the wall clock). */
    decidedAt: (rxId: string, at: string) => q(`UPDATE prescriptions SET decided_at = $2 WHERE id = $1`, [rxId, at]),
    createdAt: (table: 'prescriptions' | 'journeys', id: string, at: string) => q(`UPDATE ${table} SET created_at = $2 WHERE id = $1`, [id, at]),
    /** A newer approved version with no oxygen in it, decided at `at`: the baby came off oxygen then. */
    cameOffOxygen: async (infantId: string, at: string) => {
      await q(`UPDATE prescriptions SET status = 'superseded' WHERE infant_id = $1 AND status = 'active'`, [infantId]);
      await q(
        `INSERT INTO prescriptions (infant_id, programme_id, version, status, reason, input, source, source_o2_percent, approved_flow_lpm, decided_at, decided_by)
         SELECT infant_id, programme_id, version + 1, 'active', 'step_down', input, source, source_o2_percent, 0, $2, decided_by
           FROM prescriptions WHERE infant_id = $1 AND status = 'superseded' ORDER BY version DESC LIMIT 1`, [infantId, at]);
      await q(`UPDATE infants SET status = 'off_oxygen', off_oxygen_since = $2 WHERE id = $1`, [infantId, at]);
    },
    check: (infantId: string, status: 'planned' | 'overdue' | 'done' | 'cancelled', dueAt: string, kind = 'spot_check') =>
      q(`INSERT INTO checks (programme_id, infant_id, plan_key, kind, due_at, due_date, status) VALUES ($1, $2, $3, $4, $5, $5::timestamptz::date, $6)`,
        [clinic.programme.id, infantId, `test-${randomUUID()}`, kind, dueAt, status]),
    journey: async (infantId: string, agent: Agent = coord) => {
      const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);
      const body = { mode: 'road', destinationName: 'High Saddle', destinationElevationM: 2350, departOn: day(5), returnOn: day(6), hoursAway: 30 };
      return (await post(agent, `/api/infants/${infantId}/journeys`, body).expect(201)).body.journey as { id: string };
    },
  };
}
