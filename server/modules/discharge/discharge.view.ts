import type { Discharge, DischargeItem } from '@shared/schemas/discharge';
import type { DischargeItemRule } from '@shared/schemas/discharge-policy';
import { familyItems, missingForDischarge, sortByGroup } from '@shared/discharge/readiness';
import { withOrderTicks, type OrderTick } from '@shared/discharge/order-ticks';
import type { DischargeEntity, DischargeItemEntity } from '../../db/entities/discharge.entity';
import type { FirstHomeVisit } from './first-visit';

export interface ViewFacts {
  rules: readonly DischargeItemRule[];
  states: readonly DischargeItemEntity[];
  step: DischargeEntity | null;
  settingApproved: boolean;
  names: Map<string, string>;
  /** The home visit booked on or after the discharge date, answering the proposed first visit. */
  firstVisit: FirstHomeVisit | null;
  /** Items the baby's equipment orders have done; a hand tick of the same item stands instead. */
  orderTicks: readonly OrderTick[];
}

const person = (id: string | null, names: Map<string, string>) => (id ? { id, name: names.get(id) ?? '' } : null);

/** The staff view: every item of the programme's checklist with what is stored for it, in group order. */
export function staffView(f: ViewFacts): Discharge {
  const byKey = new Map(f.states.map((s) => [s.key, s]));
  const ticks = new Map(f.orderTicks.map((t) => [t.key, t]));
  const items: DischargeItem[] = sortByGroup(f.rules).map((r) => {
    const s = byKey.get(r.key);
    const tick = s?.done ? undefined : ticks.get(r.key);
    if (tick) {
      return {
        key: r.key, label: r.label, group: r.group, evidenceNeeded: [...r.evidence], source: r.source, done: true, doneBy: null, doneAt: tick.at,
        note: s?.note ?? '', evidence: r.evidence.includes('date') ? { date: tick.on } : null,
        byOrder: { event: tick.event, orderId: tick.orderId, reference: tick.reference, status: tick.status, on: tick.on },
      };
    }
    return {
      key: r.key, label: r.label, group: r.group, evidenceNeeded: [...r.evidence], source: r.source,
      done: s?.done ?? false, doneBy: s?.done ? person(s.doneBy, f.names) : null, doneAt: s?.done && s.doneAt ? s.doneAt.toISOString() : null,
      note: s?.note ?? '', evidence: s?.done ? s.evidence : null, byOrder: null,
    };
  });
  const missing = missingForDischarge(f.rules, withOrderTicks(f.states, f.orderTicks), f.settingApproved);
  const step = f.step;
  return {
    items, ready: missing.length === 0, missing, settingApproved: f.settingApproved, dischargedOn: step?.dischargedOn ?? null,
    override: step?.dischargedOn && step.overrideReason
      ? { reason: step.overrideReason, by: person(step.setBy, f.names), missing: step.overrideMissing } : null,
    firstVisit: step?.firstVisitOn
      ? { proposedOn: step.firstVisitOn, bookedVisitId: f.firstVisit?.id ?? null, visitOn: f.firstVisit?.on ?? null }
      : null,
  };
}

/**
 * The family's view: only the training and home-safety items marked for them, in their plain words, without
 * who ticked them, notes, evidence or anything about equipment, orders, follow-up work or letters.
 */
export function familyView(f: ViewFacts): Discharge {
  const staff = staffView(f);
  const mine = familyItems(f.rules);
  const done = new Map(staff.items.map((i) => [i.key, i]));
  const items: DischargeItem[] = mine.map((r) => ({
    key: r.key, label: r.familyLabel, group: r.group, evidenceNeeded: [], source: '',
    done: done.get(r.key)?.done ?? false, doneBy: null, doneAt: done.get(r.key)?.doneAt ?? null, note: '', evidence: null,
  }));
  const keys = new Set(mine.map((r) => r.key));
  return {
    items, ready: staff.ready, missing: staff.missing.filter((k) => keys.has(k)), settingApproved: staff.settingApproved,
    dischargedOn: staff.dischargedOn, override: null, firstVisit: staff.firstVisit,
  };
}
