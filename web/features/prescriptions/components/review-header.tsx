import type { ReactNode } from 'react';
import type { InfantDetail } from '@shared/schemas/infants';
import { formatFlow } from '../../../components/clinical/clinical-format';
import { formatDateTime } from '../../../lib/format';
import { homePlaceText } from './home-place';
import { FactList } from '../../../components/ui/fact-list';

function CurrentPlan({ active }: { active: InfantDetail['activeSetting'] }) {
  if (!active) return <>None yet</>;
  return (
    <>
      <span className="font-semibold tabular-nums">{formatFlow(active.flowLpm)} L/min</span> (version {active.version}, approved{' '}
      {formatDateTime(active.approvedAt, 'date not recorded')})
    </>
  );
}

/** Who the decision is about, so the consultant never approves a setting for the wrong baby. */
export function ReviewHeader({ infant }: { infant: InfantDetail }) {
  const facts: [string, ReactNode][] = [
    ['Corrected age', infant.correctedAge],
    ['Weight', `${infant.weightKg} kg (${infant.weightDate})`],
    ['Home', `${homePlaceText(infant.homeElevationM, infant.homePressureMmHg)}, ${infant.home.address}`],
    ['Hospital', `${infant.site.name} (${infant.site.elevationM} m)`],
    ['Current setting', <CurrentPlan key="plan" active={infant.activeSetting} />],
  ];
  return (
    <section aria-label="Baby" className="rounded-2xl border border-surface-200 bg-surface-0 p-4 shadow-sm sm:p-6">
      <h2 className="text-xl font-bold text-ink-900">{infant.name}</h2>
      <FactList facts={facts} className="mt-2 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1" />
    </section>
  );
}
