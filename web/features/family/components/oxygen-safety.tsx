import { OXYGEN_SAFETY_POINTS } from '@shared/family/care-text';
import { FoldedSection } from '../../../components/ui/folded-section';

/** Fire safety at home, in the same words as the printed care plan; the plan's own cautions carry the short form. */
export function OxygenSafety() {
  return (
    <FoldedSection title="Oxygen safety at home" large summary="No smoking or flames near the oxygen, keep it away from heat, store cylinders safely.">
      <ul aria-label="Oxygen safety at home" className="flex list-disc flex-col gap-2 pl-6 text-lg leading-relaxed text-ink-900">
        {OXYGEN_SAFETY_POINTS.map((point) => (
          <li key={point}>{point}</li>
        ))}
      </ul>
    </FoldedSection>
  );
}
