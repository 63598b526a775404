import { DEFAULT_POLICY_SETTINGS } from '@shared/schemas/policy';
import type { PolicyFormValues } from './policy-values';

/** Every setting's dotted path, as the server names them in a 400's details; a list is one path. */
function settingPaths(value: object, prefix: string): string[] {
  return Object.entries(value).flatMap(([key, child]) =>
    child && typeof child === 'object' && !Array.isArray(child) ? settingPaths(child, `${prefix}.${key}`) : [`${prefix}.${key}`],
  );
}
const FIELD_PATHS = new Set(settingPaths(DEFAULT_POLICY_SETTINGS, 'settings'));

/** Lists edited row by row, and the boxes each row has. */
const ROW_LISTS = {
  'settings.contacts.phones': ['label', 'number', 'when'],
  'settings.supply.cylinders': ['id', 'name', 'contentLitres', 'unit', 'fullPressure', 'residualPressure'],
  'settings.discharge.items': ['key', 'label', 'group', 'evidence', 'familySees', 'familyLabel', 'source'],
} as const;

function rowCount(values: PolicyFormValues, list: keyof typeof ROW_LISTS): number {
  if (list === 'settings.contacts.phones') return values.settings.contacts.phones.length;
  return list === 'settings.supply.cylinders' ? values.settings.supply.cylinders.length : values.settings.discharge.items.length;
}

/**
 * The form field a server message belongs to, or nothing when the form has no such box (the message then goes
 * above the form). "settings.supply.cylinders.1.fullPressure" is that box in the second cylinder; a fault in one
 * flowmeter step ("settings.flowmeterStepsLpm.3") or in a row as a whole belongs to the list.
 */
export function formPathFor(path: string, values: PolicyFormValues): string | undefined {
  for (const [list, keys] of Object.entries(ROW_LISTS) as [keyof typeof ROW_LISTS, readonly string[]][]) {
    const match = new RegExp(`^${list.replace(/\./g, '\\.')}\\.(\\d+)\\.(\\w+)$`).exec(path);
    if (match && Number(match[1]) < rowCount(values, list) && keys.includes(match[2])) return path;
  }
  const field = path.replace(/\.\d+$/, '');
  return FIELD_PATHS.has(field) ? field : undefined;
}
