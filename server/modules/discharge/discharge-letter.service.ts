import { subject } from '@casl/ability';
import type { AppAbility } from '@shared/auth/ability';
import { homeFlowsOf } from '@shared/clinical/journey-plan';
import { JOURNEY_PERIODS } from '@shared/schemas/journeys';
import { formatPhone } from '@shared/phone/phone';
import { missingForDischarge, sortByGroup } from '@shared/discharge/readiness';
import { withOrderTicks } from '@shared/discharge/order-ticks';
import { accessibleWhere } from '../../auth/casl-to-sql';
import { INFANT_ACL_COLUMNS } from '../../db/repositories/infants.repository';
import type { AppRepos } from '../../deps';
import type { MailSender } from '../../notifications/mail-sender';
import { ConflictError, ForbiddenError, NotFoundError, ServiceUnavailableError } from '../../lib/errors';
import type { Actor } from '../../lib/http';
import { todayIn } from '../../lib/dates';
import { systemClock, type Clock } from '../../lib/clock';
import { safeSlug } from '../care-plan/care-plan.service';
import { fieldsOf } from './discharge.service';
import { renderDischargeLetterPdf, type DischargeLetterData } from './discharge-letter.pdf';
import { orderTicksFor } from './order-ticks';
import { firstHomeVisit } from './first-visit';

export function createDischargeLetterService(repos: AppRepos, mail: MailSender, clock: Clock = systemClock) {
  async function build(ability: AppAbility, infantId: string, timeZone: string) {
    const infant = await repos.infants.findVisible(infantId, accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS));
    if (!infant || !ability.can('read', subject('Discharge', fieldsOf(infant)))) throw new NotFoundError('No such baby in your records.');
    // The letter is the team's: families read their own care plan instead.
    if (!ability.can('read', subject('Prescription', { ...fieldsOf(infant), status: 'proposed' } as Record<string, unknown>))) throw new ForbiddenError('The discharge letter is for the care team.');
    const rx = await repos.prescriptions.active(infant.id);
    // Only an approved setting is ever written as the setting: without one there is no letter.
    if (!rx || rx.approvedFlowLpm === null) throw new ConflictError('There is no approved setting yet: a consultant must approve one before the letter can be written.');
    const [programme, policy, site, states, step] = await Promise.all([
      repos.programmes.findById(infant.programmeId), repos.policies.current(infant.programmeId),
      repos.sites.findInProgramme(infant.siteId, infant.programmeId), repos.discharges.itemsFor(infant.id), repos.discharges.stepFor(infant.id),
    ]);
    const names = await repos.infants.peopleNames([rx.decidedBy, infant.nurseId, infant.consultantId, step?.setBy ?? null]);
    const name = (id: string | null) => (id ? names.get(id) ?? '' : '');
    const today = todayIn(timeZone, clock.now());
    const flows = homeFlowsOf(rx.approvedFlowLpm, rx.periods);
    const rules = policy.settings.discharge.items;
    const ticks = await orderTicksFor(repos, infant, step?.dischargedOn ?? null);
    const missing = new Set(missingForDischarge(rules, withOrderTicks(states, ticks), true));
    const visit = step?.dischargedOn && step.firstVisitOn ? await firstHomeVisit(repos, infant.id, step.dischargedOn) : null;
    const t = policy.settings.spo2Targets;
    const babyName = `${infant.givenName} ${infant.familyName}`;
    const data: DischargeLetterData = {
      programmeName: programme?.name ?? '', hospitalName: site?.name ?? '', printedOn: today,
      baby: { name: babyName, birthDate: infant.birthDate, address: infant.homeAddress },
      team: { nurse: name(infant.nurseId), consultant: name(infant.consultantId) },
      dischargedOn: step?.dischargedOn ?? null,
      override: step?.dischargedOn && step.overrideReason ? { reason: step.overrideReason, by: name(step.setBy) } : null,
      setting: {
        periods: JOURNEY_PERIODS.map((period) => ({ period, flowLpm: flows[period] })), source: rx.source, o2Percent: rx.sourceO2Percent,
        approvedBy: name(rx.decidedBy), approvedOn: rx.decidedAt ? todayIn(timeZone, rx.decidedAt) : null,
      },
      targets: { ...t, pulmonaryHypertension: infant.diagnoses.includes('pulmonary_hypertension') },
      checks: policy.settings.schedule,
      firstVisit: step?.firstVisitOn ? { on: visit?.on ?? step.firstVisitOn, booked: !!visit } : null,
      notDone: sortByGroup(rules.filter((r) => missing.has(r.key))).map((r) => ({ group: r.group, label: r.label })),
      phones: policy.settings.contacts.phones.map((p) => ({ ...p, number: formatPhone(p.number, policy.settings.country) })),
      emergencyNumber: policy.settings.contacts.emergencyNumber,
    };
    return { infant, babyName, filename: `discharge-letter-${safeSlug(babyName)}-${today}.pdf`, pdf: await renderDischargeLetterPdf(data) };
  }

  return {
    build: async (ability: AppAbility, infantId: string, timeZone: string) => {
      const { filename, pdf } = await build(ability, infantId, timeZone);
      return { filename, pdf };
    },

    /** Sends the letter to the address the coordinator typed, the PDF attached; audited once handed to the mail server. */
    async email(ability: AppAbility, actor: Actor & { timeZone: string }, infantId: string, to: string) {
      const { infant, babyName, filename, pdf } = await build(ability, infantId, actor.timeZone);
      if (!ability.can('update', subject('Discharge', fieldsOf(infant)))) throw new ForbiddenError('You cannot send this baby’s discharge letter.');
      const programme = await repos.programmes.findById(infant.programmeId);
      try {
        await mail.send({
          to, subject: `Home oxygen discharge letter: ${babyName}`,
          text: `Please find attached the home oxygen discharge letter for ${babyName} from ${programme?.name ?? 'the home oxygen programme'}.\n\nThe setting in it was approved by a consultant; local protocols apply.`,
          attachments: [{ filename, content: pdf, contentType: 'application/pdf' }],
        });
      } catch {
        throw new ServiceUnavailableError('The letter could not be sent just now. Nothing was sent; try again in a moment.');
      }
      await repos.audit.append({
        programmeId: infant.programmeId, actorId: actor.id, action: 'discharge.letter_emailed', entityType: 'infant', entityId: infant.id, ip: actor.ip,
        details: { to, filename },
      });
      return { sentTo: to, filename };
    },
  };
}
export type DischargeLetterService = ReturnType<typeof createDischargeLetterService>;
