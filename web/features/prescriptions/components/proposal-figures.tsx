import type { ReactNode } from 'react';
import { infeasibleReason } from '@shared/clinical/conversion-warnings';
import type { InfantDetail } from '@shared/schemas/infants';
import { PRESCRIPTION_REASON_LABELS, type Prescription } from '@shared/schemas/prescriptions';
import { formatFlow, formatFraction, formatKpa, formatMmHg } from '../../../components/clinical/clinical-format';

type Conversion = NonNullable<Prescription['conversion']>;

const flowOr = (flowLpm: number | null, none: string) => (flowLpm === null ? none : `${flowLpm.toFixed(3)} L/min`);

function Figure({ label, children, strong = false }: { label: string; children: ReactNode; strong?: boolean }) {
  return (
    <div className={`flex flex-col gap-0.5 rounded-lg px-3 py-2 ${strong ? 'border-2 border-brand-600 bg-brand-50' : 'bg-surface-50'}`}>
      <dt className="text-sm text-ink-500">{label}</dt>
      <dd className={`tabular-nums text-ink-900 ${strong ? 'text-xl font-bold' : 'font-semibold'}`}>{children}</dd>
    </div>
  );
}

interface ProposalFiguresProps {
  rx: Prescription;
  conversion: Conversion;
  hospital: InfantDetail['hospital'];
}

/** The proposal's key numbers in the order they follow from each other; the full working is below them. */
export function ProposalFigures({ rx, conversion, hospital }: ProposalFiguresProps) {
  const { home } = conversion;
  return (
    <div className="flex flex-col gap-3">
      <p className="text-ink-700">
        Version {rx.version} · {PRESCRIPTION_REASON_LABELS[rx.reason]} · home oxygen from the {rx.source} ({rx.sourceO2Percent} %)
      </p>
      <dl className="grid gap-2 sm:grid-cols-2 xl:grid-cols-4">
        <Figure label="Hospital setting">
          {formatFlow(hospital.flowLpm)} L/min of {hospital.o2Percent} % oxygen
        </Figure>
        <Figure label="Hospital air pressure">
          {formatMmHg(conversion.hospital.pressureMmHg)} mmHg ({formatKpa(conversion.hospital.pressureMmHg)} kPa)
        </Figure>
        <Figure label="Effective FiO2 in hospital">{formatFraction(conversion.hospital.effectiveFio2)}</Figure>
        <Figure label="Home air pressure">
          {formatMmHg(home.pressureMmHg)} mmHg ({formatKpa(home.pressureMmHg)} kPa)
        </Figure>
        <Figure label="Target FiO2 at home">{formatFraction(home.targetFio2)}</Figure>
        <Figure label="Required flow">{flowOr(home.requiredFlowLpm, infeasibleReason(conversion.warnings))}</Figure>
        <Figure label="Proposed flowmeter step (rounded up)" strong>
          {conversion.feasible && home.roundedFlowLpm !== null ? `${formatFlow(home.roundedFlowLpm)} L/min` : `${infeasibleReason(conversion.warnings)} Decide.`}
        </Figure>
        <Figure label="FiO2 delivered at that step">{home.deliveredFio2 === null ? '—' : formatFraction(home.deliveredFio2)}</Figure>
      </dl>
    </div>
  );
}
