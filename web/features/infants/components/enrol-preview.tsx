import { useMemo } from 'react';
import { infeasibleReason } from '@shared/clinical/conversion-warnings';
import { useWatch, type Control } from 'react-hook-form';
import { convertPrescription } from '@shared/clinical/conversion';
import type { PrescriptionConversion } from '@shared/clinical/conversion-types';
import { formatFlow, formatFraction, formatMmHg } from '../../../components/clinical/clinical-format';
import { WorkingTable } from '../../../components/clinical/working-table';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Spinner } from '../../../components/ui/spinner';
import { usePolicy, useSites } from '../api/get-programme-data';
import type { EnrolValues } from './enrol-values';
import { buildPreviewInput } from './preview-input';

type Outcome = { kind: 'result'; result: PrescriptionConversion } | { kind: 'missing'; missing: string[] };

function Figure({ label, value, strong = false }: { label: string; value: string; strong?: boolean }) {
  return (
    <div className="flex items-baseline justify-between gap-3 border-t border-surface-200 py-1.5 first:border-t-0">
      <dt className="text-sm text-ink-700">{label}</dt>
      <dd className={`text-right tabular-nums ${strong ? 'text-lg font-bold text-ink-900' : 'text-ink-900'}`}>{value}</dd>
    </div>
  );
}

function Result({ result }: { result: PrescriptionConversion }) {
  const { hospital, home } = result;
  return (
    <div className="flex flex-col gap-3">
      <dl>
        <Figure label="Effective FiO2 in hospital" value={formatFraction(hospital.effectiveFio2)} />
        <Figure label="Air pressure at home" value={`${formatMmHg(home.pressureMmHg)} mmHg`} />
        <Figure label="FiO2 needed at home" value={formatFraction(home.targetFio2)} />
        <Figure label="Flow needed" value={home.requiredFlowLpm === null ? '—' : `${home.requiredFlowLpm.toFixed(3)} L/min`} />
        <Figure label="Flowmeter setting (rounded up)" value={home.roundedFlowLpm === null ? '—' : `${formatFlow(home.roundedFlowLpm)} L/min`} strong />
        <Figure label="FiO2 delivered at that setting" value={home.deliveredFio2 === null ? '—' : formatFraction(home.deliveredFio2)} />
      </dl>
      {!result.feasible && <Alert tone="warn">{infeasibleReason(result.warnings)} The consultant must decide.</Alert>}
      {result.warnings.length > 0 && (
        <ul aria-label="Points to check" className="flex flex-col gap-1.5 text-sm">
          {result.warnings.map((warning) => (
            <li key={warning.code} className="rounded-lg border border-warn-200 bg-warn-50 px-3 py-2 text-warn-800">
              <span className="font-bold">Check: </span>
              {warning.message}
            </li>
          ))}
        </ul>
      )}
      <details className="group rounded-lg border border-surface-200">
        <summary className="min-h-11 cursor-pointer px-3 py-2.5 font-semibold text-brand-700">Show the working</summary>
        <div className="border-t border-surface-200 p-2">
          <WorkingTable working={result.working} model={result.model} />
        </div>
      </details>
    </div>
  );
}

/** Recomputes the home proposal with the shared conversion on every change of the form. */
export function EnrolPreview({ control }: { control: Control<EnrolValues> }) {
  const [weightKg, flowLpm, hospitalO2Percent, siteId, homeO2Percent, location] = useWatch({
    control,
    name: ['baby.weightKg', 'hospital.flowLpm', 'hospital.o2Percent', 'hospital.siteId', 'home.o2Percent', 'home.location'],
  });
  const sites = useSites();
  const policy = usePolicy();

  // By value: the form may hand back the same location object after an in-place change.
  const locationKey = JSON.stringify(location ?? {});

  const outcome = useMemo<Outcome | null>(() => {
    if (!sites.data || !policy.data) return null;
    const built = buildPreviewInput(
      { weightKg, flowLpm, hospitalO2Percent, homeO2Percent, siteId, location: JSON.parse(locationKey) },
      sites.data.items,
      policy.data.settings,
    );
    if (!built.ready) return { kind: 'missing', missing: built.missing };
    try {
      return { kind: 'result', result: convertPrescription(built.input) };
    } catch {
      // The contract check above should catch impossible input; a RangeError here still must not blank the form.
      return { kind: 'missing', missing: ['values the conversion can use'] };
    }
  }, [weightKg, flowLpm, hospitalO2Percent, homeO2Percent, siteId, locationKey, sites.data, policy.data]);

  return (
    <section aria-labelledby="enrol-preview-title" className="rounded-2xl border border-brand-200 bg-surface-0 p-4 shadow-sm">
      <div className="mb-2 flex flex-wrap items-center justify-between gap-2">
        <h2 id="enrol-preview-title" className="text-lg font-bold text-ink-900">
          Home setting preview
        </h2>
        <Badge tone="brand">Proposal only</Badge>
      </div>
      <p className="mb-3 text-sm font-semibold text-ink-700">Proposal only — a consultant must approve it.</p>
      {(sites.isError || policy.isError) && <Alert>{(sites.error ?? policy.error)?.message}</Alert>}
      {!outcome && !(sites.isError || policy.isError) && <Spinner label="Loading programme settings" />}
      {outcome?.kind === 'missing' && (
        <p className="text-ink-700">
          Fill in {outcome.missing.join(', ')} to see the preview.
        </p>
      )}
      {outcome?.kind === 'result' && <Result result={outcome.result} />}
    </section>
  );
}
