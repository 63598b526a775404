import { useWatch, type Control } from 'react-hook-form';
import { DIAGNOSIS_LABELS } from '@shared/schemas/infants';
import { Button } from '../../../components/ui/button';
import { useSites, useStaff } from '../api/get-programme-data';
import type { EnrolValues } from './enrol-values';
import { FactList } from '../../../components/ui/fact-list';
import { formatDate } from '../../../lib/format';

const SEX_WORDS: Record<string, string> = { female: 'Female', male: 'Male', unknown: 'Not known' };
const HOSPITAL_SOURCE_WORDS: Record<string, string> = { cylinder: 'wall or cylinder', concentrator: 'concentrator', blended: 'blended' };

function placeWords(location: EnrolValues['home']['location'] | undefined): string {
  const place = (location ?? {}) as Record<string, number | undefined>;
  if (place.elevationM !== undefined) return `${place.elevationM} m`;
  if (place.elevationFt !== undefined) return `${place.elevationFt} ft`;
  if (place.pressureMmHg !== undefined) return `measured ${place.pressureMmHg} mmHg`;
  return '—';
}

const show = (value: unknown) => (value === undefined || value === null || value === '' ? '—' : String(value));

function Section({ title, step, onEdit, rows }: { title: string; step: number; onEdit: (step: number) => void; rows: [string, string][] }) {
  return (
    <section className="rounded-xl border border-surface-200 p-3 sm:p-4">
      <div className="mb-2 flex items-center justify-between gap-2">
        <h3 className="font-bold text-ink-900">{title}</h3>
        <Button variant="quiet" size="sm" onClick={() => onEdit(step)} aria-label={`Change ${title.toLowerCase()}`}>
          Change
        </Button>
      </div>
      <FactList facts={rows} className="grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[12rem_1fr]" />
    </section>
  );
}

/** Everything typed, read back before saving, with a way back to each step. */
export function EnrolCheckStep({ control, onEdit }: { control: Control<EnrolValues>; onEdit: (step: number) => void }) {
  const values = useWatch({ control }) as Partial<EnrolValues>;
  const sites = useSites();
  const nurses = useStaff('nurse');
  const consultants = useStaff('consultant');
  const { baby, hospital, home, care, contacts = [] } = values;
  const site = sites.data?.items.find((candidate) => candidate.id === hospital?.siteId);
  const nameOf = (list: { id: string; name: string }[] | undefined, id?: string) => list?.find((p) => p.id === id)?.name ?? '—';
  return (
    <div className="flex flex-col gap-3">
      <Section title="Baby" step={0} onEdit={onEdit} rows={[
        ['Name', `${show(baby?.givenName)} ${show(baby?.familyName)}`],
        ['Sex', SEX_WORDS[baby?.sex ?? ''] ?? '—'],
        ['Birth date', formatDate(baby?.birthDate)],
        ['Gestation at birth', `${show(baby?.gestation?.weeks)} weeks ${show(baby?.gestation?.days)} days`],
        ['Birth weight', `${show(baby?.birthWeightG)} g`],
        ['Current weight', `${show(baby?.weightKg)} kg on ${formatDate(baby?.weightDate)}`],
        ['Diagnoses', (baby?.diagnoses ?? []).map((d) => DIAGNOSIS_LABELS[d]).join(', ') || 'None ticked'],
      ]} />
      <Section title="Hospital setting" step={1} onEdit={onEdit} rows={[
        ['Site', site ? `${site.name} (${site.elevationM} m)` : '—'],
        ['Cannula flow', `${show(hospital?.flowLpm)} L/min`],
        ['Source', `${HOSPITAL_SOURCE_WORDS[hospital?.source ?? ''] ?? '—'}, ${show(hospital?.o2Percent)} %`],
      ]} />
      <Section title="Home" step={2} onEdit={onEdit} rows={[
        ['Address', show(home?.address)],
        ['Place', placeWords(home?.location)],
        ['Source', `${home?.source === 'cylinder' ? 'cylinder' : 'concentrator'}, ${show(home?.o2Percent)} %`],
      ]} />
      <Section title="Care team and family" step={3} onEdit={onEdit} rows={[
        ['Home-care nurse', nameOf(nurses.data, care?.nurseId)],
        ['Consultant', nameOf(consultants.data, care?.consultantId)],
        ...contacts.map((contact, index): [string, string] => [
          `Contact ${index + 1}`,
          `${show(contact.name)} (${show(contact.relation)}), prefers ${contact.preferredChannel === 'email' ? 'e-mail' : 'SMS'}`,
        ]),
      ]} />
    </div>
  );
}
