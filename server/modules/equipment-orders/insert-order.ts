import type { EntityManager } from 'typeorm';
import type { OrderItem, OrderPurpose } from '@shared/schemas/equipment-orders';
import type { InfantEntity } from '../../db/entities/infant.entity';
import type { AppRepos } from '../../deps';
import { historyEntry } from './orders.mapper';

export interface NewOrder {
  purpose: OrderPurpose; items: OrderItem[]; neededBy: string; deliveryAddress: string; note: string | null; automaticReason: string | null;
}

/** Writes a drafted order with the programme's next reference ("EQ-00042") and audits it, in the caller's transaction. */
export async function insertOrder(repos: AppRepos, m: EntityManager, infant: InfantEntity, o: NewOrder, by: { id: string | null; ip: string | null; kind: 'staff' | 'system' }, now: Date) {
  const seq = await repos.equipmentOrders.nextSeq(infant.programmeId, m);
  const reference = `EQ-${String(seq).padStart(5, '0')}`;
  const order = await repos.equipmentOrders.insert({
    programmeId: infant.programmeId, infantId: infant.id, seq, reference, purpose: o.purpose, status: 'drafted', items: o.items, neededBy: o.neededBy,
    deliveryAddress: o.deliveryAddress, note: o.note, automaticReason: o.automaticReason, rowVersion: 1, createdBy: by.id,
    history: [historyEntry('drafted', now, by.id, by.kind, o.automaticReason)],
  }, m);
  await repos.audit.append({
    programmeId: infant.programmeId, actorId: by.id, action: 'equipment_order.drafted', entityType: 'infant', entityId: infant.id, ip: by.ip,
    details: { orderId: order.id, reference, purpose: o.purpose, neededBy: o.neededBy, automatic: o.automaticReason !== null, reason: o.automaticReason },
  }, m);
  return order;
}
