import { OXYGEN_SAFETY_POINTS } from '../../../../shared/family/care-text';
import { Card } from '../../../components/ui/card';

/** Fire safety at home, in the same words as the printed care plan. */
export function OxygenSafety() {
  return (
    <Card title="Oxygen safety at home">
      <ul aria-label="Oxygen safety at home" className="flex list-disc flex-col gap-2 pl-6 text-lg leading-relaxed text-ink-900">
        {OXYGEN_SAFETY_POINTS.map((point) => (
          <li key={point}>{point}</li>
        ))}
      </ul>
    </Card>
  );
}
