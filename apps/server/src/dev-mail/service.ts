import { z } from 'zod';
import { devMailMessageSchema, type DevMailMessage } from '@wickstone/contracts';
import { AppError } from '../errors.js';

/** What scripts/fake-smtp.mjs lists at /messages (newest first). */
const fakeListingSchema = z.object({
  items: z.array(devMailMessageSchema.extend({ html: z.string().optional() })),
});

export interface DevMailService {
  list(to: string | undefined, limit: number): Promise<DevMailMessage[]>;
}

/** Reads the local fake SMTP server's kept messages; only built when FAKE_MAIL_API_URL is configured. */
export function createDevMailService(fakeApiUrl: string): DevMailService {
  return {
    async list(to, limit) {
      const url = new URL('messages', fakeApiUrl.endsWith('/') ? fakeApiUrl : `${fakeApiUrl}/`);
      if (to) url.searchParams.set('to', to);
      let data: unknown;
      try {
        const res = await fetch(url, { signal: AbortSignal.timeout(3_000) });
        if (!res.ok) throw new Error(`HTTP ${res.status}`);
        data = await res.json();
      } catch (err) {
        throw new AppError(
          'service_unavailable',
          'The fake mailbox is not answering',
          { reason: err instanceof Error ? err.message.slice(0, 200) : 'unknown' },
          { cause: err },
        );
      }
      const parsed = fakeListingSchema.safeParse(data);
      if (!parsed.success)
        throw new AppError('service_unavailable', 'The fake mailbox answered something unexpected');
      return parsed.data.items.slice(0, limit).map(({ html: _html, ...m }) => m);
    },
  };
}
