import type { RuleCheckDto } from '@shared/schemas/step-downs';

const RULE_NAMES: Record<RuleCheckDto['code'], string> = {
  time_on_setting: 'Time on the current setting',
  study_judged: 'A recent overnight study long enough to judge',
  study_on_target: 'Overnight study on target',
  no_open_flags: 'No open low-SpO2 or overdue-check flag',
  readings_in_range: 'Recent spot readings in range',
  weight_not_falling: 'Weight not falling',
};

/**
 * Each programme rule with its state in words and a mark; colour only repeats the words. A rule not met on a request
 * that went ahead with a recorded reason reads "Not met — asked anyway".
 */
export function RuleChecks({ checks, overridden = false }: { checks: readonly RuleCheckDto[]; overridden?: boolean }) {
  return (
    <ul aria-label="Step-down rules" className="flex flex-col gap-2">
      {checks.map((c) => (
        <li key={c.code} className={`flex gap-3 rounded-lg border p-3 ${c.met ? 'border-ok-200 bg-ok-50' : 'border-warn-200 bg-warn-50'}`}>
          <span aria-hidden="true" className={`mt-0.5 font-bold ${c.met ? 'text-ok-800' : 'text-warn-800'}`}>{c.met ? '✓' : '✗'}</span>
          <span className="flex flex-col">
            <span className="font-semibold text-ink-900">
              {RULE_NAMES[c.code]}:{' '}
              <span className={c.met ? 'text-ok-800' : 'text-warn-800'}>{c.met ? 'met' : overridden ? 'not met — asked anyway' : 'not met'}</span>
            </span>
            <span className="text-sm text-ink-700">{c.message}</span>
          </span>
        </li>
      ))}
    </ul>
  );
}
