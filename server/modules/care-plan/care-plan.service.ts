import { subject } from '@casl/ability';
import type { AppAbility } from '@shared/auth/ability';
import { homeFlowsOf } from '@shared/clinical/journey-plan';
import { JOURNEY_PERIODS } from '@shared/schemas/journeys';
import { accessibleWhere } from '../../auth/casl-to-sql';
import { INFANT_ACL_COLUMNS } from '../../db/repositories/infants.repository';
import type { AppRepos } from '../../deps';
import { ForbiddenError, NotFoundError } from '../../lib/errors';
import { todayIn } from '../../lib/dates';
import { formatPhone } from '@shared/phone/phone';
import { renderCarePlanPdf, type CarePlanData } from './care-plan.pdf';

/** ASCII letters, digits and dashes only, so no name can break out of the Content-Disposition header. */
export function safeSlug(text: string): string {
  const slug = text.normalize('NFKD').replace(/[\u0300-\u036f]/g, '').toLowerCase()
    .replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 40).replace(/-+$/, '');
  return slug || 'baby';
}

export function createCarePlanService(repos: AppRepos) {
  return {
    /** The printable plan of the current approved setting; the same document for staff and the family. */
    async build(ability: AppAbility, infantId: string): Promise<{ filename: string; pdf: Buffer }> {
      const infant = await repos.infants.findVisible(infantId, accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS));
      if (!infant) throw new NotFoundError('No such baby in your records.');
      const rx = await repos.prescriptions.active(infant.id);
      if (!rx || rx.approvedFlowLpm === null) throw new NotFoundError('There is no approved plan to print yet.');
      const own = { programmeId: infant.programmeId, infantId: infant.id, nurseId: infant.nurseId };
      if (!ability.can('read', subject('Prescription', { ...own, status: rx.status } as Record<string, unknown>))) {
        throw new ForbiddenError('You cannot print this plan.');
      }
      const [programme, policy, contacts, names, site] = await Promise.all([
        repos.programmes.findById(infant.programmeId),
        repos.policies.current(infant.programmeId),
        repos.contacts.listForInfant(infant.id),
        repos.infants.peopleNames([rx.decidedBy]),
        repos.sites.findInProgramme(infant.siteId, infant.programmeId),
      ]);
      const timeZone = contacts[0]?.timeZone ?? programme?.timeZone ?? 'UTC';
      const today = todayIn(timeZone);
      const canSeeJourneys = ability.can('read', subject('Journey', own as Record<string, unknown>));
      const journey = canSeeJourneys ? await repos.journeys.currentApproved(infant.id, today) : null;
      const flows = homeFlowsOf(rx.approvedFlowLpm, rx.periods);
      const babyName = `${infant.givenName} ${infant.familyName}`;
      const targets = policy.settings.spo2Targets;

      const data: CarePlanData = {
        programmeName: programme?.name ?? '',
        hospitalName: site?.name ?? '',
        printedOn: today,
        baby: { name: babyName, birthDate: infant.birthDate },
        home: { elevationM: infant.homeElevationM, pressureMmHg: infant.homePressureMmHg, measured: 'pressureMmHg' in infant.homeLocation },
        setting: {
          periods: JOURNEY_PERIODS.map((period) => ({ period, flowLpm: flows[period] })),
          source: rx.source,
          o2Percent: rx.sourceO2Percent,
          approvedBy: rx.decidedBy ? names.get(rx.decidedBy) ?? '' : '',
          approvedOn: rx.decidedAt ? todayIn(timeZone, rx.decidedAt) : null,
        },
        // The figures the programme works to; with pulmonary hypertension the higher mean (see shared/schemas/policy.ts).
        spo2Target: {
          meanMin: infant.diagnoses.includes('pulmonary_hypertension') ? targets.pulmonaryHypertensionMeanMin : targets.overnightMeanMin,
          lowAtOrBelow: targets.spotLowMax,
        },
        // In the national form of the programme's country, as families there write numbers.
        phones: policy.settings.contacts.phones.map((p) => ({ ...p, number: formatPhone(p.number, policy.settings.country) })),
        emergencyNumber: policy.settings.contacts.emergencyNumber,
        family: contacts.map((c) => ({ name: c.name, relation: c.relation })),
        journey: journey && {
          destinationName: journey.destinationName, mode: journey.mode, departOn: journey.departOn, returnOn: journey.returnOn,
          hoursAway: journey.hoursAway, periods: journey.plan.periods.map((p) => ({ period: p.period, flowLpm: p.flowLpm })),
          cylinders: journey.plan.cylinders, cautions: journey.plan.cautions,
        },
      };
      return { filename: `care-plan-${safeSlug(babyName)}-${today}.pdf`, pdf: await renderCarePlanPdf(data) };
    },
  };
}
export type CarePlanService = ReturnType<typeof createCarePlanService>;
