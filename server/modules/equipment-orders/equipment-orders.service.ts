import type { DataSource, EntityManager } from 'typeorm';
import { subject } from '@casl/ability';
import type { AppAbility } from '@shared/auth/ability';
import { UNCONFIRMED_STATUSES, type CreateOrderParsed, type OrderStatus, type OrdersQuery } from '@shared/schemas/equipment-orders';
import type { PolicySettings } from '@shared/schemas/policy';
import { accessibleWhere } from '../../auth/casl-to-sql';
import type { EquipmentOrderEntity } from '../../db/entities/equipment-order.entity';
import type { InfantEntity } from '../../db/entities/infant.entity';
import { INFANT_ACL_COLUMNS } from '../../db/repositories/infants.repository';
import { ORDER_ACL_COLUMNS } from '../../db/repositories/equipment-orders.repository';
import type { AppRepos } from '../../deps';
import { systemClock, type Clock } from '../../lib/clock';
import { todayIn } from '../../lib/dates';
import { ConflictError, NotFoundError, ValidationError } from '../../lib/errors';
import type { Actor } from '../../lib/http';
import type { Logger } from '../../lib/logger';
import type { MailSender } from '../../notifications/mail-sender';
import { historyEntry, toOrderDtos } from './orders.mapper';
import { mailCancellation, mailOrder, type LinkConfig } from './order-mail';
import { insertOrder } from './insert-order';

const own = (i: InfantEntity) => ({ programmeId: i.programmeId, infantId: i.id, nurseId: i.nurseId } as Record<string, unknown>);

/** Cylinder sizes must be the programme's own; an oximeter only if the programme lends one. */
function checkItems(input: CreateOrderParsed, settings: PolicySettings) {
  const ids = new Set(settings.supply.cylinders.map((c) => c.id));
  const errors: Record<string, string[]> = {};
  input.items.forEach((item, n) => {
    if (item.size && !ids.has(item.size)) errors[`items.${n}.size`] = ['Choose one of the programme’s cylinder sizes'];
    if (item.kind === 'oximeter' && !settings.supplier.lendsOximeter) errors[`items.${n}.kind`] = ['The programme does not lend oximeters (programme settings)'];
  });
  if (Object.keys(errors).length) throw new ValidationError(errors);
}

const cursorOf = (o: EquipmentOrderEntity) => Buffer.from(JSON.stringify([o.createdAt.toISOString(), o.id])).toString('base64url');
function readCursor(text: string | undefined) {
  if (!text) return undefined;
  try {
    const [createdAt, id] = JSON.parse(Buffer.from(text, 'base64url').toString('utf8')) as [string, string];
    if (Number.isNaN(Date.parse(createdAt)) || !/^[0-9a-f-]{36}$/.test(id)) throw new Error('bad');
    return { createdAt, id };
  } catch {
    throw new ValidationError({ after: ['This page link is not valid any more: start from the first page'] });
  }
}

export interface OrdersDeps { ds: DataSource; repos: AppRepos; mail: MailSender; link: LinkConfig; logger: Logger; clock?: Clock }

