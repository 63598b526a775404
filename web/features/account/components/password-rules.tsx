import { PASSWORD_MIN_LENGTH } from '@shared/schemas/accounts';

/** The only rules there are: length, and not a well-known password (checked by the server against a list). */
export function PasswordRules() {
  return (
    <p className="text-sm text-ink-700">
      At least {PASSWORD_MIN_LENGTH} characters. A few ordinary words make a good password; common passwords are refused. No
      special characters needed.
    </p>
  );
}
