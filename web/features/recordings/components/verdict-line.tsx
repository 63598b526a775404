import type { Verdict } from './overnight-verdict';

/** Met or not met in words with a mark; the tint only repeats what the words say. */
export function VerdictLine({ verdict, compact = false }: { verdict: Verdict; compact?: boolean }) {
  const tone = !verdict.judged ? 'border-surface-300 bg-surface-50 text-ink-900' : verdict.met ? 'border-ok-200 bg-ok-50 text-ok-800' : 'border-warn-200 bg-warn-50 text-warn-800';
  const mark = !verdict.judged ? '?' : verdict.met ? '✓' : '!';
  if (compact) {
    return (
      <span className={`inline-flex items-start gap-1 rounded-md border px-2 py-0.5 text-sm font-semibold ${tone}`}>
        <span aria-hidden="true">{mark}</span>
        {verdict.text}
      </span>
    );
  }
  return (
    <div className={`rounded-xl border p-3 ${tone}`}>
      <p className="text-lg font-bold">
        <span aria-hidden="true">{mark} </span>
        {verdict.text}
      </p>
      <p className="text-sm text-ink-700">{verdict.targetText}</p>
    </div>
  );
}
