import type { Response } from 'express';

/**
 * Sends a generated PDF as a download that is never cached. `filename` must be built from [a-z0-9-.] (a slug and a
 * date or an id), so it needs no quoting or encoding in the header.
 */
export function sendPdf(res: Response, filename: string, pdf: Buffer): void {
  res.set({
    'Content-Type': 'application/pdf',
    'Content-Disposition': `attachment; filename="${filename}"`,
    'Cache-Control': 'no-store',
    'Content-Length': String(pdf.length),
  });
  res.end(pdf);
}
