import { usePhoneText } from '../../../lib/phone-text';

/**
 * A dialler link: only digits and a leading + go into the address, and an international number drops the "(0)"
 * written for callers at home. The number is shown in the national form of the programme's country.
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

export function PhoneLink({ number: stored, callWho, tone = 'brand' }: PhoneLinkProps) {
  const number = usePhoneText()(stored);
  const colours = tone === 'danger' ? 'bg-danger-600 text-white hover:bg-danger-800' : 'bg-brand-600 text-white hover:bg-brand-700';
  return (
    <a
      href={telHref(stored)}
      aria-label={`${callWho} ${number}`}
      className={`inline-flex min-h-13 max-w-full items-center justify-center gap-2 rounded-xl px-3 text-[clamp(1.0625rem,5.2vw,1.5rem)] font-bold tabular-nums sm:px-5 ${colours}`}
    >
      <span aria-hidden="true">☎</span>
      {/* One line, sized to the screen: a number broken across lines is easy to misread or misdial. */}
      <span className="whitespace-nowrap">{number}</span>
    </a>
  );
}
