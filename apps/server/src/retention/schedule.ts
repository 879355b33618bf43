import type { Logger } from 'pino';
import type { RetentionService } from './service.js';

export interface RetentionSchedule {
  stop(): void;
}

/**
 * Purge by every organisation's retention setting shortly after start and then every
 * `intervalMs` (a day), so a server restarted more often than daily still purges. One purge at a
 * time; a failure is logged and the next one tries again. Timers are unref'd: they never keep the
 * process alive on their own.
 */
export function startRetentionSchedule(
  retention: RetentionService,
  logger: Logger,
  opts: { intervalMs: number; firstDelayMs: number },
): RetentionSchedule {
  let running = false;
  let stopped = false;
  const purge = async () => {
    if (running || stopped) return;
    running = true;
    try {
      const result = await retention.purgeAll();
      logger.info({ retention: result }, 'retention purge done');
    } catch (err) {
      logger.error({ err }, 'retention purge failed');
    } finally {
      running = false;
    }
  };
  const first = setTimeout(() => void purge(), opts.firstDelayMs);
  const every = setInterval(() => void purge(), opts.intervalMs);
  first.unref();
  every.unref();
  return {
    stop() {
      stopped = true;
      clearTimeout(first);
      clearInterval(every);
    },
  };
}
