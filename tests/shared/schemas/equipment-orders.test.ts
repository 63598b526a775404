import { describe, expect, it } from 'vitest';
import { defineAbilityFor } from '@shared/auth/ability';
import { createOrderSchema, itemDetail, orderItemSchema } from '@shared/schemas/equipment-orders';
import { DEFAULT_POLICY_SETTINGS, updatePolicySchema } from '@shared/schemas/policy';

const P = '6f1d2c3b-4a59-4e8d-9c7b-1a2b3c4d5e6f';
const issues = (r: { success: boolean; error?: { issues: Array<{ path: PropertyKey[]; message: string }> } }) =>
  Object.fromEntries((r.error?.issues ?? []).map((i) => [i.path.join('.'), i.message]));

describe('an order item', () => {
  it('when a concentrator has its flow range, then it is accepted; without one, or upside down, each box says why', () => {
    expect(orderItemSchema.safeParse({ kind: 'concentrator', quantity: 1, flowMinLpm: 0.1, flowMaxLpm: 0.1 }).success).toBe(true);
    expect(issues(orderItemSchema.safeParse({ kind: 'concentrator', quantity: 1 }))).toEqual({
      flowMinLpm: 'Enter the lowest flow the concentrator must give', flowMaxLpm: 'Enter the highest flow the concentrator must give',
    });
    expect(issues(orderItemSchema.safeParse({ kind: 'concentrator', quantity: 1, flowMinLpm: 0.2, flowMaxLpm: 0.1 }))).toEqual({ flowMaxLpm: 'Must be at least the lowest flow' });
  });

  it('when cylinders have no size, or other kinds have one or a flow range, then they are refused', () => {
    expect(issues(orderItemSchema.safeParse({ kind: 'portable_cylinder', quantity: 2 }))).toEqual({ size: 'Choose the cylinder size' });
    expect(issues(orderItemSchema.safeParse({ kind: 'spares', quantity: 1, size: 'large-home' }))).toEqual({ size: 'Only cylinders have a size' });
    expect(issues(orderItemSchema.safeParse({ kind: 'oximeter', quantity: 1, flowMaxLpm: 1 }))).toEqual({ flowMinLpm: 'Only a concentrator has a flow range' });
    expect(issues(orderItemSchema.safeParse({ kind: 'spares', quantity: 51 }))).toEqual({ quantity: 'At most 50' });
    expect(issues(orderItemSchema.safeParse({ kind: 'spares', quantity: 0 }))).toEqual({ quantity: 'At least 1' });
  });

  it('when an order is read, then send defaults to true and the purpose to a delivery; no items is refused', () => {
    expect(createOrderSchema.parse({ items: [{ kind: 'spares', quantity: 1 }], neededBy: '2026-12-05' })).toMatchObject({ send: true, purpose: 'delivery' });
    expect(issues(createOrderSchema.safeParse({ items: [], neededBy: '2026-12-05' }))).toEqual({ items: 'Add at least one item' });
  });

  it('when a line is written in words, then a concentrator gives its range and a cylinder its programme name', () => {
    expect(itemDetail({ kind: 'concentrator', flowMinLpm: 0.1, flowMaxLpm: 2 })).toBe('flow range 0.1–2 L/min');
    expect(itemDetail({ kind: 'static_cylinder', size: 'large-home' }, { 'large-home': 'Large home cylinder' })).toBe('Large home cylinder');
    expect(itemDetail({ kind: 'spares' })).toBeNull();
  });
});

describe('the supplier in the programme settings', () => {
  it('when the supplier’s number is typed nationally, then it is stored in E.164; an unreadable one is refused on its box', () => {
    const settings = { ...DEFAULT_POLICY_SETTINGS, supplier: { name: 'Fenwold Medical Gases', orderEmail: 'orders@fenwold.example', phone: '01632 960555', lendsOximeter: true } };
    expect(updatePolicySchema.parse({ baseVersion: 0, settings }).settings.supplier.phone).toBe('+441632960555');
    const bad = updatePolicySchema.safeParse({ baseVersion: 0, settings: { ...settings, supplier: { ...settings.supplier, phone: '123' } } });
    expect(Object.keys(issues(bad))).toEqual(['settings.supplier.phone']);
    expect(updatePolicySchema.parse({ baseVersion: 0, settings: DEFAULT_POLICY_SETTINGS }).settings.supplier).toEqual({ name: '', orderEmail: '', phone: '', lendsOximeter: false });
  });
});

describe('who may see orders', () => {
  it('when each role is asked, then the coordinator makes and changes them, staff read, and a family cannot even read them', () => {
    const as = (role: 'admin' | 'coordinator' | 'nurse' | 'consultant' | 'family') => defineAbilityFor({ id: 'u', role, programmeId: P, infantIds: ['b'] });
    expect(as('coordinator').can('create', 'EquipmentOrder')).toBe(true);
    for (const role of ['admin', 'nurse', 'consultant'] as const) {
      expect(as(role).can('read', 'EquipmentOrder')).toBe(true);
      expect(as(role).can('create', 'EquipmentOrder')).toBe(false);
      expect(as(role).can('update', 'EquipmentOrder')).toBe(false);
    }
    expect(as('family').can('read', 'EquipmentOrder')).toBe(false);
  });
});
