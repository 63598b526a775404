/**
 * A dialler link: only digits and a leading + go into the address, and an international number drops the "(0)"
 * written for callers at home. The number itself is shown as the programme wrote it.
 */
export function telHref(number: string): string {
  const trimmed = number.trim();
  const international = trimmed.startsWith('+');
  const digits = (international ? trimmed.replace('(0)', '') : trimmed).replace(/[^0-9]/g, '');
  return `tel:${international ? '+' : ''}${digits}`;
}

interface PhoneLinkProps {
  number: string;
  /** Spoken by screen readers before the number, e.g. "Call the home-care nurses on". */
  callWho: string;
  tone?: 'brand' | 'danger';
}

export function PhoneLink({ number, callWho, tone = 'brand' }: PhoneLinkProps) {
  const colours = tone === 'danger' ? 'bg-danger-600 text-white hover:bg-danger-800' : 'bg-brand-600 text-white hover:bg-brand-700';
  return (
    <a
      href={telHref(number)}
      aria-label={`${callWho} ${number}`}
      className={`inline-flex min-h-13 items-center justify-center gap-2 rounded-xl px-5 text-2xl font-bold tabular-nums ${colours}`}
    >
      <span aria-hidden="true">☎</span>
      {number}
    </a>
  );
}
