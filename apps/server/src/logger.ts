import pino, { type DestinationStream, type Logger } from 'pino';
import type { Config } from './config.js';

/**
 * `destination` is for tests that read what would be logged; the app logs to stdout, written
 * asynchronously and in blocks: lines gather until about 8 KB (a few requests' lines) or a quarter
 * of a second has passed, then go out in one write on the thread pool. Under load that is one write
 * per several requests instead of a blocking write per line, and the event loop never waits on
 * stdout (in production a pipe to whatever collects the log). What is still buffered is written
 * synchronously when the process exits (pino registers that for an asynchronous destination); a
 * process killed outright (SIGKILL) can lose the last quarter second of lines.
 */
export function createLogger(config: Pick<Config, 'logLevel'>, destination?: DestinationStream): Logger {
  return pino(
    {
      level: config.logLevel,
      // Session and CSRF tokens travel in these headers, both ways: they never reach the log.
      redact: {
        paths: [
          'req.headers.cookie',
          'req.headers.authorization',
          'req.headers["x-csrf-token"]',
          'res.headers["set-cookie"]',
        ],
        remove: true,
      },
    },
    destination ?? pino.destination({ dest: 1, sync: false, minLength: 8192, periodicFlush: 250 }),
  );
}
