import type { FakeMailMessage } from '../../fakes/mail/app';
import type { AppDeps } from '../../server/deps';

export const SUPPLIER_EMAIL = 'orders@oxygen-supplier.test';

/** Gives the programme a supplier (and a number to call), as an admin would in the settings. */
export async function withSupplier(deps: AppDeps, programmeId: string, over: { orderEmail?: string; lendsOximeter?: boolean } = {}) {
  const current = await deps.repos.policies.current(programmeId);
  const settings = {
    ...current.settings,
    contacts: { ...current.settings.contacts, phones: [{ label: 'Home oxygen team', number: '+441632960001', when: 'Weekdays 08:00–18:00' }] },
    supplier: { name: 'Fenwold Medical Gases', orderEmail: over.orderEmail ?? SUPPLIER_EMAIL, phone: '+441632960002', lendsOximeter: over.lendsOximeter ?? false },
  };
  await deps.repos.policies.insertVersion(programmeId, current.version + 1, settings, null);
  return settings;
}

/** The token of the supplier's link in an order e-mail. */
export function supplierToken(message: FakeMailMessage): string {
  const match = /\/supplier\/orders\/([A-Za-z0-9._-]+)/.exec(message.text);
  if (!match) throw new Error(`no supplier link in: ${message.text}`);
  return match[1];
}
