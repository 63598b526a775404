import { UNCONFIRMED_STATUSES, type EquipmentOrder, type OrderFlag } from '@shared/schemas/equipment-orders';
import type { EquipmentOrderEntity, StoredHistoryEntry } from '../../db/entities/equipment-order.entity';
import type { AppRepos } from '../../deps';

/** Flags the coordinator must see: the e-mail failed, the supplier has not confirmed by the date needed, or will come too late. */
export function orderFlags(o: Pick<EquipmentOrderEntity, 'status' | 'neededBy' | 'deliveryOn'>, today: string): OrderFlag[] {
  const flags: OrderFlag[] = [];
  if (o.status === 'failed') flags.push('send_failed');
  if (UNCONFIRMED_STATUSES.includes(o.status) && o.neededBy <= today) flags.push('unconfirmed_by_needed_date');
  if (o.status === 'confirmed' && o.deliveryOn !== null && o.deliveryOn > o.neededBy) flags.push('delivery_after_needed_date');
  return flags;
}

export const historyEntry = (status: StoredHistoryEntry['status'], at: Date, by: string | null, byKind: StoredHistoryEntry['byKind'], note: string | null = null): StoredHistoryEntry =>
  ({ status, at: at.toISOString(), by, byKind, note });

export async function toOrderDtos(repos: AppRepos, rows: Array<EquipmentOrderEntity & { infantName?: string }>, today: string, infantName = ''): Promise<EquipmentOrder[]> {
  const ids = rows.flatMap((o) => o.history.filter((h) => h.byKind === 'staff').map((h) => h.by));
  const names = await repos.infants.peopleNames(ids);
  const who = (h: StoredHistoryEntry) => (h.byKind === 'supplier' ? 'Supplier' : h.byKind === 'system' ? 'Nestflow' : names.get(h.by ?? '') ?? 'someone no longer listed');
  return rows.map((o) => ({
    id: o.id, infantId: o.infantId, infantName: o.infantName ?? infantName, reference: o.reference, purpose: o.purpose, status: o.status,
    items: o.items, neededBy: o.neededBy, deliveryAddress: o.deliveryAddress, note: o.note, supplierEmail: o.supplierEmail, deliveryOn: o.deliveryOn,
    deliveredAt: o.deliveredAt ? o.deliveredAt.toISOString() : null, failureReason: o.failureReason, automaticReason: o.automaticReason,
    flags: orderFlags(o, today), history: o.history.map((h) => ({ status: h.status, at: h.at, by: who(h), note: h.note })), createdAt: o.createdAt.toISOString(),
  }));
}
