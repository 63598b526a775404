import { useState } from 'react';
import { SavedNote } from '../../../components/ui/saved-note';
import { SAVED_MESSAGE } from '../api/update-preferences';
import { Alert } from '../../../components/ui/alert';
import { Spinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-error';
import { useMyPreferences } from '../api/get-preferences';
import { PreferencesForm } from './preferences-form';
import { PreferencesSummary } from './preferences-summary';

/** The family member's own contact details and reminder choices; what is saved is shown above what is being edited. */
export function PreferencesPage() {
  const preferences = useMyPreferences();
  const [saves, setSaves] = useState(0);
  if (preferences.isPending) return <Spinner label="Loading your details" />;
  if (preferences.isError) return <Alert>{errorMessage(preferences.error)}</Alert>;
  const saved = preferences.data.preferences;
  return (
    <div className="flex flex-col gap-6">
      <p className="text-xl text-ink-700">
        For {saved.name} ({saved.relation})
      </p>
      {saves > 0 && <SavedNote key={saves} large>{SAVED_MESSAGE}</SavedNote>}
      <PreferencesSummary preferences={saved} />
      {/* A new version starts a fresh form, so the boxes always begin from what is saved. */}
      <PreferencesForm key={saved.rowVersion} preferences={saved} onSaved={() => setSaves((n) => n + 1)} />
    </div>
  );
}