export function createEquipmentOrdersService({ ds, repos, mail, link, logger, clock = systemClock }: OrdersDeps) {
  async function visibleInfant(ability: AppAbility, infantId: string, m?: EntityManager) {
    const infant = await repos.infants.findVisible(infantId, accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS), m);
    if (!infant || !ability.can('read', subject('EquipmentOrder', own(infant)))) throw new NotFoundError('No such baby in your records.');
    return infant;
  }
  async function context(programmeId: string, m?: EntityManager) {
    const [programme, policy] = await Promise.all([repos.programmes.findById(programmeId), repos.policies.current(programmeId, m)]);
    return { programmeName: programme?.name ?? '', timeZone: programme?.timeZone ?? 'UTC', settings: policy.settings };
  }
  async function dto(o: EquipmentOrderEntity, infant: InfantEntity) {
    const { timeZone } = await context(o.programmeId);
    return (await toOrderDtos(repos, [o], todayIn(timeZone, clock.now()), `${infant.familyName}, ${infant.givenName}`))[0];
  }

  /** Locks the order and its baby; a caller who may not change it gets 404 like any record outside their reach. */
  async function lockOrder(ability: AppAbility, id: string, m: EntityManager) {
    const order = await repos.equipmentOrders.findForUpdate(id, m);
    const infant = order ? await repos.infants.findVisible(order.infantId, accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS), m) : null;
    if (!order || !infant || !ability.can('update', subject('EquipmentOrder', own(infant)))) throw new NotFoundError('No such order in your records.');
    return { order, infant };
  }

  /** Hands the order to the mail path and records the outcome; the row stays locked, so it is never e-mailed twice at once. */
  async function sendLocked(order: EquipmentOrderEntity, infant: InfantEntity, actor: Actor, m: EntityManager) {
    const { settings, programmeName } = await context(order.programmeId, m);
    const now = clock.now();
    const audit = (sent: boolean, details: Record<string, unknown>) => repos.audit.append({
      programmeId: order.programmeId, actorId: actor.id, action: sent ? 'equipment_order.sent' : 'equipment_order.send_failed', entityType: 'infant',
      entityId: order.infantId, ip: actor.ip, details: { orderId: order.id, reference: order.reference, ...details },
    }, m);
    try {
      if (!settings.supplier.orderEmail) throw new Error('The programme settings have no supplier order address');
      const { to } = await mailOrder(mail, link, order, infant, settings, programmeName);
      Object.assign(order, { status: 'sent', supplierEmail: to, failureReason: null, history: [...order.history, historyEntry('sent', now, actor.id, 'staff', `to ${to}`)] });
      await audit(true, { to });
    } catch (err) {
      const reason = (err instanceof Error ? err.message : String(err)).slice(0, 300);
      logger.warn('equipment order not sent', { orderId: order.id, err: reason });
      Object.assign(order, { status: 'failed', failureReason: reason, history: [...order.history, historyEntry('failed', now, actor.id, 'staff', reason)] });
      await audit(false, { reason });
    }
    order.rowVersion += 1;
    await repos.equipmentOrders.save(order, m);
  }

  return {
    async create(ability: AppAbility, actor: Actor, infantId: string, input: CreateOrderParsed) {
      return ds.transaction(async (m) => {
        const infant = await visibleInfant(ability, infantId, m);
        if (!ability.can('create', subject('EquipmentOrder', own(infant)))) throw new NotFoundError('No such baby in your records.');
        const { settings, timeZone } = await context(infant.programmeId, m);
        checkItems(input, settings);
        if (input.neededBy < todayIn(timeZone, clock.now())) throw new ValidationError({ neededBy: ['The date needed cannot be in the past'] });
        const order = await insertOrder(repos, m, infant, {
          purpose: input.purpose, items: input.items, neededBy: input.neededBy, deliveryAddress: input.deliveryAddress ?? infant.homeAddress,
          note: input.note ?? null, automaticReason: null,
        }, { id: actor.id, ip: actor.ip, kind: 'staff' }, clock.now());
        if (input.send) await sendLocked(order, infant, actor, m);
        return dto(order, infant);
      });
    },

    async send(ability: AppAbility, actor: Actor, id: string) {
      return ds.transaction(async (m) => {
        const { order, infant } = await lockOrder(ability, id, m);
        if (order.status !== 'drafted' && order.status !== 'failed') throw new ConflictError(`This order is already ${order.status}.`);
        await sendLocked(order, infant, actor, m);
        return dto(order, infant);
      });
    },

    async cancel(ability: AppAbility, actor: Actor, id: string, reason: string) {
      const { order, infant, tell } = await ds.transaction(async (m) => {
        const { order, infant } = await lockOrder(ability, id, m);
        if (order.status === 'delivered' || order.status === 'cancelled') throw new ConflictError(`This order is already ${order.status}.`);
        const tell = order.status === 'sent' || order.status === 'confirmed';
        Object.assign(order, { status: 'cancelled', rowVersion: order.rowVersion + 1, history: [...order.history, historyEntry('cancelled', clock.now(), actor.id, 'staff', reason)] });
        await repos.equipmentOrders.save(order, m);
        await repos.audit.append({ programmeId: order.programmeId, actorId: actor.id, action: 'equipment_order.cancelled', entityType: 'infant', entityId: order.infantId, ip: actor.ip,
          details: { orderId: order.id, reference: order.reference, reason } }, m);
        return { order, infant, tell };
      });
      // The supplier already has it: tell them (the link now shows it cancelled, whatever happens to this e-mail).
      if (tell) {
        const { settings, programmeName } = await context(order.programmeId);
        await mailCancellation(mail, order, settings, programmeName).catch((e: unknown) => logger.warn('order cancellation not e-mailed', { orderId: order.id, err: (e as Error)?.message }));
      }
      return dto(order, infant);
    },

    async listForInfant(ability: AppAbility, infantId: string) {
      const infant = await visibleInfant(ability, infantId);
      const { timeZone } = await context(infant.programmeId);
      const rows = await repos.equipmentOrders.forInfant(infant.id);
      return { items: await toOrderDtos(repos, rows, todayIn(timeZone, clock.now()), `${infant.familyName}, ${infant.givenName}`) };
    },

    async list(ability: AppAbility, programmeId: string, q: OrdersQuery) {
      const { timeZone } = await context(programmeId);
      const today = todayIn(timeZone, clock.now());
      const statuses: readonly OrderStatus[] | undefined = q.status === 'open' ? ['drafted', 'sent', 'failed', 'confirmed']
        : q.status === 'overdue' ? UNCONFIRMED_STATUSES : q.status ? [q.status] : undefined;
      const rows = await repos.equipmentOrders.list(accessibleWhere(ability, 'read', 'EquipmentOrder', ORDER_ACL_COLUMNS), {
        statuses, neededOnOrBefore: q.status === 'overdue' ? today : undefined, after: readCursor(q.after), limit: q.pageSize + 1,
      });
      const page = rows.slice(0, q.pageSize);
      return { items: await toOrderDtos(repos, page, today), next: rows.length > q.pageSize ? cursorOf(page[page.length - 1]) : null };
    },
  };
}
export type EquipmentOrdersService = ReturnType<typeof createEquipmentOrdersService>;
