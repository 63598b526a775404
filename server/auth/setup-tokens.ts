import { createHash, randomBytes } from 'node:crypto';

/** 256 random bits, URL-safe; a fast hash suffices for a secret this long (nothing to guess from the hash). */
export function newSetupToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashSetupToken(token) };
}
export const hashSetupToken = (token: string) => createHash('sha256').update(token, 'utf8').digest('hex');

export const setupLink = (publicUrl: string, token: string) => `${publicUrl}/set-password?token=${encodeURIComponent(token)}`;
