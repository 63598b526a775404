import { InPageLink } from '../../../components/ui/in-page-link';

/** The form's sections in page order; each `Section` takes its id from its title, so the links always land. */
export const POLICY_SECTION_TITLES = [
  'Saturation targets', 'Check schedule', 'Stepping down', 'Overnight oximetry analysis', 'Flowmeter and cannula', 'Cylinders', 'Oxygen supplier',
  'Readings', 'Reminders', 'Numbers for families', 'Discharge checklist',
] as const;

export const policySectionId = (title: string) => `settings-${title.toLowerCase().replace(/[^a-z0-9]+/g, '-')}`;

/** A long form's table of contents: beside it on a wide screen (it stays in view), above it on a narrow one. */
export function PolicySectionNav() {
  return (
    <nav aria-labelledby="settings-nav-title" className="rounded-2xl border border-surface-200 bg-surface-0 p-4 shadow-sm xl:sticky xl:top-4">
      <h2 id="settings-nav-title" className="mb-2 font-bold text-ink-900">Sections</h2>
      <ul className="flex flex-wrap gap-x-4 gap-y-1 xl:flex-col">
        {POLICY_SECTION_TITLES.map((title) => (
          <li key={title}>
            <InPageLink target={policySectionId(title)} className="inline-flex min-h-11 items-center font-semibold text-brand-700 underline xl:min-h-9">
              {title}
            </InPageLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
