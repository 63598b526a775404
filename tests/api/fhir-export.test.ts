import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fhirBundleSchema } from '@shared/schemas/fhir';
import { analyseRecording } from '../../server/modules/recordings/analyse';
import { fixedClock } from '../../server/lib/clock';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent, anonymousAgent } from '../helpers/agents';
import { makeProgrammeWithStaff, makeUser } from '../helpers/factories';
import { enrolmentBody, makeClinic, runPendingConversions } from '../helpers/infants';
import { approvedBaby, post } from '../helpers/approved-baby';
import { fhirProblems } from '../helpers/fhir-validate';
import { buildNoisyTrace } from '../shared/clinical/helpers/synthetic-oximetry';
import { csvFromSamples } from '../fixtures/recordings/build-csv';
import { uploadRecording } from '../fixtures/recordings/upload';

const NOW = '2026-12-01T10:00:00.000Z';
let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({}, { clock: fixedClock(NOW) });
});
afterAll(async () => {
  await ctx.close();
});

type Bundle = fhir4.Bundle<fhir4.FhirResource>;
const resources = (b: Bundle) => (b.entry ?? []).map((e) => e.resource!);
const byCode = (b: Bundle, code: string) =>
  resources(b).filter((r): r is fhir4.Observation => r.resourceType === 'Observation' && r.code.coding?.[0]?.code === code);

