import { describe, expect, it } from 'vitest';
import { ticksFromOrders, withOrderTicks, type OrderFact } from '../../../shared/discharge/order-ticks';

// The rule under test is Nestflow's own (common practice): equipment counts as ordered once the supplier has the
// order, and as installed once delivered, on or before the discharge date.
const order = (over: Partial<OrderFact>): OrderFact => ({
  id: 'a', reference: 'EQ-1', purpose: 'delivery', status: 'sent', sentAt: '2026-12-01T10:00:00.000Z', deliveredAt: null, deliveredOn: null, ...over,
});
const day = (iso: string) => iso.slice(0, 10);

describe('ticksFromOrders', () => {
  it('ticks "ordered" from the earliest order with the supplier, never a draft, failed, cancelled or collection order', () => {
    const ticks = ticksFromOrders([
      order({ id: 'late', sentAt: '2026-12-02T09:00:00.000Z' }), order({ id: 'early', reference: 'EQ-2', status: 'confirmed', sentAt: '2026-11-30T09:00:00.000Z' }),
      order({ id: 'c', status: 'cancelled', sentAt: '2026-11-01T09:00:00.000Z' }), order({ id: 'd', status: 'drafted', sentAt: null }),
      order({ id: 'col', purpose: 'collection', sentAt: '2026-11-02T09:00:00.000Z' }),
    ], null, day);
    expect(ticks).toEqual([{ key: 'equipment_ordered', event: 'sent', orderId: 'early', reference: 'EQ-2', status: 'confirmed', at: '2026-11-30T09:00:00.000Z', on: '2026-11-30' }]);
    expect(ticksFromOrders([order({ status: 'failed' }), order({ status: 'drafted', sentAt: null })], null, day)).toEqual([]);
  });

  it('ticks "installed" only for a delivered order, on or before the discharge date when one is set', () => {
    const delivered = order({ status: 'delivered', deliveredAt: '2026-12-04T23:30:00.000Z', deliveredOn: '2026-12-05' });
    expect(ticksFromOrders([delivered], null, day).map((t) => [t.key, t.on])).toEqual([['equipment_ordered', '2026-12-01'], ['equipment_installed', '2026-12-05']]);
    expect(ticksFromOrders([delivered], '2026-12-05', day).map((t) => t.key)).toContain('equipment_installed');
    // The programme's day (5 Dec) counts, not the UTC day of the instant (4 Dec).
    expect(ticksFromOrders([delivered], '2026-12-04', day).map((t) => t.key)).toEqual(['equipment_ordered']);
    expect(ticksFromOrders([order({ status: 'confirmed' })], null, day).map((t) => t.key)).toEqual(['equipment_ordered']);
  });
});

describe('withOrderTicks', () => {
  it('adds what the orders did, leaving a hand tick in place', () => {
    const ticks = ticksFromOrders([order({ status: 'delivered', deliveredAt: '2026-12-03T10:00:00.000Z', deliveredOn: '2026-12-03' })], null, day);
    const hand = { key: 'equipment_installed', done: true, evidence: { date: '2026-11-29' } };
    expect(withOrderTicks([hand], ticks)).toEqual([hand, { key: 'equipment_ordered', done: true, evidence: { date: '2026-12-01' } }]);
    expect(withOrderTicks([{ ...hand, done: false }], ticks).filter((s) => s.done).map((s) => s.key)).toEqual(['equipment_ordered', 'equipment_installed']);
  });
});
