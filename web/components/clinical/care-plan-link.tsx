/** The printable care plan is built by the server from the approved plan only; this is the URL it answers on. */
export const carePlanPdfHref = (infantId: string) => `/api/infants/${encodeURIComponent(infantId)}/care-plan.pdf`;

interface CarePlanLinkProps {
  infantId: string;
  /** Large for the family page, small beside a staff section heading. */
  size?: 'large' | 'small';
}

/**
 * A plain link, not a fetch: the browser keeps the session cookie and the server's attachment header saves the file,
 * which also works where scripts cannot open files (some phone browsers).
 */
export function CarePlanLink({ infantId, size = 'large' }: CarePlanLinkProps) {
  const classes =
    size === 'large'
      ? 'inline-flex min-h-13 items-center gap-2 rounded-xl border-2 border-brand-600 bg-surface-0 px-5 text-xl font-semibold text-brand-800 hover:bg-brand-50'
      : 'inline-flex min-h-9 items-center gap-1 rounded-lg border border-surface-300 bg-surface-0 px-3 text-sm font-semibold text-brand-700 hover:bg-surface-100';
  return (
    <a href={carePlanPdfHref(infantId)} download className={classes}>
      <span aria-hidden="true">⤓</span>
      Download care plan (PDF)
    </a>
  );
}
