import {
  INFANT_FLAG_KIND_LABELS,
  INFANT_FLAG_KINDS,
  INFANT_FLAG_LABELS,
  type InfantFlag,
  type InfantFlagKind,
} from '@shared/schemas/infants';

const TONES: Record<InfantFlagKind, string> = {
  clinical: 'border-danger-200 bg-danger-50 text-danger-800',
  admin: 'border-surface-300 bg-surface-100 text-ink-900',
};

/** A heart with a pulse line: the baby's condition. */
function ClinicalIcon() {
  return (
    <svg aria-hidden="true" viewBox="0 0 16 16" className="size-4 shrink-0" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinejoin="round">
      <path d="M8 14s-5.5-3.3-5.5-7.4A3 3 0 0 1 8 4.6a3 3 0 0 1 5.5 2c0 4.1-5.5 7.4-5.5 7.4Z" />
      <path d="M3.5 8.3h2.3l1-1.8 1.6 3.2 1-1.4h3" strokeLinecap="round" />
    </svg>
  );
}

/** A clipboard with a tick box: work waiting for someone. */
function AdminIcon() {
  return (
    <svg aria-hidden="true" viewBox="0 0 16 16" className="size-4 shrink-0" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinejoin="round">
      <rect x="3" y="2.8" width="10" height="11.7" rx="1.5" />
      <path d="M6 2.8V1.8h4v1" strokeLinecap="round" />
      <path d="M5.6 8.2l1.6 1.6 3.2-3.2" strokeLinecap="round" />
    </svg>
  );
}

/** Clinical flags before work waiting, each group in a fixed order. */
export function orderedFlags(flags: readonly InfantFlag[]): InfantFlag[] {
  const rank = (flag: InfantFlag) => (INFANT_FLAG_KINDS[flag] === 'clinical' ? 0 : 1);
  return [...flags].sort((a, b) => rank(a) - rank(b));
}

/** One flag: its kind in an icon and a word ("Clinical", "To do"), then what it is; the colour only repeats that. */
export function FlagBadge({ flag }: { flag: InfantFlag }) {
  const kind = INFANT_FLAG_KINDS[flag];
  return (
    <span className={`inline-flex flex-col rounded-md border px-2 py-0.5 text-sm leading-snug ${TONES[kind]}`}>
      <span className="inline-flex items-center gap-1 whitespace-nowrap text-xs font-bold">
        {kind === 'clinical' ? <ClinicalIcon /> : <AdminIcon />}
        {INFANT_FLAG_KIND_LABELS[kind]}
      </span>
      <span className="font-semibold">{INFANT_FLAG_LABELS[flag]}</span>
    </span>
  );
}

export function FlagList({ flags, className = 'flex flex-col items-start gap-1' }: { flags: readonly InfantFlag[]; className?: string }) {
  if (flags.length === 0) return null;
  return (
    <ul aria-label="Flags" className={className}>
      {orderedFlags(flags).map((flag) => (
        <li key={flag}><FlagBadge flag={flag} /></li>
      ))}
    </ul>
  );
}
