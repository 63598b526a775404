import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { PRESCRIPTION_REASON_LABELS, PRESCRIPTION_STATUS_LABELS, type Prescription } from '@shared/schemas/prescriptions';
import { Card } from '../../../components/ui/card';
import { formatDateTime } from '../../../lib/format';
import { readEvidence, STEP_REASONS, type StepEvidence } from './step-evidence';

function Row({ label, children }: { label: string; children: ReactNode }) {
  return (
    <>
      <dt className="text-ink-500">{label}</dt>
      <dd className="text-ink-900">{children}</dd>
    </>
  );
}

const hm = (minutes: number) => `${Math.floor(Math.round(minutes) / 60)}:${String(Math.round(minutes) % 60).padStart(2, '0')}`;

function StudyRows({ evidence }: { evidence: StepEvidence }) {
  if (evidence.recordingId === undefined && evidence.meanSpo2 === undefined) return null;
  const figures = [
    evidence.meanSpo2 != null && `mean SpO2 ${evidence.meanSpo2.toFixed(1)} %`,
    evidence.pctBelow90 != null && `${evidence.pctBelow90.toFixed(1)} % of valid time below 90 %`,
    evidence.validMinutes !== undefined && `valid time ${hm(evidence.validMinutes)} h`,
  ].filter(Boolean);
  return (
    <>
      <Row label="Overnight study">
        {figures.join(' · ') || '—'}
        {evidence.recordingId && (
          <> · <Link to={`/recordings/${evidence.recordingId}`} className="font-semibold text-brand-700 underline">open the recording</Link></>
        )}
      </Row>
      {evidence.targetMet !== undefined && (
        <Row label="Overnight target">
          <span className="font-semibold">
            {evidence.targetMet ? 'Met' : `Not met${evidence.shortfalls?.length ? `: ${evidence.shortfalls.join('; ')}` : ''}`}
          </span>
        </Row>
      )}
    </>
  );
}

function EvidenceItem({ rx }: { rx: Prescription }) {
  const evidence = readEvidence(rx.evidence);
  return (
    <li className="flex flex-col gap-2 rounded-xl border border-surface-200 p-3">
      <p className="font-bold text-ink-900">
        Version {rx.version}: {PRESCRIPTION_REASON_LABELS[rx.reason]}{' '}
        <span className="font-normal text-ink-700">· {PRESCRIPTION_STATUS_LABELS[rx.status]} · asked for {formatDateTime(rx.createdAt)}</span>
      </p>
      {evidence ? (
        <dl className="grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[10rem_1fr]">
          {evidence.label && <Row label="Next setting">{evidence.label}</Row>}
          {(evidence.reason ?? evidence.requestReason) && <Row label="Reason given">{evidence.reason ?? evidence.requestReason}</Row>}
          {evidence.checks && (
            <Row label="Programme rules">
              {evidence.checks.every((c) => c.met) ? 'All met' : `${evidence.checks.filter((c) => !c.met).length} not met`}
            </Row>
          )}
          {evidence.overrideReason && <Row label="Asked anyway because">{evidence.overrideReason}</Row>}
          {evidence.observedDays !== undefined && <Row label="Days off oxygen">{evidence.observedDays}</Row>}
          <StudyRows evidence={evidence} />
        </dl>
      ) : (
        <p className="text-sm text-ink-700">No evidence recorded with this version.</p>
      )}
    </li>
  );
}

/** What each step down, step back up or discharge proposal rests on, beside the versions list. */
export function StepEvidenceSection({ versions }: { versions: readonly Prescription[] }) {
  const steps = versions.filter((rx) => (STEP_REASONS as readonly string[]).includes(rx.reason));
  if (steps.length === 0) return null;
  return (
    <Card title="Step evidence">
      <ol className="flex flex-col gap-3">
        {steps.map((rx) => (
          <EvidenceItem key={rx.id} rx={rx} />
        ))}
      </ol>
    </Card>
  );
}
