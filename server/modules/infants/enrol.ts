import { weightWarnings } from '@shared/clinical/weight-check';
import type { DataSource, EntityManager } from 'typeorm';
import { resolvePressure } from '@shared/clinical/pressure';
import { addDays } from '@shared/clinical/dates';
import { TERM_DAYS } from '@shared/clinical/ages';
import type { EnrolInfantInput } from '@shared/schemas/infants';
import type { PolicySettings } from '@shared/schemas/policy';
import type { PressureSource } from '@shared/clinical/pressure';
import type { AppRepos } from '../../deps';
import { NeedsConfirmationError, ValidationError, type FieldErrors } from '../../lib/errors';
import type { Actor } from '../../lib/http';
import { openProposal } from '../prescriptions/proposals';

export const termDateFor = (birthDate: string, weeks: number, days: number) =>
  addDays(birthDate, Math.max(0, TERM_DAYS - (weeks * 7 + days)));

export function homePlace(location: PressureSource, policy: PolicySettings) {
  const resolved = resolvePressure(location, policy.pressureModel);
  return { homePressureMmHg: Math.round(resolved.pressureMmHg * 100) / 100, homeElevationM: resolved.elevationM };
}

/** Checks that need the database or the programme's calendar day; field-level shape is checked by the schema. */
export async function checkEnrolment(repos: AppRepos, actor: Actor, input: EnrolInfantInput, today: string, m?: EntityManager) {
  const errors: FieldErrors = {};
  const { baby, hospital, care } = input;
  if (baby.birthDate > today) errors['baby.birthDate'] = ['The birth date is in the future'];
  if (baby.weightDate > today) errors['baby.weightDate'] = ['The weighing date is in the future'];
  if (baby.weightDate < baby.birthDate) errors['baby.weightDate'] = ['The weighing date is before the birth date'];
  const site = await repos.sites.findInProgramme(hospital.siteId, actor.programmeId, m);
  if (!site) errors['hospital.siteId'] = ['Choose one of your programme’s hospital sites'];
  const people = await repos.users.findInProgramme([care.nurseId, care.consultantId], actor.programmeId);
  const role = (id: string) => people.find((p) => p.id === id && !p.disabled)?.role;
  if (role(care.nurseId) !== 'nurse') errors['care.nurseId'] = ['Choose a home-care nurse of your programme'];
  if (role(care.consultantId) !== 'consultant') errors['care.consultantId'] = ['Choose a consultant of your programme'];
  if (Object.keys(errors).length) throw new ValidationError(errors);
  // The birth weight counts as the previous weight when the baby is under two weeks old.
  const warnings = weightWarnings(baby.weightKg, baby.weightDate, { kg: baby.birthWeightG / 1000, date: baby.birthDate });
  if (warnings.length && !baby.weightConfirmed) throw new NeedsConfirmationError('Check the weight before saving.', { 'baby.weightKg': warnings });
  return site!;
}

/** Enrols a baby with contacts and opens the first proposal, all in one transaction; replays return the same baby. */
export async function enrolInfant(ds: DataSource, repos: AppRepos, actor: Actor, input: EnrolInfantInput, today: string) {
  const existing = await repos.infants.findByEnrolKey(actor.programmeId, input.enrolKey);
  if (existing) return { infant: existing, created: false, prescriptionId: null };
  await checkEnrolment(repos, actor, input, today);
  const policy = await repos.policies.current(actor.programmeId);
  const { baby, hospital, home, care } = input;
  return ds.transaction(async (m) => {
    const infant = await repos.infants.insert(
      {
        programmeId: actor.programmeId, enrolKey: input.enrolKey, givenName: baby.givenName, familyName: baby.familyName, sex: baby.sex,
        birthDate: baby.birthDate, gaWeeks: baby.gestation.weeks, gaDays: baby.gestation.days,
        termDate: termDateFor(baby.birthDate, baby.gestation.weeks, baby.gestation.days),
        birthWeightG: baby.birthWeightG, weightKg: baby.weightKg, weightDate: baby.weightDate, diagnoses: baby.diagnoses,
        siteId: hospital.siteId, hospitalFlowLpm: hospital.flowLpm, hospitalO2Percent: hospital.o2Percent, hospitalSource: hospital.source,
        homeSource: home.source, homeO2Percent: home.o2Percent, homeAddress: home.address, homeLocation: home.location,
        ...homePlace(home.location, policy.settings),
        nurseId: care.nurseId, consultantId: care.consultantId, status: 'preparing', flags: [], rowVersion: 1, createdBy: actor.id,
      },
      m,
    );
    await repos.contacts.replace(infant.id, actor.programmeId, input.contacts, m);
    await repos.contacts.linkFamilyAccounts(infant.id, actor.programmeId, m);
    await repos.audit.append({ programmeId: actor.programmeId, actorId: actor.id, action: 'infant.enrolled', entityType: 'infant', entityId: infant.id, ip: actor.ip }, m);
    const rx = await openProposal(repos, infant, 'enrolment', actor.id, m);
    await repos.infants.save(infant, m);
    return { infant, created: true, prescriptionId: rx.id as string | null };
  }).catch(async (e: { code?: string }) => {
    // Two submits of the same form racing: the unique enrol key lets one in; the other returns it.
    if (e.code === '23505') {
      const again = await repos.infants.findByEnrolKey(actor.programmeId, input.enrolKey);
      if (again) return { infant: again, created: false, prescriptionId: null };
    }
    throw e;
  });
}
