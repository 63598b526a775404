import { Link } from 'react-router-dom';
import type { ConsultantOverview as Data } from '@shared/schemas/overview';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { useOverview } from '../api/get-overview';
import { FigureGrid, FigureLink } from './figure-link';
import { OverviewLoadState } from './load-state';
import { plural, waitedFor } from './overview-format';

const oldest = (since: string | null, asOf: string) => (since ? `Oldest has waited ${waitedFor(since, asOf)}` : 'Nothing waiting');

function UnmetStepDowns({ o }: { o: Data }) {
  return (
    <section aria-labelledby="rules-not-met" className="flex flex-col gap-3 rounded-2xl border border-surface-200 bg-surface-0 p-4 shadow-sm sm:p-6">
      <h2 id="rules-not-met" tabIndex={-1} className="text-lg font-bold text-ink-900">Step downs with rules not met</h2>
      <p className="text-ink-700">Each was asked for, or proposed after an overnight study, while one or more of the programme’s step-down rules were not met. The review shows every rule with its evidence.</p>
      {o.unmetStepDowns.length === 0 ? <EmptyState message="None waiting: every step down waiting meets the programme’s rules." /> : (
        <ul className="flex flex-col divide-y divide-surface-200 rounded-lg border border-surface-200">
          {o.unmetStepDowns.map((s) => (
            <li key={s.prescriptionId} className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-0.5 px-3 py-2">
              <Link to={`/sign-off/${s.prescriptionId}`} className="font-semibold text-brand-800 underline">Review {s.infantName}</Link>
              <span className="text-ink-700">{s.unmetRules} {plural(s.unmetRules, 'rule', 'rules')} not met · waiting {waitedFor(s.waitingSince, o.asOf)}</span>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

export function ConsultantFigures({ o }: { o: Data }) {
  return (
    <div className="flex flex-col gap-6">
      <FigureGrid label="Waiting for your decision">
        <FigureLink to="/sign-off" count={o.proposals.count} label={plural(o.proposals.count, 'setting to sign off', 'settings to sign off')}
          detail={oldest(o.proposals.oldestSince, o.asOf)} />
        <FigureLink to="/sign-off" count={o.journeys.count} label={plural(o.journeys.count, 'journey check', 'journey checks')}
          detail={oldest(o.journeys.oldestSince, o.asOf)} />
        <FigureLink to="#rules-not-met" count={o.unmetStepDowns.length} attention
          label={plural(o.unmetStepDowns.length, 'step down with rules not met', 'step downs with rules not met')} detail="each needs your judgement" />
      </FigureGrid>
      <div className="grid gap-4 lg:grid-cols-2">
        <UnmetStepDowns o={o} />
        <Card title="Caseload">
          <p className="mb-2 text-ink-700">Every baby in the programme, with their status and anything flagged.</p>
          <Link to="/caseload" className="font-semibold text-brand-700 underline">Open the caseload</Link>
        </Card>
      </div>
    </div>
  );
}

export function ConsultantOverview() {
  return <OverviewLoadState query={useOverview('consultant')}>{(o) => <ConsultantFigures o={o} />}</OverviewLoadState>;
}
