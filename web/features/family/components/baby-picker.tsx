import { Link } from 'react-router-dom';
import type { InfantSummary } from '@shared/schemas/infants';

/** For families with more than one baby in the programme (twins): one plan at a time, chosen by name. */
export function BabyPicker({ babies, chosenId }: { babies: readonly InfantSummary[]; chosenId: string }) {
  return (
    <nav aria-label="Choose your baby" className="flex flex-wrap gap-2">
      {babies.map((baby) => {
        const chosen = baby.id === chosenId;
        return (
          <Link
            key={baby.id}
            to={`?baby=${baby.id}`}
            aria-current={chosen ? 'page' : undefined}
            className={`inline-flex min-h-13 items-center rounded-xl border-2 px-5 text-xl font-semibold ${
              chosen ? 'border-brand-600 bg-brand-50 text-brand-800' : 'border-surface-300 bg-surface-0 text-ink-900'
            }`}
          >
            {baby.name}
          </Link>
        );
      })}
    </nav>
  );
}
