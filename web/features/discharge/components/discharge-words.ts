import { SETTING_APPROVED_KEY } from '@shared/schemas/discharge-policy';
import type { Discharge } from '@shared/schemas/discharge';
import { isApiError } from '../../../lib/api-error';

/** A missing key in words: the item's label, or the approved setting. */
export function missingLabel(key: string, items: Discharge['items']): string {
  if (key === SETTING_APPROVED_KEY) return 'Setting approved by a consultant';
  return items.find((i) => i.key === key)?.label ?? key;
}

/** The 422 `discharge_not_ready` answer as a sentence naming each step still to do. */
export function notReadyMessage(error: unknown, items: Discharge['items']): string | undefined {
  if (!isApiError(error) || error.code !== 'discharge_not_ready') return undefined;
  const missing = (error.details as unknown as { missing?: string[] } | undefined)?.missing ?? [];
  return `Not ready to go home. Still to do: ${missing.map((k) => missingLabel(k, items)).join('; ')}.`;
}
