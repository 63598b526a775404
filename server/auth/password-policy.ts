import { createRequire } from 'node:module';

// The common-password list shipped by @zxcvbn-ts/language-common (MIT; its "passwords-common" dictionary, about
// 49,000 passwords seen most often in public breach corpora). Only entries at least as long as our minimum can
// ever match, so only those are kept in memory. Compared without regard to case.
let common: Set<string> | undefined;
function commonPasswords(): Set<string> {
  if (!common) {
    const require = createRequire(import.meta.url);
    const { dictionary } = require('@zxcvbn-ts/language-common') as { dictionary: Record<string, string[]> };
    common = new Set(dictionary['passwords-common'].filter((p) => p.length >= 12).map((p) => p.toLowerCase()));
  }
  return common;
}

export const isCommonPassword = (password: string) => commonPasswords().has(password.toLowerCase());

/**
 * What is wrong with a new password beyond its length (checked by the shared contract). ASVS 5.0 V6 and NIST
 * SP 800-63B §3.1.1.2: refuse passwords from lists of common ones and ones made of the account's own details;
 * no composition rules.
 */
export function passwordProblems(password: string, account: { email: string; name: string }): string[] {
  const lower = password.toLowerCase().replace(/\s+/g, '');
  const own = [account.email.toLowerCase(), account.email.toLowerCase().split('@')[0], account.name.toLowerCase().replace(/\s+/g, '')];
  if (isCommonPassword(password) || isCommonPassword(lower)) return ['This password is on a list of common passwords. Choose another.'];
  if (own.some((part) => part.length >= 4 && lower === part)) return ['Do not use your name or e-mail address as your password.'];
  return [];
}