describe('GET /api/infants/:id/fhir', () => {
  it('when the baby’s nurse exports, then 200 application/fhir+json named by the Nestflow id: a valid R4 collection with readings, the study and the approved order', async () => {
    const { infant, clinic, rx } = await approvedBaby(ctx.deps, ctx.app);
    const nurse = await signedInAgent(ctx.app, clinic.people.nurse.email);
    await post(nurse, `/api/infants/${infant.id}/readings`, { takenAt: '2026-11-25T03:00:00Z', spo2: 94, pulse: 151, flowLpm: 0.25, state: 'asleep' }).expect(201);
    // Six hours of signal is long enough to judge (300 valid minutes by default); one hour is not, and is left out.
    const upload = await uploadRecording(nurse, infant.id, csvFromSamples(buildNoisyTrace(6 * 3600, 11))).expect(202);
    expect(await analyseRecording(ctx.deps.ds, ctx.deps.repos, upload.body.id)).toBe('done');
    const short = await uploadRecording(nurse, infant.id, csvFromSamples(buildNoisyTrace(3600, 12)), {}, 'short.csv').expect(202);
    expect(await analyseRecording(ctx.deps.ds, ctx.deps.repos, short.body.id)).toBe('done');

    const res = await nurse.get(`/api/infants/${infant.id}/fhir`).expect(200);
    expect(res.headers['content-type']).toBe('application/fhir+json; charset=utf-8');
    expect(res.headers['content-disposition']).toBe(`attachment; filename="nestflow-${infant.id}.fhir.json"`);
    expect(res.headers['cache-control']).toBe('no-store');
    const bundle = JSON.parse(res.text) as Bundle;
    expect(fhirProblems(bundle)).toEqual([]);
    // The outer shape the API description declares for this answer.
    expect(fhirBundleSchema.safeParse(bundle).error).toBeUndefined();
    expect(bundle).toMatchObject({ resourceType: 'Bundle', type: 'collection', timestamp: NOW });

    const patient = resources(bundle).find((r) => r.resourceType === 'Patient') as fhir4.Patient;
    expect(patient.identifier).toEqual([{ use: 'usual', system: 'http://nestflow.test/fhir/sid/infant', value: infant.id }]);
    expect(patient.name?.[0].family).toBe(infant.familyName);
    const [spo2] = byCode(bundle, '59408-5');
    expect(spo2).toMatchObject({ effectiveDateTime: '2026-11-25T03:00:00.000Z', valueQuantity: { value: 94, code: '%' } });
    expect(spo2.component?.[0].valueQuantity).toMatchObject({ value: 0.25, code: 'L/min' });
    expect(byCode(bundle, '8867-4')[0].valueQuantity).toMatchObject({ value: 151, code: '/min' });
    const studies = byCode(bundle, 'overnight-summary');
    expect(studies.map((s) => s.identifier?.[0].value)).toEqual([upload.body.id]);
    const [study] = studies;
    expect(study.component?.length).toBeGreaterThan(5);

    const order = resources(bundle).find((r) => r.resourceType === 'MedicationRequest') as fhir4.MedicationRequest;
    expect(order.identifier?.[0].value).toBe(rx.id);
    expect(order.dosageInstruction?.map((d) => d.doseAndRate?.[0].rateQuantity?.value)).toEqual([rx.approvedFlowLpm, rx.approvedFlowLpm, rx.approvedFlowLpm]);
    expect(order.requester?.display).toBe(clinic.people.consultant.name);
  });

  it('when the only version is a proposal, then no order is exported (a proposal is not an order) and the Bundle is still valid', async () => {
    const clinic = await makeClinic(ctx.deps);
    const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
    const infant = (await post(coord, '/api/infants', enrolmentBody(clinic)).expect(201)).body;
    await runPendingConversions(ctx.deps, infant.id);
    const bundle = JSON.parse((await coord.get(`/api/infants/${infant.id}/fhir`).expect(200)).text) as Bundle;
    expect(resources(bundle).map((r) => r.resourceType)).not.toContain('MedicationRequest');
    expect(fhirProblems(bundle)).toEqual([]);
  });

  it('when the coordinator, the consultant or the admin exports, then 200, as on the record page', async () => {
    const { infant, clinic } = await approvedBaby(ctx.deps, ctx.app);
    for (const role of ['coordinator', 'consultant', 'admin'] as const) {
      const agent = await signedInAgent(ctx.app, clinic.people[role].email);
      await agent.get(`/api/infants/${infant.id}`).expect(200);
      await agent.get(`/api/infants/${infant.id}/fhir`).expect(200);
    }
  });

  it('when a family asks, even for their own baby whose record they may read, then 403: the export is for staff', async () => {
    const { infant, family, clinic } = await approvedBaby(ctx.deps, ctx.app);
    await family.get(`/api/infants/${infant.id}`).expect(200);
    const res = await family.get(`/api/infants/${infant.id}/fhir`).expect(403);
    expect(res.body.error).toMatchObject({ code: expect.any(String) });
    expect(res.body.error.requestId).toBeTruthy();
    const otherParent = await makeUser(ctx.deps, clinic.programme.id, 'family');
    await (await signedInAgent(ctx.app, otherParent.email)).get(`/api/infants/${infant.id}/fhir`).expect(403);
  });

  it('when another programme or a nurse off the caseload asks, then 404 as for the record; signed out 401; a bad id 400', async () => {
    const { infant, clinic } = await approvedBaby(ctx.deps, ctx.app);
    const elsewhere = await makeProgrammeWithStaff(ctx.deps);
    for (const role of ['coordinator', 'consultant', 'admin', 'nurse'] as const) {
      const agent = await signedInAgent(ctx.app, elsewhere.people[role].email);
      await agent.get(`/api/infants/${infant.id}`).expect(404);
      await agent.get(`/api/infants/${infant.id}/fhir`).expect(404);
    }
    const otherNurse = await signedInAgent(ctx.app, (await makeUser(ctx.deps, clinic.programme.id, 'nurse')).email);
    await otherNurse.get(`/api/infants/${infant.id}/fhir`).expect(404);
    await (await anonymousAgent(ctx.app)).get(`/api/infants/${infant.id}/fhir`).expect(401);
    const coord = await signedInAgent(ctx.app, clinic.people.coordinator.email);
    await coord.get('/api/infants/not-a-uuid/fhir').expect(400);
  });
});
