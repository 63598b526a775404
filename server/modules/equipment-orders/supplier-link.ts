import { createHmac, timingSafeEqual } from 'node:crypto';

// A supplier confirms an order through a link with no account: the link itself is the credential. It carries the
// order id and an expiry, signed with HMAC-SHA256 under SUPPLIER_LINK_SECRET for one purpose, so it opens that order
// only, cannot be stretched to a later expiry, and a link signed for anything else does not verify.
const PURPOSE = 'supplier-order';
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

const sign = (secret: string, orderId: string, expSeconds: number) =>
  createHmac('sha256', secret).update(`${PURPOSE}\n${orderId}\n${expSeconds}`).digest('base64url');

export function makeSupplierToken(secret: string, orderId: string, expiresAt: Date): string {
  const exp = Math.floor(expiresAt.getTime() / 1000);
  return `${orderId}.${exp}.${sign(secret, orderId, exp)}`;
}

export type TokenCheck = { ok: true; orderId: string; expiresAt: Date } | { ok: false; reason: 'invalid' | 'expired' };

/** Checks the signature first (in constant time), then the expiry against the injected clock. */
export function readSupplierToken(secret: string, token: string, now: Date): TokenCheck {
  const parts = token.split('.');
  if (parts.length !== 3) return { ok: false, reason: 'invalid' };
  const [orderId, expText, given] = parts;
  if (!UUID.test(orderId) || !/^\d{1,12}$/.test(expText) || !/^[A-Za-z0-9_-]{43}$/.test(given)) return { ok: false, reason: 'invalid' };
  const exp = Number(expText);
  const expected = Buffer.from(sign(secret, orderId, exp));
  if (!timingSafeEqual(expected, Buffer.from(given))) return { ok: false, reason: 'invalid' };
  if (now.getTime() >= exp * 1000) return { ok: false, reason: 'expired' };
  return { ok: true, orderId, expiresAt: new Date(exp * 1000) };
}

/** The link stops working this many days after the date needed (end of that day, UTC). */
export function linkExpiry(neededBy: string, days: number): Date {
  const end = new Date(`${neededBy}T23:59:59Z`);
  return new Date(end.getTime() + days * 86_400_000);
}
