import { agesAt, formatCorrectedAge, formatWeeksPlusDays } from '@shared/clinical/ages';
import type { InfantDetail, InfantSummary, InfantStatus, InfantFlag } from '@shared/schemas/infants';
import type { FamilyContactEntity } from '../../db/entities/family-contact.entity';
import type { InfantEntity } from '../../db/entities/infant.entity';
import type { PrescriptionEntity } from '../../db/entities/prescription.entity';
import type { InfantListRow } from '../../db/repositories/infants.repository';
import type { SiteEntity } from '../../db/entities/site.entity';

export const correctedAgeText = (birthDate: string, weeks: number, days: number, today: string) => {
  try {
    return formatCorrectedAge(agesAt({ birthDate, gestationAtBirth: { weeks, days }, atDate: today }).corrected);
  } catch {
    return 'not yet born';
  }
};

const num = (v: string | number | null) => (v === null ? null : Number(v));

export function toSummary(row: InfantListRow, today: string): InfantSummary {
  return {
    id: row.id,
    name: `${row.given_name} ${row.family_name}`,
    correctedAge: correctedAgeText(row.birth_date, row.ga_weeks, row.ga_days, today),
    homeElevationM: num(row.home_elevation_m),
    homePressureMmHg: Number(row.home_pressure_mmhg),
    activeFlowLpm: num(row.active_flow_lpm),
    status: row.status as InfantStatus,
    nurse: row.nurse_id ? { id: row.nurse_id, name: row.nurse_name ?? '' } : null,
    consultant: row.consultant_id ? { id: row.consultant_id, name: row.consultant_name ?? '' } : null,
    flags: row.flags as InfantFlag[],
  };
}

export function activeSetting(rx: PrescriptionEntity | null) {
  if (!rx || rx.approvedFlowLpm === null) return null;
  return {
    prescriptionId: rx.id, version: rx.version, flowLpm: rx.approvedFlowLpm, source: rx.source, sourceO2Percent: rx.sourceO2Percent,
    effectiveFio2: rx.approvedFio2, periods: rx.periods, approvedAt: rx.decidedAt ? rx.decidedAt.toISOString() : null,
  };
}

export function toDetail(
  i: InfantEntity, site: SiteEntity, contacts: FamilyContactEntity[], active: PrescriptionEntity | null,
  names: Map<string, string>, today: string,
): InfantDetail {
  const ages = agesAt({ birthDate: i.birthDate, gestationAtBirth: { weeks: i.gaWeeks, days: i.gaDays }, atDate: today < i.birthDate ? i.birthDate : today });
  return {
    id: i.id, name: `${i.givenName} ${i.familyName}`, givenName: i.givenName, familyName: i.familyName, sex: i.sex,
    birthDate: i.birthDate, gestation: { weeks: i.gaWeeks, days: i.gaDays },
    correctedAge: formatCorrectedAge(ages.corrected),
    postmenstrualAge: formatWeeksPlusDays(ages.postmenstrual),
    chronologicalAge: `${ages.chronological.weeks} wk ${ages.chronological.days} d`,
    birthWeightG: i.birthWeightG, weightKg: i.weightKg, weightDate: i.weightDate, diagnoses: i.diagnoses as InfantDetail['diagnoses'],
    site: { id: site.id, name: site.name, elevationM: site.elevationM },
    hospital: { flowLpm: i.hospitalFlowLpm, source: i.hospitalSource, o2Percent: i.hospitalO2Percent },
    home: { address: i.homeAddress, location: i.homeLocation as unknown as Record<string, number>, source: i.homeSource, o2Percent: i.homeO2Percent },
    homeElevationM: i.homeElevationM, homePressureMmHg: i.homePressureMmHg,
    activeFlowLpm: active?.approvedFlowLpm ?? null,
    activeSetting: activeSetting(active),
    status: i.status, flags: i.flags,
    nurse: i.nurseId ? { id: i.nurseId, name: names.get(i.nurseId) ?? '' } : null,
    consultant: i.consultantId ? { id: i.consultantId, name: names.get(i.consultantId) ?? '' } : null,
    contacts: contacts.map((c) => ({
      id: c.id, name: c.name, relation: c.relation, mobile: c.mobile, email: c.email, preferredChannel: c.preferredChannel,
      consentSms: c.consentSms, consentEmail: c.consentEmail, language: c.language, timeZone: c.timeZone,
    })),
    rowVersion: i.rowVersion,
    enrolledAt: i.createdAt.toISOString(),
  };
}
