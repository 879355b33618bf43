import type { Response } from 'express';
import type { Sheet } from './service.js';

/** A sheet as a download: never cached, named by its run. */
export function sendSheet(res: Response, sheet: Sheet): void {
  res.set({
    'Content-Type': 'application/pdf',
    'Content-Disposition': `attachment; filename="${sheet.filename}"`,
    'Cache-Control': 'no-store',
    'X-Content-Type-Options': 'nosniff',
  });
  res.send(sheet.pdf);
}
