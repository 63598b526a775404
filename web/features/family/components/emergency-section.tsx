import { emergencyCallText, warningSigns, WARNING_SIGNS_INTRO } from '@shared/family/care-text';
import { useProgrammeContacts } from '../api/get-programme-contacts';
import { FoldedSection } from '../../../components/ui/folded-section';
import { PhoneLink } from './phone-link';

const WITHOUT_NUMBER = 'If you are worried your baby is seriously unwell, call your local emergency number straight away, then tell your home oxygen team.';

/**
 * The warning signs and the emergency number, in the same words as the printed care plan. Shown at once, before the
 * plan has loaded: only a baby known to be off oxygen gets the signs without the cannula and supply check.
 */
export function EmergencySection({ onOxygen = true }: { onOxygen?: boolean }) {
  const contacts = useProgrammeContacts();
  const number = contacts.data?.emergencyNumber;
  return (
    <section aria-labelledby="emergency-heading" className="flex flex-col gap-3 rounded-2xl border-2 border-danger-600 bg-danger-50 p-4 sm:p-5">
      <h2 id="emergency-heading" className="text-2xl font-bold text-danger-800">
        In an emergency
      </h2>
      <p className="text-xl leading-relaxed text-ink-900">{number ? emergencyCallText(number) : WITHOUT_NUMBER}</p>
      {number && (
        <div>
          <PhoneLink number={number} callWho="Call the emergency number," tone="danger" />
        </div>
      )}
      <FoldedSection title="Warning signs that need help now" headingLevel={3} tone="danger" large
        summary="Breathing hard or with pauses, a blue or grey colour, floppy or hard to wake.">
        <p className="text-lg leading-relaxed text-ink-900">{WARNING_SIGNS_INTRO}</p>
        <ul aria-label="Warning signs" className="mt-2 flex list-disc flex-col gap-2 pl-6 text-lg leading-relaxed text-ink-900">
          {warningSigns(onOxygen).map((sign) => (
            <li key={sign}>{sign}</li>
          ))}
        </ul>
      </FoldedSection>
    </section>
  );
}
