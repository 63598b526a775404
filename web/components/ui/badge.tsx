import type { ReactNode } from 'react';

type Tone = 'ok' | 'muted' | 'warn' | 'danger' | 'brand';

const tones: Record<Tone, string> = {
  ok: 'border-ok-200 bg-ok-50 text-ok-800',
  muted: 'border-surface-300 bg-surface-100 text-ink-700',
  warn: 'border-warn-200 bg-warn-50 text-warn-800',
  danger: 'border-danger-200 bg-danger-50 text-danger-800',
  brand: 'border-brand-200 bg-brand-50 text-brand-800',
};

/** Always carries a word: the colour only reinforces it. */
export function Badge({ tone = 'muted', children }: { tone?: Tone; children: ReactNode }) {
  return (
    <span className={`inline-flex items-center rounded-full border px-2.5 py-0.5 text-sm font-semibold ${tones[tone]}`}>
      {children}
    </span>
  );
}
