import { FoldedSection } from '../../../components/ui/folded-section';
import { formatDate } from '../../../lib/format';
import { useDischarge } from '../api/get-discharge';

/**
 * The family's side of getting ready to go home: the training and home-safety steps in their own words, ticked
 * by the team (the API sends them nothing else). Shown once preparation has begun; once home, it is gone from the page.
 */
export function FamilyDischarge({ infantId, today }: { infantId: string; today: string }) {
  const discharge = useDischarge(infantId);
  const d = discharge.data;
  if (!d || d.items.length === 0 || (d.dischargedOn && d.dischargedOn < today)) return null;
  const done = d.items.filter((i) => i.done).length;
  // Nothing ticked and no date: no preparation under way (a baby already home before the checklist, for one), so
  // "0 of 10 steps done" would only worry the family.
  if (done === 0 && !d.dischargedOn) return null;
  const summary = d.dischargedOn
    ? `Going home on ${formatDate(d.dischargedOn)}. ${done} of ${d.items.length} steps done.`
    : `${done} of ${d.items.length} steps done.`;
  return (
    <FoldedSection title="Getting ready to go home" large summary={summary}>
      <ul aria-label="Steps before going home" className="flex flex-col gap-2">
        {d.items.map((item) => (
          <li key={item.key} className="flex gap-2">
            <span aria-hidden="true" className={item.done ? 'text-ok-800' : 'text-ink-500'}>{item.done ? '✓' : '○'}</span>
            <span>{item.label}<span className="sr-only">{item.done ? ': done' : ': not yet'}</span></span>
          </li>
        ))}
      </ul>
      <p className="mt-3 text-ink-700">Your team ticks these off with you. Ask them about anything not done yet.</p>
    </FoldedSection>
  );
}
