import type { PolicySettings } from '@shared/schemas/policy';
import type { RecordingSummary as Summary } from '@shared/schemas/recordings';
import { Alert } from '../../../components/ui/alert';
import { Card } from '../../../components/ui/card';
import { Spinner } from '../../../components/ui/spinner';
import { overnightVerdict } from './overnight-verdict';
import { summaryFigures } from './recording-format';
import { VerdictLine } from './verdict-line';

interface RecordingSummaryProps {
  summary: Summary;
  targets: { settings: PolicySettings; policyVersion: number } | undefined;
  targetsProblem?: string;
  pulmonaryHypertension: boolean;
}

export function RecordingSummaryCard({ summary, targets, targetsProblem, pulmonaryHypertension }: RecordingSummaryProps) {
  const verdict = targets ? overnightVerdict(summary, targets.settings, pulmonaryHypertension) : null;
  return (
    <Card title="Summary">
      <div className="flex flex-col gap-4">
        {verdict ? (
          <div className="flex flex-col gap-1">
            <VerdictLine verdict={verdict} />
            <p className="text-xs text-ink-500">Programme policy version {targets?.policyVersion}</p>
          </div>
        ) : targetsProblem ? (
          <Alert tone="warn">The overnight target could not be read: {targetsProblem}</Alert>
        ) : (
          <Spinner label="Reading the programme’s target" />
        )}
        <dl className="grid grid-cols-2 gap-x-4 gap-y-3 sm:grid-cols-3">
          {summaryFigures(summary).map((figure) => (
            <div key={figure.label} className="flex flex-col">
              <dt className="text-sm text-ink-500">{figure.label}</dt>
              <dd className="text-lg font-bold tabular-nums text-ink-900">{figure.value}</dd>
            </div>
          ))}
        </dl>
        <p className="text-xs text-ink-500">
          Percentages are of valid time. ODI3 and ODI4: falls in SpO2 of 3 or 4 points or more, per hour of valid time.
        </p>
      </div>
    </Card>
  );
}
