import { DEFAULT_POLICY_SETTINGS } from '@shared/schemas/policy';
import type { SupplierSettings } from '@shared/schemas/supplier';
import type { AppDeps } from '../server/deps';

/**
 * The demo programmes' numbers for families (fictional: the 01632 960xxx range is set aside for drama), saved as
 * a first policy version the way an admin would; a programme that already has a version is left alone.
 */
/** Fictional suppliers (example.org addresses, drama-range numbers); Saltmarsh has none yet, so it can only draft orders. */
const DEMO_SUPPLIERS: Record<string, SupplierSettings> = {
  larkmoor: { name: 'Fenwold Medical Gases', orderEmail: 'orders@fenwold-gases.example', phone: '+441632960555', lendsOximeter: true },
};

export async function seedPolicies(deps: AppDeps): Promise<number> {
  const demo: Record<string, Array<{ label: string; number: string; when: string }>> = {
    larkmoor: [
      { label: 'Home oxygen nurses', number: '+441632960214', when: 'Weekdays 08:00–18:00, for questions about the oxygen or the plan' },
      { label: 'Children’s ward (out of hours)', number: '+441632960877', when: 'Evenings, nights and weekends' },
      { label: 'Oxygen supplier', number: '+441632960555', when: 'Cylinder deliveries and equipment faults, any time' },
    ],
    saltmarsh: [{ label: 'Outreach team', number: '+441632960390', when: 'Weekdays 09:00–17:00' }],
  };
  let n = 0;
  for (const [slug, phones] of Object.entries(demo)) {
    const programme = await deps.repos.programmes.findBySlug(slug);
    if (!programme || (await deps.repos.policies.current(programme.id)).version > 0) continue;
    await deps.repos.policies.insertVersion(programme.id, 1, {
      ...DEFAULT_POLICY_SETTINGS, contacts: { phones, emergencyNumber: '999' }, supplier: DEMO_SUPPLIERS[slug] ?? DEFAULT_POLICY_SETTINGS.supplier,
    }, null);
    n++;
  }
  return n;
}
