import { hash, verify } from '@node-rs/argon2';
import { randomBytes } from 'node:crypto';

// @node-rs/argon2 defaults to argon2id; parameters follow OWASP's minimum (19 MiB, 2 iterations, 1 lane).
const OPTIONS = { memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

export const hashPassword = (password: string): Promise<string> => hash(password, OPTIONS);

export async function verifyPassword(hashed: string, password: string): Promise<boolean> {
  try {
    return await verify(hashed, password);
  } catch {
    return false;
  }
}

// Verifying against a throwaway hash for unknown e-mails keeps sign-in timing the same whether or not the
// account exists (no account enumeration by timing).
let dummyHash: Promise<string> | undefined;
export async function burnVerifyTime(password: string): Promise<void> {
  dummyHash ??= hashPassword(randomBytes(16).toString('hex'));
  await verifyPassword(await dummyHash, password);
}

// Unambiguous characters only: the admin reads this aloud or copies it to the new person.
const ALPHABET = 'abcdefghjkmnpqrstuvwxyz23456789';
export function generateInitialPassword(length = 16): string {
  const bytes = randomBytes(length);
  let out = '';
  for (let i = 0; i < length; i++) {
    out += ALPHABET[bytes[i] % ALPHABET.length];
    if (i % 4 === 3 && i < length - 1) out += '-';
  }
  return out;
}
