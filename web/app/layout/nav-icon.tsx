import type { NavIcon as IconName } from '../navigation';

const paths: Record<IconName, string> = {
  home: 'M4 11.5 12 5l8 6.5V20h-5v-5h-6v5H4z',
  people: 'M9 11a3.5 3.5 0 1 0 0-7 3.5 3.5 0 0 0 0 7Zm-6 9c0-3.3 2.7-6 6-6s6 2.7 6 6M16 5a3 3 0 0 1 0 6m2.5 9c0-2.4-1-4.4-2.5-5.5',
  settings: 'M4 7h10m4 0h2M4 17h4m4 0h8M14 4.5v5M8 14.5v5',
  list: 'M8 6h12M8 12h12M8 18h12M4 6h.01M4 12h.01M4 18h.01',
  add: 'M12 5v14M5 12h14',
  day: 'M12 3v2m0 14v2M5 12H3m18 0h-2M6.3 6.3 5 5m14 14-1.3-1.3M12 16a4 4 0 1 0 0-8 4 4 0 0 0 0 8Z',
  check: 'M5 12.5 10 17l9-10',
  plan: 'M7 4h10v16H7zM10 9h4m-4 4h4',
};

export function NavIcon({ name }: { name: IconName }) {
  return (
    <svg viewBox="0 0 24 24" className="size-6 shrink-0" aria-hidden="true" focusable="false">
      <path d={paths[name]} fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" strokeLinejoin="round" />
    </svg>
  );
}
