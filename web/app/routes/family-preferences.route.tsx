import { Link } from 'react-router-dom';
import { FamilyPageHeader } from '../../components/ui/page-header';
import { PreferencesPage } from '../../features/preferences/components/preferences-page';
import { usePageTitle } from '../../lib/page-title';

/** Phone-first and large type, like the family home page it is reached from. */
export function Component() {
  usePageTitle('Contact details and reminders');
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-5 text-lg">
      <Link to="/family" className="self-start text-lg font-semibold text-brand-700 underline">← Back to our plan</Link>
      <FamilyPageHeader title="Contact details and reminders"
        intro="How your home-care team reaches you, and whether we send you visit reminders." />
      <PreferencesPage />
    </div>
  );
}
