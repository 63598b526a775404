import type { EntityManager } from 'typeorm';
import type { OrderItem } from '@shared/schemas/equipment-orders';
import type { EquipmentOrderEntity } from '../../db/entities/equipment-order.entity';
import type { InfantEntity } from '../../db/entities/infant.entity';
import type { PrescriptionEntity } from '../../db/entities/prescription.entity';
import type { AppRepos } from '../../deps';
import { todayIn } from '../../lib/dates';
import { insertOrder } from './insert-order';
import { addDays } from '@shared/clinical/dates';
import { concentratorCovers, settingFlowRange } from '@shared/equipment/concentrator-fit';

// Lead times for automatic drafts (common practice: a collection within a week; a different concentrator within two
// days). The coordinator reads, changes or cancels the draft before it goes anywhere; nothing is sent automatically.
const COLLECTION_DAYS = 7;
const CHANGE_DAYS = 2;
const OPEN = ['drafted', 'sent', 'failed', 'confirmed'];

/** What is at the home: delivered orders since the last delivered collection (oldest first in, newest wins). */
export function installedEquipment(orders: readonly EquipmentOrderEntity[]) {
  const delivered = orders.filter((o) => o.status === 'delivered').sort((a, b) => a.deliveredAt!.getTime() - b.deliveredAt!.getTime());
  const lastCollection = delivered.map((o) => o.purpose).lastIndexOf('collection');
  const since = delivered.slice(lastCollection + 1);
  const concentrator = [...since].reverse().flatMap((o) => o.items).find((i) => i.kind === 'concentrator') ?? null;
  return { items: since.flatMap((o) => o.items), concentrator };
}

/**
 * Called inside the approval's transaction. When the baby comes off oxygen, drafts the collection of what is at home;
 * when the new setting is outside the installed concentrator's range, drafts a change. At most one open draft of each.
 */
export async function draftAfterApproval(repos: AppRepos, m: EntityManager, infant: InfantEntity, rx: PrescriptionEntity, wasOffOxygen: boolean, now: Date) {
  const orders = await repos.equipmentOrders.forInfant(infant.id, m);
  const { items, concentrator } = installedEquipment(orders);
  if (!items.length) return null;
  const openOf = (purpose: string) => orders.some((o) => o.purpose === purpose && OPEN.includes(o.status));
  const offNow = infant.status === 'off_oxygen' || infant.status === 'left_programme';
  const draft = async (purpose: 'collection' | 'change', list: OrderItem[], days: number, reason: string) => {
    // "Needed by" counts days from today where the family lives (the programme's zone), like an order made by hand.
    const programme = await repos.programmes.findById(infant.programmeId);
    const today = todayIn(programme?.timeZone ?? 'UTC', now);
    return insertOrder(repos, m, infant, { purpose, items: list, neededBy: addDays(today, days), deliveryAddress: infant.homeAddress, note: null, automaticReason: reason },
      { id: null, ip: null, kind: 'system' }, now);
  };

  if (offNow && !wasOffOxygen) {
    if (openOf('collection')) return null;
    const collect = items.filter((i) => i.kind !== 'spares').map((i) => ({ ...i, note: undefined }));
    if (!collect.length) return null;
    return draft('collection', collect, COLLECTION_DAYS, `The baby came off oxygen (setting version ${rx.version} approved): collect the equipment`);
  }
  const need = settingFlowRange(rx.approvedFlowLpm, rx.periods);
  if (!concentrator || !need || concentratorCovers(concentrator, need) !== false) return null;
  const { low, high } = need;
  if (openOf('change')) return null;
  return draft('change', [{ kind: 'concentrator', quantity: 1, flowMinLpm: low, flowMaxLpm: high }], CHANGE_DAYS,
    `The approved setting (version ${rx.version}, ${low === high ? `${low}` : `${low}–${high}`} L/min) is outside the installed concentrator's range ${concentrator.flowMinLpm}–${concentrator.flowMaxLpm} L/min`);
}
