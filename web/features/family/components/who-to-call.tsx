import { Alert } from '../../../components/ui/alert';
import { FoldedSection } from '../../../components/ui/folded-section';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-error';
import { useProgrammeContacts } from '../api/get-programme-contacts';
import { PhoneLink } from './phone-link';

export const NO_NUMBERS_YET = 'Your home-care team will give you the numbers to call. Keep them by the phone.';

/** The programme's numbers, each with when to use it, as large buttons that dial straight away. */
export function WhoToCall() {
  const contacts = useProgrammeContacts();
  return (
    <FoldedSection title="Who to call" large summary="Your home oxygen team and the hospital, and when to call each.">
      {contacts.isPending ? (
        <Spinner label="Loading the numbers" />
      ) : contacts.isError ? (
        <Alert>{`The numbers could not be loaded. ${errorMessage(contacts.error)}`}</Alert>
      ) : contacts.data.phones.length === 0 ? (
        <EmptyState large message={NO_NUMBERS_YET} />
      ) : (
        <ul aria-label="Numbers to call" className="flex flex-col gap-4">
          {contacts.data.phones.map((phone) => (
            <li key={`${phone.label}-${phone.number}`} className="flex flex-col gap-2 rounded-xl border border-surface-200 bg-surface-50 p-4">
              <p className="text-xl font-bold text-ink-900">{phone.label}</p>
              {phone.when && <p className="text-lg leading-relaxed text-ink-700">{phone.when}</p>}
              <div>
                <PhoneLink number={phone.number} callWho={`Call ${phone.label} on`} />
              </div>
            </li>
          ))}
        </ul>
      )}
    </FoldedSection>
  );
}
