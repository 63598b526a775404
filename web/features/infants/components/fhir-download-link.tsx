import { fhirExportFileName } from '@shared/fhir/infant-bundle';

export const fhirExportHref = (infantId: string) => `/api/infants/${encodeURIComponent(infantId)}/fhir`;

/**
 * A plain link with `download`, like the care plan: the browser sends the session cookie and saves the Bundle under
 * the baby's Nestflow id, so a downloads folder never shows a baby's name.
 */
export function FhirDownloadLink({ infantId }: { infantId: string }) {
  return (
    <a
      href={fhirExportHref(infantId)}
      download={fhirExportFileName(infantId)}
      className="inline-flex min-h-9 items-center gap-1 rounded-lg border border-surface-300 bg-surface-0 px-3 text-sm font-semibold text-brand-700 hover:bg-surface-100"
    >
      <span aria-hidden="true">⤓</span>
      Download as FHIR
    </a>
  );
}
