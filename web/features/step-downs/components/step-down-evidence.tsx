import { ScrollRegion } from '../../../components/ui/scroll-region';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { INFANT_FLAG_LABELS } from '@shared/schemas/infants';
import { READING_STATE_LABELS } from '@shared/schemas/readings';
import { stepDownEvidenceSchema, type StepDownEvidence } from '@shared/schemas/step-downs';
import { Card } from '../../../components/ui/card';
import { Spinner } from '../../../components/ui/spinner';
import { formatDateTime } from '../../../lib/format';
import { Spo2TraceChart } from '../../charts/components/spo2-trace-chart';
import { useRecordingTrace } from '../../recordings/api/get-recording';
import { readingTrend } from './reading-trend';
import { RuleChecks } from './rule-checks';

export function readStepDownEvidence(evidence: unknown): StepDownEvidence | null {
  const parsed = stepDownEvidenceSchema.safeParse(evidence);
  return parsed.success ? parsed.data : null;
}

function Facts({ children }: { children: ReactNode }) {
  return <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">{children}</dl>;
}
function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <>
      <dt className="text-ink-500">{label}</dt>
      <dd className="text-ink-900">{children}</dd>
    </>
  );
}

const fixed = (v: number | null, digits = 1, unit = '') => (v === null ? '—' : `${v.toFixed(digits)}${unit}`);
const hours = (minutes: number) => `${Math.floor(minutes / 60)} h ${String(Math.round(minutes % 60)).padStart(2, '0')} min`;

function StudyEvidence({ study }: { study: NonNullable<StepDownEvidence['study']> }) {
  const trace = useRecordingTrace(study.recordingId, true);
  return (
    <div className="flex flex-col gap-3">
      <Facts>
        <Fact label="Recorded">{formatDateTime(study.recordedAt)}</Fact>
        <Fact label="Valid time">{hours(study.validMinutes)}{study.judged ? '' : ' — too short to judge'}</Fact>
        <Fact label="Mean SpO2">{fixed(study.meanSpo2, 1, ' %')}</Fact>
        <Fact label="Time below 90 %">{fixed(study.pctBelow90, 1, ' % of valid time')}</Fact>
        <Fact label="ODI3 / ODI4">{`${fixed(study.odi3)} / ${fixed(study.odi4)} per hour`}</Fact>
      </Facts>
      {trace.isPending ? (
        <Spinner label="Loading the SpO2 trace" />
      ) : trace.data ? (
        <Spo2TraceChart trace={trace.data} startedAt={study.recordedAt} height={160}
          description={`SpO2 through the night of ${formatDateTime(study.recordedAt)}, with ${trace.data.events.length} desaturation events marked.`} />
      ) : null}
      <Link to={`/recordings/${study.recordingId}`} className="self-start font-semibold text-brand-700 underline">Open the full recording</Link>
    </div>
  );
}

function ReadingsEvidence({ readings }: { readings: StepDownEvidence['readings'] }) {
  if (readings.length === 0) return <p className="text-ink-700">No spot readings in the last two weeks.</p>;
  return (
    <div className="flex flex-col gap-2">
      <p className="font-semibold text-ink-900">{readingTrend(readings.map((r) => r.spo2))}</p>
      <ScrollRegion label="Latest readings">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Latest spot readings, newest first</caption>
          <thead>
            <tr className="text-ink-500">
              <th scope="col" className="py-1 pr-3 font-semibold">Taken</th>
              <th scope="col" className="py-1 pr-3 font-semibold">SpO2</th>
              <th scope="col" className="py-1 pr-3 font-semibold">Pulse</th>
              <th scope="col" className="py-1 font-semibold">State</th>
            </tr>
          </thead>
          <tbody>
            {readings.map((r) => (
              <tr key={`${r.takenAt}-${r.spo2}`} className="border-t border-surface-200">
                <td className="py-1 pr-3">{formatDateTime(r.takenAt)}{r.familyReported ? ' (family)' : ''}</td>
                <td className="py-1 pr-3 font-semibold tabular-nums">{r.spo2} %</td>
                <td className="py-1 pr-3 tabular-nums">{r.pulse ?? '—'}</td>
                <td className="py-1">{READING_STATE_LABELS[r.state]}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </ScrollRegion>
    </div>
  );
}

/** Everything a step down rests on, on the decider's screen: each rule, the study, readings, flags and who asked. */
export function StepDownEvidencePanel({ evidence, infantId }: { evidence: StepDownEvidence; infantId: string }) {
  const unmet = evidence.checks.filter((c) => !c.met).length;
  return (
    <Card title="Evidence for this step down">
      <div className="flex flex-col gap-5">
        <section aria-labelledby="evidence-request" className="flex flex-col gap-1">
          <h3 id="evidence-request" className="font-bold text-ink-900">The request</h3>
          <Facts>
            <Fact label="Asked for by">{evidence.requestedBy?.name ?? 'Nestflow, after an overnight study on target'}</Fact>
            {evidence.label && <Fact label="Next setting">{evidence.label}</Fact>}
            {evidence.reason && <Fact label="Reason given">{evidence.reason}</Fact>}
            {evidence.overrideReason && <Fact label="Asked anyway because">{evidence.overrideReason}</Fact>}
          </Facts>
        </section>
        <section aria-labelledby="evidence-rules" className="flex flex-col gap-2">
          <h3 id="evidence-rules" className="font-bold text-ink-900">
            {unmet === 0 ? 'Programme rules: all met' : `Programme rules: ${unmet} not met`}
          </h3>
          <RuleChecks checks={evidence.checks} overridden={Boolean(evidence.overrideReason)} />
        </section>
        <section aria-labelledby="evidence-study" className="flex flex-col gap-2">
          <h3 id="evidence-study" className="font-bold text-ink-900">Latest overnight study</h3>
          {evidence.study ? <StudyEvidence study={evidence.study} /> : <p className="text-ink-700">No overnight study has been analysed.</p>}
        </section>
        <section aria-labelledby="evidence-readings" className="flex flex-col gap-2">
          <h3 id="evidence-readings" className="font-bold text-ink-900">Latest spot readings</h3>
          <ReadingsEvidence readings={evidence.readings} />
        </section>
        <section aria-labelledby="evidence-flags" className="flex flex-col gap-2">
          <h3 id="evidence-flags" className="font-bold text-ink-900">Open flags when asked</h3>
          {evidence.flags.length ? (
            <ul className="list-inside list-disc text-ink-900">{evidence.flags.map((f) => <li key={f}>{INFANT_FLAG_LABELS[f]}</li>)}</ul>
          ) : (
            <p className="text-ink-700">None.</p>
          )}
        </section>
        <Link to={`/infants/${infantId}`} className="self-start font-semibold text-brand-700 underline">Open the baby’s record</Link>
      </div>
    </Card>
  );
}
