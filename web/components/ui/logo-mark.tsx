/** Nestflow's mark: an egg resting in a woven nest, with a wisp of air above it. */
export function LogoMark({ className = 'size-9' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true" focusable="false">
      <rect width="32" height="32" rx="9" className="fill-brand-600" />
      <path d="M6 17c0 5.5 4.5 9 10 9s10-3.5 10-9" fill="none" strokeWidth="2.6" strokeLinecap="round" className="stroke-straw-300" />
      <path d="M9.5 19.5c1.8 2 4 3 6.5 3s4.7-1 6.5-3" fill="none" strokeWidth="2" strokeLinecap="round" className="stroke-straw-300" />
      <ellipse cx="16" cy="13" rx="4.2" ry="5.2" className="fill-white" />
      <path d="M21.5 7.5c1.5-1.2 3.3-1.5 4.5-1" fill="none" strokeWidth="1.8" strokeLinecap="round" className="stroke-brand-200" />
    </svg>
  );
}
