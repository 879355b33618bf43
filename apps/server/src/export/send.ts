import { once } from 'node:events';
import type { Response } from 'express';

/** Wait for the first of these events, and leave no listener behind for the others. */
async function either(res: Response, events: string[]): Promise<void> {
  const ac = new AbortController();
  try {
    await Promise.race(events.map((e) => once(res, e, { signal: ac.signal })));
  } finally {
    ac.abort();
  }
}

/**
 * Stream a CSV download to the client chunk by chunk, waiting whenever the socket's buffer is full,
 * and stopping (so the database is no longer read) when the client goes away. A failure before the
 * first chunk still answers with the API's error shape; after it, the download is cut short.
 * The route's handler awaits this and answers nothing more: the response has been sent.
 */
export async function sendCsv(res: Response, filename: string, chunks: AsyncIterable<string>): Promise<void> {
  let gone = false;
  res.once('close', () => {
    gone = true;
  });
  try {
    for await (const chunk of chunks) {
      if (gone) break;
      if (!res.headersSent) {
        res.status(200).set({
          'Content-Type': 'text/csv; charset=utf-8; header=present',
          'Content-Disposition': `attachment; filename="${filename.replace(/[^A-Za-z0-9._-]/g, '_')}"`,
          'X-Content-Type-Options': 'nosniff',
        });
      }
      if (!res.write(chunk)) await either(res, ['drain', 'close']);
    }
  } catch (e) {
    if (res.headersSent) res.destroy();
    throw e;
  }
  if (!gone) {
    res.end();
    await either(res, ['finish', 'close']);
  }
}
