import { randomUUID } from 'node:crypto';
import type { EnrolInfantInput } from '@shared/schemas/infants';
import type { AppDeps } from '../../server/deps';
import { computeProposal } from '../../server/modules/prescriptions/compute-proposal';
import { makeProgrammeWithStaff } from './factories';

export async function makeSite(deps: AppDeps, programmeId: string, elevationM = 95) {
  return deps.repos.sites.insert({ programmeId, name: `Test hospital ${randomUUID().slice(0, 6)}`, elevationM });
}

/** A programme with staff and a hospital site: the usual starting point of an enrolment test. */
export async function makeClinic(deps: AppDeps, siteElevationM = 95) {
  const base = await makeProgrammeWithStaff(deps);
  const site = await makeSite(deps, base.programme.id, siteElevationM);
  return { ...base, site };
}

type Clinic = Awaited<ReturnType<typeof makeClinic>>;

export function enrolmentBody(clinic: Clinic, overrides: Partial<{ weightKg: number; flowLpm: number; homeElevationM: number; familyEmail: string }> = {}): EnrolInfantInput {
  return {
    enrolKey: randomUUID(),
    baby: {
      givenName: 'Test', familyName: `Baby ${randomUUID().slice(0, 4)}`, sex: 'female', birthDate: '2026-08-01',
      gestation: { weeks: 27, days: 3 }, birthWeightG: 980, weightKg: overrides.weightKg ?? 3, weightDate: '2026-11-20', diagnoses: ['chronic_lung_disease'],
    },
    hospital: { siteId: clinic.site.id, flowLpm: overrides.flowLpm ?? 0.25, source: 'cylinder', o2Percent: 100 },
    home: { address: '1 Test Row, Cindermoor', location: { elevationM: overrides.homeElevationM ?? 1780 }, source: 'cylinder', o2Percent: 100 },
    care: { nurseId: clinic.people.nurse.id, consultantId: clinic.people.consultant.id },
    contacts: [{
      name: 'Parent One', relation: 'Mother', mobile: '+44 7700 900001', email: overrides.familyEmail ?? 'parent@test.example', preferredChannel: 'sms',
      consentSms: true, consentEmail: false, language: 'en', timeZone: 'Europe/London',
    }],
  };
}

/** Runs the worker's step for every pending proposal of a baby, as the worker would. */
export async function runPendingConversions(deps: AppDeps, infantId: string) {
  const rows: Array<{ id: string }> = await deps.ds.query(`SELECT id FROM prescriptions WHERE infant_id = $1 AND status = 'preparing'`, [infantId]);
  for (const r of rows) await computeProposal(deps.ds, deps.repos, r.id);
  return rows.map((r) => r.id);
}
