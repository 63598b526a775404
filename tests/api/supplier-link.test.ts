import { describe, expect, it } from 'vitest';
import { linkExpiry, makeSupplierToken, readSupplierToken } from '../../server/modules/equipment-orders/supplier-link';

const SECRET = 'a-test-secret-of-at-least-thirty-two-chars';
const ORDER = '0b0b0b0b-0000-4000-8000-000000000001';

describe('the supplier link token', () => {
  it('when the link is read up to its last second, then it works; from its expiry on, it is expired', () => {
    const expires = linkExpiry('2026-12-05', 14);
    expect(expires.toISOString()).toBe('2026-12-19T23:59:59.000Z');
    const token = makeSupplierToken(SECRET, ORDER, expires);
    expect(readSupplierToken(SECRET, token, new Date('2026-12-19T23:59:58.999Z'))).toEqual({ ok: true, orderId: ORDER, expiresAt: expires });
    expect(readSupplierToken(SECRET, token, expires)).toEqual({ ok: false, reason: 'expired' });
  });

  it('when it was signed with another secret or changed in any part, then it is invalid (before the expiry is even looked at)', () => {
    const token = makeSupplierToken(SECRET, ORDER, new Date('2026-12-19T23:59:59Z'));
    const early = new Date('2026-12-01T00:00:00Z');
    expect(readSupplierToken(`${SECRET}x`, token, early)).toEqual({ ok: false, reason: 'invalid' });
    const [id, exp, sig] = token.split('.');
    for (const bad of [`${id.replace('1', '2')}.${exp}.${sig}`, `${id}.${Number(exp) + 1}.${sig}`, `${id}.${exp}.${sig.slice(1)}A`, `${id}.${exp}`, '', `${token}.x`]) {
      expect(readSupplierToken(SECRET, bad, early)).toEqual({ ok: false, reason: 'invalid' });
    }
    // A late link that has also been tampered with says "not valid", never "expired": it says nothing about the order.
    expect(readSupplierToken(SECRET, `${id}.${exp}.${sig.slice(1)}A`, new Date('2027-01-01T00:00:00Z'))).toEqual({ ok: false, reason: 'invalid' });
  });
});
