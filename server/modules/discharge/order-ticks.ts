import type { EntityManager } from 'typeorm';
import { ticksFromOrders, type OrderTick } from '@shared/discharge/order-ticks';
import type { AppRepos } from '../../deps';
import { todayIn } from '../../lib/dates';

/**
 * The checklist items the baby's equipment orders have done, against a discharge date (the one set, or the one
 * being set): days are the programme's, like every other date on the record.
 */
export async function orderTicksFor(repos: AppRepos, infant: { id: string; programmeId: string }, dischargedOn: string | null, m?: EntityManager): Promise<OrderTick[]> {
  const [orders, programme] = await Promise.all([repos.equipmentOrders.forInfant(infant.id, m), repos.programmes.findById(infant.programmeId)]);
  const timeZone = programme?.timeZone ?? 'UTC';
  const dayOf = (iso: string) => todayIn(timeZone, new Date(iso));
  return ticksFromOrders(orders.map((o) => ({
    id: o.id, reference: o.reference, purpose: o.purpose, status: o.status,
    sentAt: o.history.find((h) => h.status === 'sent')?.at ?? null,
    deliveredAt: o.deliveredAt ? o.deliveredAt.toISOString() : null,
    deliveredOn: o.deliveredAt ? todayIn(timeZone, o.deliveredAt) : null,
  })), dischargedOn, dayOf);
}
