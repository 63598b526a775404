import { useFormContext } from 'react-hook-form';
import { TextSetting } from './policy-list-field';
import { Section } from './policy-sections';
import type { PolicyFormValues } from './policy-values';

/** Who delivers and collects the equipment: orders are e-mailed to the order address with a link to confirm. */
export function SupplierSettingsSection() {
  const { register } = useFormContext<PolicyFormValues>();
  return (
    <Section title="Oxygen supplier">
      <TextSetting name="settings.supplier.name" label="Supplier’s name" />
      <TextSetting name="settings.supplier.orderEmail" type="email" label="Order e-mail address"
        hint="Equipment orders go here, with the order as a PDF and a link to confirm delivery. Empty: orders can only be drafted." />
      <TextSetting name="settings.supplier.phone" type="tel" inputMode="tel" label="Supplier’s phone number" hint="For the team to call (optional)" />
      <div className="flex flex-col gap-1">
        <label className="flex min-h-11 cursor-pointer items-center gap-3 font-semibold text-ink-900">
          <input type="checkbox" className="size-5 accent-brand-600" {...register('settings.supplier.lendsOximeter')} />
          The programme lends families a pulse oximeter
        </label>
        <p className="text-sm text-ink-500">Then an oximeter can be put on an equipment order.</p>
      </div>
    </Section>
  );
}
