import { Link } from 'react-router-dom';
import { PreferencesPage } from '../../features/preferences/components/preferences-page';

/** Phone-first and large type, like the family home page it is reached from. */
export function Component() {
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-5 text-lg">
      <Link to="/family" className="self-start text-lg font-semibold text-brand-700 underline">← Back to our plan</Link>
      <div>
        <h1 className="text-3xl font-bold text-ink-900 sm:text-4xl">Contact details and reminders</h1>
        <p className="mt-2 text-xl leading-relaxed text-ink-700">
          How your home-care team reaches you, and whether we send you visit reminders.
        </p>
      </div>
      <PreferencesPage />
    </div>
  );
}
